import type { Config } from '../config'
import type { MailMessage } from './mailer'
import type { CrewRun } from '../../shared/schemas/runs'
import { renderMail } from './templates'
import { publicLink } from '../public-url'
import { formatDay } from '../../shared/local-time'

const mapsLink = (lat: number, lng: number) => `geo:${lat},${lng}`

/** The route sheet a crew member receives when a run is published or changed; the run's date leads the subject. */
export function runMail(
  config: Config,
  to: { name: string; email: string },
  run: CrewRun,
  changed: boolean,
): MailMessage {
  // The run's calendar day in words (a date, not an instant: no zone to convert); the shift's times
  // are the crew's local clock (APP_TIME_ZONE).
  const day = formatDay(run.date, config.APP_LOCALE)
  const shift = `${run.shiftStart}–${run.shiftEnd}${run.shiftEnd < run.shiftStart ? ' (ends after midnight)' : ''}`
  const subject = `${changed ? 'Changed: ' : ''}${run.crewName} run for ${day} (${run.stops.length} stops)`
  const parts = renderMail(config, 'run', subject, {
    name: to.name,
    changed,
    day,
    shift,
    depot: run.depot.name,
    platform: run.platform ?? null,
    returnAt: run.returnAt,
    link: publicLink(config, '/run', { date: run.date }),
    stops: run.stops.map((s) => ({
      arrive: s.arrive,
      depart: s.depart,
      tag: s.assetTag ?? '',
      summary: s.summary,
      site: s.siteName ?? '',
      map: mapsLink(s.lat, s.lng),
    })),
  })
  return { to: to.email, ...parts, topic: changed ? 'run_changed' : 'run_published' }
}
