// Turns a kind's form into the API's body and the server's field errors back into per-field messages.
import { isApiError } from '../../api/http'
import type { EstateRow } from '../../api/estate'
import type { KindView } from './kinds'
import { estateKinds, schemaDefaults } from '../../../shared/schemas/estate'

export type FormValues = Record<string, unknown>

// A deep copy that also works on Vue's reactive proxies (structuredClone refuses them).
const copy = <T>(x: T): T => JSON.parse(JSON.stringify(x ?? null)) as T

/** The form's starting values: the row's when editing, else the schema's defaults and the kind's own. */
export function initialValues(view: KindView, row: EstateRow | null): FormValues {
  const v: FormValues = row
    ? copy(row)
    : copy({ ...schemaDefaults(estateKinds[view.kind]), ...view.defaults })
  if (view.point) {
    v[view.point.lat] ??= null
    v[view.point.lng] ??= null
  }
  if (view.line) v.line ??= []
  if (view.lampClasses) v.lampClasses = copy(v.lampClasses ?? [])
  if (view.members) v.memberIds = [...((v.memberIds as number[] | undefined) ?? [])]
  return v
}

const blank = (x: unknown) => x === '' || x === undefined || x === null

export function bodyOf(view: KindView, v: FormValues, version?: number): Record<string, unknown> {
  const body: Record<string, unknown> = {}
  for (const f of view.fields) {
    const x = v[f.key]
    body[f.key] = blank(x) ? null : f.input === 'number' ? Number(x) : x
  }
  if (view.point) {
    for (const k of [view.point.lat, view.point.lng]) body[k] = blank(v[k]) ? null : Number(v[k])
  }
  if (view.line) {
    const line = v.line as [number, number][]
    body.line = v.geometry === 'line' && line.length ? line : null
  }
  if (view.lampClasses) body.lampClasses = v.lampClasses
  if (view.members) body.memberIds = v.memberIds
  if (version !== undefined) body.version = version
  return body
}

/** Where a server path (`body.siteId`, `body.memberIds.1`, `body.lat`) shows in the form. */
function fieldOf(view: KindView, path: string): string {
  const key = path.replace(/^body\./, '').split('.')[0]
  if (view.point && (key === view.point.lat || key === view.point.lng || key === 'line')) return 'point'
  return key
}

/** Field messages from a 400/409 answer, keyed by form field; empty when the error is not about fields. */
export function fieldErrors(view: KindView, err: unknown): Record<string, string> {
  if (!isApiError(err)) return {}
  const fields = (err.details as { fields?: { path: string; message: string }[] } | undefined)?.fields
  const out: Record<string, string> = {}
  for (const f of fields ?? []) out[fieldOf(view, f.path)] ??= f.message
  return out
}
