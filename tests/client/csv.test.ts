import { describe, expect, it } from 'vitest'
import { csvCell, toCsv } from '../../src/components/common/csv'

describe('CSV export', () => {
  // OWASP "CSV Injection": cells starting with = + - @ tab or CR are run as formulas by spreadsheets.
  it('neutralises text that a spreadsheet would run as a formula', () => {
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`)
    expect(csvCell('+1')).toBe("'+1")
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)")
  })
  // RFC 4180: fields with commas, quotes or line breaks are quoted, quotes doubled, CRLF line ends.
  it('quotes as RFC 4180 asks and ends lines with CRLF', () => {
    expect(toCsv([['a,b', 'say "hi"', 3, null]])).toBe('"a,b","say ""hi""",3,\r\n')
  })
  it('keeps negative numbers as numbers', () => {
    expect(csvCell(-2.5)).toBe('-2.5')
  })
})
