// Small builders for the estate's form fields (see kinds.ts).
import type { EstateKind } from '../../api/estate'
import type { FieldDef } from './kinds'

export const opts = (...values: string[]) =>
  values.map((value) => ({ value, label: value.replace(/_/g, ' ').replace(/^./, (c) => c.toUpperCase()) }))
export const text = (key: string, label: string, required = false): FieldDef => ({
  key,
  label,
  input: 'text',
  required,
})
export const num = (key: string, label: string, required = false, hint?: string): FieldDef => ({
  key,
  label,
  input: 'number',
  required,
  hint,
})
export const time = (key: string, label: string, required = false): FieldDef => ({
  key,
  label,
  input: 'time',
  required,
})
export const date = (key: string, label: string): FieldDef => ({ key, label, input: 'date' })
export const pick = (
  key: string,
  label: string,
  options: FieldDef['options'],
  required = true,
): FieldDef => ({
  key,
  label,
  input: 'select',
  options,
  required,
})
export const ref = (key: string, label: string, kind: EstateKind, by: string, required = true): FieldDef => ({
  key,
  label,
  input: 'select',
  ref: { kind, label: by },
  required,
})
