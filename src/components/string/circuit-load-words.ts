// Words for the circuit card on the string page: each verdict as an icon name, a word and a tone,
// never colour alone.
import type { CircuitLoad } from '../../api/strings'
import { iconDanger, iconDone, iconWarning } from '../../icons'

type Result = NonNullable<CircuitLoad['result']>
export interface Verdict {
  icon: string
  word: string
  tone: 'ok' | 'warn' | 'bad' | 'muted'
}

export function runningVerdict(r: Result): Verdict {
  if (r.overload) return { icon: iconDanger, word: 'Over the breaker rating: will trip', tone: 'bad' }
  if (!r.runningOk) return { icon: iconWarning, word: 'Over the 80 % continuous limit', tone: 'warn' }
  return { icon: iconDone, word: 'Within the continuous limit', tone: 'ok' }
}

export function surgeVerdict(r: Result): Verdict {
  const surge =
    r.peakAmps < r.instantaneousBand.lowAmps
      ? 'safe'
      : r.peakAmps < r.instantaneousBand.highAmps
        ? 'may'
        : 'will'
  if (surge === 'safe') return { icon: iconDone, word: 'Below the instant-trip band', tone: 'ok' }
  if (surge === 'may') return { icon: iconWarning, word: 'May trip at switch-on', tone: 'warn' }
  return { icon: iconDanger, word: 'Will trip at switch-on', tone: 'bad' }
}

export function rcdLine(rcd: NonNullable<Result['rcd']>, ratedMa: number | null): string {
  const type = rcd.rcdType === 'S' ? 'time-delayed (type S)' : 'general type'
  return `${ratedMa === null ? '' : `${ratedMa} mA, `}${type}; ${
    rcd.additionalProtection ? 'gives additional protection' : 'no additional protection'
  }`
}

export function leakageVerdict(rcd: NonNullable<Result['rcd']>): Verdict {
  const limit = `limit ${round(rcd.leakageLimitMilliamps)} mA`
  if (rcd.leakageMilliamps === null)
    return { icon: iconWarning, word: `Not measured (${limit})`, tone: 'muted' }
  const measured = `${round(rcd.leakageMilliamps)} mA`
  if (rcd.risk === 'may trip') return { icon: iconDanger, word: `${measured}: may trip the RCD`, tone: 'bad' }
  if (rcd.risk === 'high') return { icon: iconWarning, word: `${measured}: over the ${limit}`, tone: 'warn' }
  return { icon: iconDone, word: `${measured}, within the ${limit}`, tone: 'ok' }
}

const round = (n: number) => String(Math.round(n * 10) / 10)
