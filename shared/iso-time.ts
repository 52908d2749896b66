// DATETIME columns arrive from the database as Date objects in UTC; the API sends them as ISO 8601
// text. One helper for every service that maps rows, instead of a copy in each.

/** A DATETIME as ISO 8601 text; an absent one stays null. Text (already converted) passes through. */
export function isoOrNull(value: unknown): string | null {
  if (value instanceof Date) return value.toISOString()
  return value === null || value === undefined ? null : String(value)
}

/** The same for a column that is never empty. */
export function iso(value: unknown): string {
  return isoOrNull(value) ?? String(value)
}
