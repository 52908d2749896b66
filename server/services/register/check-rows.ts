// File rows checked against the one schema of a string's fields (`stringBody`), after the site, type,
// circuit and structure named in the file are turned into ids. Pure: runs on a pool thread.
import type { z } from 'zod'
import { stringBody } from '../../../shared/schemas/estate'
import type { ImportError } from '../../../shared/schemas/register'
import type { RawRow } from './parse-file'

export type StringFields = z.infer<typeof stringBody>

/** Codes and refs a file may name, each to its id. Sites are named `clientName/siteName`. */
export interface Lookups {
  types: Record<string, number>
  sites: Record<string, number>
  circuits: Record<string, number>
  structures: Record<string, number>
}

export interface Checked {
  valid: { row: number; fields: StringFields }[]
  rejected: { row: number; errors: ImportError[] }[]
}

// The export neutralises cells that start like a formula with a leading apostrophe; a cell that
// comes back that way is the same text without it.
const unescape = (s: string) => (/^'[=+\-@\t\r]/.test(s) ? s.slice(1) : s).trim()
const NUMBER = /^-?\d+(\.\d+)?(e[-+]?\d+)?$/i

function number(cells: RawRow, field: 'lat' | 'lng' | 'mountingHeightM', errors: ImportError[]) {
  const text = unescape(cells[field] ?? '')
  if (text === '') return null
  if (!NUMBER.test(text)) {
    errors.push({ field, code: 'not_a_number', message: `"${text.slice(0, 40)}" is not a number.` })
    return undefined
  }
  return Number(text)
}

function parseLine(text: string, errors: ImportError[]): [number, number][] | null | undefined {
  if (text === '') return null
  const points = text.split(';').map((p) => p.trim().split(/\s+/))
  if (points.some((p) => p.length !== 2 || !p.every((n) => NUMBER.test(n)))) {
    errors.push({ field: 'line', code: 'invalid_format', message: 'Write the line as "lng lat;lng lat;…".' })
    return undefined
  }
  return points.map(([x, y]) => [Number(x), Number(y)])
}

function lookup(
  map: Record<string, number>,
  text: string,
  field: string,
  what: string,
  errors: ImportError[],
): number | null | undefined {
  if (text === '') return null
  const id = map[text]
  if (id === undefined) errors.push({ field, code: `unknown_${what}`, message: `No ${what} "${text}".` })
  return id
}

/** A zod issue as the import reports it: a stable code and words a spreadsheet user can act on. */
function describe(issue: z.core.$ZodIssue, value: unknown): { code: string; message: string } {
  const empty = value === '' || value === undefined || value === null
  if ((issue.code === 'too_small' || issue.code === 'invalid_type') && empty)
    return { code: 'required', message: 'This column cannot be empty.' }
  if (issue.code === 'too_small' || issue.code === 'too_big') {
    if (typeof value !== 'number')
      return { code: issue.code === 'too_big' ? 'too_long' : 'too_short', message: issue.message }
    const big = issue.code === 'too_big'
    const bound = Number(big ? issue.maximum : issue.minimum)
    const op = big ? (issue.inclusive ? 'at most' : 'less than') : issue.inclusive ? 'at least' : 'more than'
    return { code: 'out_of_range', message: `Must be ${op} ${bound}; the file has ${value}.` }
  }
  return { code: issue.code, message: issue.message }
}

function checkRow(cells: RawRow, lk: Lookups): { fields?: StringFields; errors: ImportError[] } {
  const errors: ImportError[] = []
  const text = (k: keyof RawRow) => unescape(cells[k] ?? '')
  const line = parseLine(text('line'), errors)
  let lat = number(cells, 'lat', errors)
  let lng = number(cells, 'lng', errors)
  // A line's representative point may be left out: its middle vertex stands for it.
  if (line && lat === null && lng === null) [lng, lat] = line[Math.floor(line.length / 2)]
  const mountingHeightM = number(cells, 'mountingHeightM', errors)
  const typeCode = text('typeCode')
  const siteName = text('siteName')
  const draft = {
    assetTag: text('assetTag'),
    name: text('name') || text('assetTag'),
    typeId: typeCode === '' ? undefined : lookup(lk.types, typeCode, 'typeCode', 'type', errors),
    siteId: siteName === '' ? undefined : lookup(lk.sites, siteName, 'siteName', 'site', errors),
    circuitId: lookup(lk.circuits, text('circuitRef'), 'circuitRef', 'circuit', errors),
    structureId: lookup(lk.structures, text('structureRef'), 'structureRef', 'structure', errors),
    geometry: text('geometry') || (line ? 'line' : 'point'),
    lat: lat ?? undefined,
    lng: lng ?? undefined,
    line,
    mountingHeightM,
    installedOn: text('installedOn') || null,
  }
  const parsed = stringBody.safeParse(draft)
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? 'row')
      const field = { typeId: 'typeCode', siteId: 'siteName' }[key] ?? key
      // A value already reported (unknown code, not a number) is not reported twice.
      if (errors.some((e) => e.field === field)) continue
      const value = (draft as Record<string, unknown>)[key]
      errors.push({ field, ...describe(issue, value) })
    }
  }
  return errors.length || !parsed.success ? { errors } : { fields: parsed.data, errors }
}

export function checkRows(rows: { row: number; cells: RawRow }[], lk: Lookups): Checked {
  const out: Checked = { valid: [], rejected: [] }
  const seen = new Map<string, number>()
  for (const { row, cells } of rows) {
    const { fields, errors } = checkRow(cells, lk)
    const tag = fields?.assetTag
    if (tag !== undefined && seen.has(tag)) {
      const message = `Asset tag "${tag}" is already on row ${seen.get(tag)} of this file.`
      errors.push({ field: 'assetTag', code: 'duplicate_tag', message })
    }
    if (fields && !errors.length) {
      seen.set(fields.assetTag, row)
      out.valid.push({ row, fields })
    } else out.rejected.push({ row, errors })
  }
  return out
}
