// How many lamps are out, in words beside a state mark. A dark string is never "no lamps out": it
// is dark because its chain is open, so the words say where to look (trade-reference §2: a failed
// fuse lamp, a lamp failed open or out of its socket, or no supply puts the whole string out).
import type { StringState } from './string-state'

export interface LampsOutFacts {
  status: StringState
  lampsOut: number
  /** Known on the string page; the map's compact answer does not carry it. */
  fuseFailed?: boolean
}

const count = (n: number) => (n === 1 ? '1 lamp out' : `${n} lamps out`)

export function lampsOutWords(s: LampsOutFacts): string {
  if (s.status === 'dark') {
    if (s.fuseFailed) return s.lampsOut ? `Fuse lamp failed, ${count(s.lampsOut)}` : 'Fuse lamp failed'
    if (s.lampsOut === 0) return 'No lamp reported out: check the supply and the fuse lamp'
    return `${count(s.lampsOut)}: check the fuse lamp, a lamp failed open and the supply`
  }
  return s.lampsOut === 0 ? 'No lamps out' : count(s.lampsOut)
}
