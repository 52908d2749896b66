// Meter diagnostics: what a clamp-meter reading (lit) and a cold-resistance reading (isolated) say.
export { estimateShorted } from './diagnostics-clamp'
export { coldResistance } from './diagnostics-cold'
