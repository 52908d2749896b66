// The queue's priority score: three visible parts that add up to at most 100.
//   risk (0–50): what happens if nobody goes — dark, over-stressed, forecast, hazard;
//   importance (0–25): the site's importance to the client (1–5);
//   clock (0–25): how much of the contract response time is used up.
// The weights are our own judgement (common practice, no source).
import { DEFAULT_REPLACE_AT_RATIO } from '../../../shared/engine/defaults'

interface Row {
  kind: string
  severity: string
  dueBy: Date | string
  openedAt: Date | string
  maxRatio?: number | null
  /** The string type's own replace-now limit (lamp voltage over rated). */
  replaceAtRatio?: number | null
  /** Which rule set replace now: 'ratio' (the lamps' voltage) or 'risk' (the forecast). */
  replaceRule?: string | null
  /** The risk rule's words, e.g. "forecast: 27 % chance of going dark before the next patrol on 4 Dec". */
  riskNote?: string | null
  hazard?: number | boolean | null
  importance?: number | null
  summary: string
  /** `kind:subject` while open (queue/items.ts). */
  openKey?: string | null
}

const clamp = (x: number, lo = 0, hi = 1) => Math.min(hi, Math.max(lo, x))

export function scoreItem(r: Row, now: Date) {
  const due = new Date(r.dueBy).getTime()
  const opened = new Date(r.openedAt).getTime()
  const hoursLeft = Math.round(((due - now.getTime()) / 3_600_000) * 10) / 10
  const why: string[] = []
  let risk: number
  switch (r.kind) {
    case 'dark':
      risk = 45
      why.push('String is dark')
      break
    case 'replace_now': {
      if (r.replaceRule === 'risk') {
        // Likely dark before anyone is due to pass: between a string over its limit and a dark one.
        risk = 35
        why.push(
          r.riskNote ? r.riskNote.replace(/^forecast:/, 'Forecast:') : 'Forecast: likely to go dark soon',
        )
        break
      }
      // Past the type's own limit, risk grows until the lamps run 10 points of rating over it.
      const limit = r.replaceAtRatio ?? DEFAULT_REPLACE_AT_RATIO
      const ratio = r.maxRatio ?? limit
      risk = 30 + 15 * clamp((ratio - limit) / 0.1)
      why.push(`Lamps at ${Math.round(ratio * 100)} % of rated voltage`)
      break
    }
    case 'forecast_dark':
      risk = 30
      why.push('Forecast to go dark within 3 nights')
      break
    case 'public_report':
      risk = r.hazard ? 50 : 25
      why.push(r.hazard ? 'Reported hazard' : 'Reported by the public')
      break
    case 'rcd_failed':
      risk = 50
      why.push('RCD failed its test: no additional protection')
      break
    case 'installation':
    case 'take_down':
      // Planned season work: it waits behind faults until its window runs short (the clock part).
      risk = 20
      why.push(
        r.kind === 'installation'
          ? "Season work: install within the client's window"
          : "Season work: take down within the client's window",
      )
      break
    default:
      // A failed test or examination (queue/certificates.ts opens it as `certificate_due:failed:…`).
      if (r.openKey?.startsWith('certificate_due:failed:')) {
        risk = r.severity === 'emergency' ? 50 : 40
        why.push('Failed its test or examination: do not rely on it until a new test passes')
        break
      }
      risk = hoursLeft < 0 ? 35 : 15
      why.push(hoursLeft < 0 ? 'Certificate overdue' : 'Certificate falls due soon')
  }
  const importance = 5 * clamp(r.importance ?? 3, 1, 5)
  if ((r.importance ?? 0) >= 4) why.push('Important site')
  const window = Math.max(1, due - opened)
  const clock = 25 * clamp((now.getTime() - opened) / window)
  if (hoursLeft < 0) why.push(`Overdue by ${Math.abs(Math.round(hoursLeft))} h`)
  else if (hoursLeft < 12) why.push(`${Math.round(hoursLeft)} h left on the clock`)
  const parts = { risk: Math.round(risk * 10) / 10, importance, clock: Math.round(clock * 10) / 10 }
  return { score: Math.round((parts.risk + parts.importance + parts.clock) * 10) / 10, parts, why, hoursLeft }
}
