// The register's column choice: what a manager picked comes back on the next visit, the tag is always
// there, and anything unreadable in storage falls back to the standard set.
import { describe, expect, it } from 'vitest'
import { COLUMNS_KEY, DEFAULT_COLUMNS, readColumns } from '../../src/components/register/register-columns'

const stored = (value: string | null) => ({ getItem: (k: string) => (k === COLUMNS_KEY ? value : null) })

describe('register columns', () => {
  it('start from the standard set, tag first', () => {
    expect(readColumns(stored(null))).toEqual(DEFAULT_COLUMNS)
    expect(DEFAULT_COLUMNS[0]).toBe('assetTag')
    expect(DEFAULT_COLUMNS).not.toContain('structure')
  })

  it('keep what was chosen, always with the tag, dropping names no column has', () => {
    expect(readColumns(stored('["name","client","nonsense"]'))).toEqual(['assetTag', 'name', 'client'])
    expect(readColumns(stored('["assetTag","circuit"]'))).toEqual(['assetTag', 'circuit'])
  })

  it('fall back to the standard set when storage holds something else', () => {
    expect(readColumns(stored('{not json'))).toEqual(DEFAULT_COLUMNS)
    expect(readColumns(stored('{"a":1}'))).toEqual(DEFAULT_COLUMNS)
    expect(readColumns(undefined)).toEqual(DEFAULT_COLUMNS)
  })
})
