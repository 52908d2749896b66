// The run page's title follows the day it shows: crews say "tonight's run", so a run for another
// day must not wear that title.
import { addDays, formatDate, today } from '../../dates'

/** "Tonight's run" for today (or the shift under way), "Tomorrow's run", else the weekday's. */
export function runTitle(day: string | null, now: string = today()): string {
  if (!day || day === now) return "Tonight's run"
  if (day === addDays(now, 1)) return "Tomorrow's run"
  return `${formatDate(day, 'weekdayName')}'s run`
}
