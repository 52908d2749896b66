// Each kind of the estate as the Register area shows it: its table columns, its form's fields (label,
// input, options or the kind a select is filled from) and who may edit it (as the server decides).
import { estateEditors, type Role } from '../../../shared/roles'
import type { EstateKind } from '../../api/estate'
import { placeViews } from './kinds-places'
import { assetViews } from './kinds-assets'

export type InputKind = 'text' | 'number' | 'select' | 'time' | 'date' | 'toggle'

export interface FieldDef {
  key: string
  label: string
  input: InputKind
  options?: { value: string; label: string }[]
  /** A select filled from another kind's list. */
  ref?: { kind: EstateKind; label: string }
  required?: boolean
  hint?: string
  /** A heading shown above the first field of a run of fields with the same group. */
  group?: string
  /** Shown only while another field has this value (e.g. the LED driver fields for an LED type). */
  when?: { key: string; is: unknown }
}

export interface KindView {
  kind: EstateKind
  title: string
  singular: string
  write: readonly Role[]
  columns: { key: string; label: string }[]
  fields: FieldDef[]
  /** Where the form's map puts the point (lat/lng field names). */
  point?: { lat: string; lng: string }
  /** A string's line drawn on the map. */
  line?: boolean
  lampClasses?: boolean
  members?: boolean
  defaults: Record<string, unknown>
}

export const kindViews: KindView[] = [...placeViews, ...assetViews]

export const kindView = (kind: string): KindView | undefined => kindViews.find((k) => k.kind === kind)

/** Kinds a role may open in the Register area. */
export const kindsFor = (role: Role): KindView[] =>
  kindViews.filter((k) => k.kind !== 'strings' && (estateEditors.includes(role) || k.write.includes(role)))
