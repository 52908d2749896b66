import type { Config } from '../config'
import type { MailMessage } from './mailer'
import type { CrewRun } from '../../shared/schemas/runs'
import { baseUrl } from './templates'
import { formatDay } from '../../shared/local-time'

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)
const mapsLink = (lat: number, lng: number) => `geo:${lat},${lng}`

/** The route sheet a crew member receives when a run is published or changed. */
export function runMail(
  config: Config,
  to: { name: string; email: string },
  run: CrewRun,
  changed: boolean,
): MailMessage {
  // The day in words in the app's locale; the shift's times are the crew's local clock (APP_TIME_ZONE).
  const day = formatDay(run.date, config.APP_LOCALE)
  const shift = `${run.shiftStart}–${run.shiftEnd}${run.shiftEnd < run.shiftStart ? ' (ends after midnight)' : ''}`
  const title = `${changed ? 'Changed: ' : ''}${run.crewName} run for ${day} (${run.stops.length} stops)`
  const lines = run.stops.map(
    (s, i) =>
      `${i + 1}. ${s.arrive}–${s.depart}  ${s.assetTag ?? ''} ${s.summary}${s.siteName ? ` (${s.siteName})` : ''}  ${mapsLink(s.lat, s.lng)}`,
  )
  const link = `${baseUrl(config)}/run?date=${run.date}`
  const text = [
    `Hello ${to.name},`,
    '',
    changed ? 'Your run has changed since it was published.' : 'Your run has been published.',
    '',
    `${day}: shift ${shift} from ${run.depot.name}${run.platform ? `, platform ${run.platform}` : ''}.`,
    '',
    ...lines,
    '',
    `Back at the depot about ${run.returnAt}.`,
    `Open it in Lampwright: ${link}`,
    '',
    'Isolate before relamping: lamp sockets on a series string can be live at full supply voltage.',
  ].join('\n')
  const rows = run.stops
    .map(
      (s, i) =>
        `<tr><td>${i + 1}</td><td>${esc(s.arrive)}–${esc(s.depart)}</td><td>${esc(s.assetTag ?? '')}</td><td>${esc(s.summary)}</td><td>${esc(s.siteName ?? '')}</td></tr>`,
    )
    .join('')
  const html = `<p>Hello ${esc(to.name)},</p><p>${changed ? 'Your run has <b>changed</b> since it was published.' : 'Your run has been published.'}</p>
<p>${esc(day)}: shift ${esc(shift)} from ${esc(run.depot.name)}${run.platform ? `, platform ${esc(run.platform)}` : ''}.</p>
<table border="1" cellpadding="4" cellspacing="0"><tr><th>#</th><th>Time</th><th>Tag</th><th>Work</th><th>Where</th></tr>${rows}</table>
<p>Back at the depot about ${esc(run.returnAt)}. <a href="${esc(link)}">Open the run in Lampwright</a>.</p>
<p><b>Isolate before relamping:</b> lamp sockets on a series string can be live at full supply voltage.</p>`
  return { to: to.email, subject: title, text, html, topic: changed ? 'run_changed' : 'run_published' }
}
