// Reasons for faults that open a chain (a socket can be live) and for chains whose lamps all failed.
import type { LampClassInput } from '../schemas/engine'
import { ISOLATION_CAUTION, type Reason } from './reason-codes'
import { darkWhere, lamps } from './reasons'
import type { StringCondition, Wiring } from './string-condition'

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0)

/** The isolation-caution reasons of faults that leave a socket live, and an all-failed chain. */
export function faultReasons(lampsIn: LampClassInput[], cond: StringCondition, wiring: Wiring): Reason[] {
  const out: Reason[] = []
  const where = darkWhere(cond)
  const fuse = sum(
    lampsIn.map((c) => (c.shunted === false ? Math.min(c.failed ?? 0, c.count * cond.branches) : 0)),
  )
  const opened = sum(lampsIn.map((c) => c.opened ?? 0))
  const removed = sum(lampsIn.map((c) => c.removed ?? 0))
  if (wiring === 'series' && cond.fuseFailed) {
    const verb = fuse === 1 ? 'has' : 'have'
    out.push({
      code: 'fuse_lamp_failed',
      text:
        `${lamps(fuse)} without a shunt (fuse lamp) ${verb} failed open: ${where}. Replace it and every ` +
        `shorted lamp before switching on again. ${ISOLATION_CAUTION}`,
    })
  }
  if (wiring === 'series' && opened > 0)
    out.push({
      code: 'chain_open',
      text:
        `${lamps(opened)} failed without shorting (the shunt stayed open): ${where}. Find and replace ` +
        `${opened === 1 ? 'it' : 'them'}. ${ISOLATION_CAUTION}`,
    })
  if (removed > 0) {
    const sockets = removed === 1 ? 'its socket' : 'their sockets'
    const effect = wiring === 'series' ? where : 'the rest stay lit, but an empty socket is live'
    out.push({
      code: 'lamp_removed',
      text: `${lamps(removed)} missing from ${sockets}: ${effect}. Fit lamps of the same rating. ${ISOLATION_CAUTION}`,
    })
  }
  if (cond.chains.some((c) => c.causes.includes('all_failed'))) {
    const total = sum(lampsIn.map((c) => c.count)) * cond.branches
    out.push({
      code: 'all_failed',
      text:
        cond.dark && out.length === 0
          ? `All ${total} lamps have failed: the string is dark.`
          : `Every lamp in a chain has failed: ${where}.`,
    })
  }
  return out
}
