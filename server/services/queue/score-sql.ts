// The queue's priority score (score.ts) as a MariaDB expression, so the list is sorted and paged in
// SQL instead of scoring every open item in Node for each page. score.ts stays the rule the item
// shows (its parts and words); this expression follows it term by term and
// tests/server/queue-page.test.ts checks that the two put the demo queue in the same order.
// Needs the aliases of listQueue's query: q (queue_items), st (string_types), si (sites), r (reports), s (strings).
import type { Knex } from 'knex'
import type { Db } from '../../db'
import { DEFAULT_REPLACE_AT_RATIO } from '../../../shared/engine/defaults'

const clamp01 = (x: string) => `least(1, greatest(0, ${x}))`

/** Seconds from a to b (DATETIME columns hold UTC; `?` is the request's instant, sent as UTC). */
const seconds = (a: string, b: string) => `timestampdiff(microsecond, ${a}, ${b}) / 1000000`

/** The score expression with its bindings (now, twice). */
export function scoreSql(db: Db, now: Date): Knex.Raw {
  const hoursLeft = `round(${seconds('?', 'q.due_by')} / 3600, 1)`
  const limit = `coalesce(st.replace_at_ratio, ${DEFAULT_REPLACE_AT_RATIO})`
  const risk = `case q.kind
    when 'dark' then 45
    when 'replace_now' then case when s.replace_rule = 'risk' then 35
      else 30 + 15 * ${clamp01(`(coalesce(s.max_ratio, ${limit}) - ${limit}) / 0.1`)} end
    when 'forecast_dark' then 30
    when 'public_report' then case when r.hazard then 50 else 25 end
    when 'rcd_failed' then 50
    when 'installation' then 20
    when 'take_down' then 20
    else case when q.open_key like 'certificate\\_due:failed:%'
        then case when q.severity = 'emergency' then 50 else 40 end
      when ${hoursLeft} < 0 then 35 else 15 end end`
  const importance = `5 * least(5, greatest(1, coalesce(si.importance, 3)))`
  const clock = `25 * ${clamp01(`${seconds('q.opened_at', '?')} / greatest(0.001, ${seconds('q.opened_at', 'q.due_by')})`)}`
  return db.raw(`round(${risk}, 1) + ${importance} + round(${clock}, 1)`, [now, now])
}
