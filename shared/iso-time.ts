// DATETIME columns arrive from the database as Date objects in UTC; the API sends them as ISO 8601
// text, and calendar days as YYYY-MM-DD. One module for every service and seed, instead of a copy in each.

/** A DATETIME as ISO 8601 text; an absent one stays null. Text (already converted) passes through. */
export function isoOrNull(value: unknown): string | null {
  if (value instanceof Date) return value.toISOString()
  return value === null || value === undefined ? null : String(value)
}

/** The same for a column that is never empty. */
export function iso(value: unknown): string {
  return isoOrNull(value) ?? String(value)
}

/** The calendar day (YYYY-MM-DD, UTC) of an instant, as DATE columns and the API's day fields hold it. */
export function isoDay(at: Date | number): string {
  return new Date(at).toISOString().slice(0, 10)
}
