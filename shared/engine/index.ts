// The string engine: pure computations shared by the client (instant preview, offline) and the
// server (authoritative). See README.md for sources and defaults.
export * from './defaults'
export * from './lamp-laws'
export * from './string-condition'
export { assess } from './assess'
export { darkWhere, lifePhrase, percent, stressReasons } from './reasons'
export { faultReasons } from './fault-reasons'
export { assessLed, isLed, ledRun, type LedRun } from './led'
export { ISOLATION_CAUTION, liveSocketCodes, reasonCodes, type Reason, type ReasonCode } from './reason-codes'
export { addExposure, forecast } from './forecast'
export { expectedTimeToKthFailure, varianceTimeToKthFailure } from './cascade'
export { burningHoursToDate, burningHoursToDates } from './calendar'
export {
  createRandom,
  maxOfUnitExponentials,
  next32,
  nextExponential,
  nextUniform,
  randomState,
  uniformOf,
  unitExponential,
  type Random,
  type RandomState,
} from './random'
export { TUNGSTEN_RESISTIVITY, filamentTemperature, resistanceRatio } from './tungsten'
export { coldResistance, estimateShorted } from './diagnostics'
export { stringLoad, type StringLoad } from './string-load'
export { INSTANTANEOUS_BANDS, assessCircuit, staggerGroups, switchOnVerdict } from './circuit'
export { energyUse, type EnergyUse } from './energy'
