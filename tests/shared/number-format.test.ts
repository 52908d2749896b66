// Expected strings are written out by hand from the Unicode CLDR number patterns for en-GB
// (grouping ",", decimal ".", currency "¤#,##0.00": "£" before the amount, two decimals for GBP per
// ISO 4217) and de-DE (grouping ".", decimal ",", currency "#,##0.00 ¤" with a no-break space).
import { describe, expect, it } from 'vitest'
import { agree, formatFixed, formatMoney, formatNumber, listOf, plural } from '../../shared/number-format'

describe('numbers a person reads', () => {
  it('groups thousands (CLDR en-GB "#,##0.###")', () => {
    expect(formatNumber(10010)).toBe('10,010')
    expect(formatNumber(1234567.891, 1)).toBe('1,234,567.9')
    expect(formatNumber(42)).toBe('42')
    expect(formatNumber(10010, 0, 'de-DE')).toBe('10.010')
  })

  it('keeps a column at one precision', () => {
    expect(formatFixed(11.9, 2)).toBe('11.90')
    expect(formatFixed(1960, 1)).toBe('1,960.0')
  })

  it('writes money to the penny whatever its size (ISO 4217: GBP has 2 minor digits)', () => {
    expect(formatMoney(42.613)).toBe('£42.61')
    expect(formatMoney(1960)).toBe('£1,960.00')
    expect(formatMoney(0.5)).toBe('£0.50')
    expect(formatMoney(1960, 'de-DE')).toBe('1.960,00\u00a0£')
  })

  it('counts with the noun in the right number', () => {
    expect(plural(1, 'fuse lamp')).toBe('1 fuse lamp')
    expect(plural(2, 'fuse lamp')).toBe('2 fuse lamps')
    expect(plural(0, 'pinned stop')).toBe('0 pinned stops')
    expect(plural(10010, 'visit')).toBe('10,010 visits')
    expect(plural(1, 'try', 'tries')).toBe('1 try')
    expect(plural(3, 'try', 'tries')).toBe('3 tries')
    expect(agree(1, 'stays', 'stay')).toBe('stays')
    expect(agree(2, 'stays', 'stay')).toBe('stay')
  })
})

describe('listOf', () => {
  // Unicode CLDR list patterns: en-GB joins the last two with " and " and no serial comma; en-US adds it.
  it('joins as the locale writes a list', () => {
    expect(listOf(['2 live supply points', '60 live structures', '60 live strings'])).toBe(
      '2 live supply points, 60 live structures and 60 live strings',
    )
    expect(listOf(['a', 'b', 'c'], 'en-US')).toBe('a, b, and c')
    expect(listOf(['12 live sites'])).toBe('12 live sites')
  })
})
