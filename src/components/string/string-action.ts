// What a crew must do at a string, and the three numbers that matter on site: lamps out now, the
// chance of going dark before anyone is back, and the lamps to carry. The engine's working behind
// them is on the same page, folded under "How this is worked out".
// Trade-reference §2: every shorted lamp raises the stress on the rest, so all lamps out are replaced
// at once; a failed fuse lamp, a lamp failed open or out of its socket, or no supply puts a series
// string out.
import type { StringDetail } from '../../api/strings'
import { lampsOutWords } from '../common/lamps-out-words'
import { lampTotal } from '../../../shared/visit-rules'
import { formatDate } from '../../dates'
import { chanceText, num, plural } from './string-format'

export interface ActionNumber {
  label: string
  value: string
  note: string
  testid: string
}

/** The sentence a crew member reads first. */
export function actionText(s: StringDetail): string {
  const out = s.lampsOut
  if (s.isolated)
    return 'Made safe: isolated and locked off. Repair it, then remove the lock, re-energise, check it lights and test the RCD.'
  if (s.status === 'dark')
    return s.fuseFailed
      ? `Isolate, replace the fuse lamp${out ? ` and the ${plural(out, 'lamp')} out` : ''}, then re-energise.`
      : 'Find why it is dark: check the supply first, then the fuse lamp and any lamp failed open. Isolate before touching a socket.'
  if (s.status === 'replace') return `Replace the ${plural(out, 'lamp')} out now: the rest are over-stressed.`
  if (s.status === 'watch')
    return `${plural(out, 'lamp')} out, below the replace-now limit. Replace ${out === 1 ? 'it' : 'them'} while you are here if you can: each one out shortens the others' life.`
  return 'Nothing to do: every lamp is lit.'
}

/** Lamps to carry: one of each rating for every lamp out, and the fuse lamp when it has failed. */
export function lampsToCarry(s: StringDetail): { value: string; note: string } {
  const shunted = s.type.classes.find((k) => k.shunted) ?? s.type.classes[0]
  const fuse = s.type.classes.find((k) => !k.shunted && k !== shunted)
  const rating = (k: { ratedVolts: number; ratedAmps: number }) =>
    `${num(k.ratedVolts, 1)} V ${num(k.ratedAmps, 3)} A`
  const parts: string[] = []
  if (s.lampsOut && shunted) parts.push(`${s.lampsOut} × ${rating(shunted)}`)
  const fuseNeeded = s.fuseFailed || (s.status === 'dark' && !!fuse)
  if (fuseNeeded && fuse) parts.push(`1 fuse lamp (${rating(fuse)})`)
  const n = s.lampsOut + (fuseNeeded && fuse ? 1 : 0)
  if (!n) return { value: '0', note: 'None needed for what is recorded.' }
  const unsure = s.status === 'dark' && !s.fuseFailed ? ' Take a spare for a lamp failed open.' : ''
  return { value: String(n), note: `${parts.join(' and ')}.${unsure}` }
}

/** The three numbers, each with the line that says where it comes from. */
export function actionNumbers(s: StringDetail): ActionNumber[] {
  const o = s.outlook
  const perNight = s.schedule.burnHoursPerDay
  // The forecast's 72-burning-hour chance: the same horizon the queue opens a "may go dark" item on,
  // read from the same forecast the queue judges by while it still fits the string.
  const nights = perNight > 0 ? Math.round(72 / perNight) : null
  const darkDate = o.darkDate
  const risk =
    s.status === 'dark' || s.isolated
      ? { value: '—', note: s.isolated ? 'Made safe: switched off.' : 'It is dark now.' }
      : s.riskNote
        ? { value: s.riskNote.match(/\d+\s?%/)?.[0] ?? '—', note: sentence(s.riskNote) }
        : o.pDark72 !== null
          ? {
              value: chanceText(o.pDark72),
              note:
                `Within ${nights ? `about ${plural(nights, 'night')} (72 burning hours)` : '72 burning hours'}` +
                (darkDate ? `; most likely dark around ${formatDate(darkDate, 'dayMonth')}.` : '.'),
            }
          : { value: '—', note: 'No forecast for this string.' }
  const carry = lampsToCarry(s)
  return [
    {
      label: 'Lamps out now',
      value: String(s.lampsOut),
      note:
        s.status === 'dark'
          ? lampsOutWords({ status: s.status, lampsOut: s.lampsOut, fuseFailed: s.fuseFailed })
          : `Of ${lampTotal(s.type)} lamps${s.fuseFailed ? '; the fuse lamp has failed' : ''}.` +
            (s.type.wiring === 'series' ? ' Each one out puts more voltage on the rest.' : ''),
      testid: 'number-out',
    },
    { label: 'Chance of going dark', ...risk, testid: 'number-risk' },
    { label: 'Lamps to carry', ...carry, testid: 'number-carry' },
  ]
}

const sentence = (t: string) => `${t.charAt(0).toUpperCase()}${t.slice(1)}.`
