import { describe, expect, it } from 'vitest'
import { tagFromScan } from '../../src/pages/scan/scan-tag'

describe('reading a scanned label', () => {
  it('reads a plain tag, upper-cased as the register keeps it', () => {
    expect(tagFromScan(' wf-br-003 ')).toBe('WF-BR-003')
  })
  it('reads the tag from the link our printed labels carry', () => {
    expect(tagFromScan('https://lampwright.example/scan?tag=WF-HS-007')).toBe('WF-HS-007')
  })
  it('refuses what is not a tag', () => {
    expect(tagFromScan('https://example.org/')).toBeNull()
    expect(tagFromScan('DROP TABLE strings;')).toBeNull()
    expect(tagFromScan('')).toBeNull()
  })
})
