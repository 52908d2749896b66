import { afterAll, describe, expect, it } from 'vitest'
import { applyLocale, packFor } from '../../src/locale-packs'
import { formatDate } from '../../src/dates'

describe('APP_LOCALE packs', () => {
  afterAll(() => applyLocale('en-GB'))

  it('matches a tag whole, then by its language, and keeps en-GB for the rest', () => {
    expect(packFor('en-GB')).toBe('en-GB')
    expect(packFor('fr-BE')).toBe('fr')
    expect(packFor('de-AT')).toBe('de')
    expect(packFor('xx-YY')).toBeNull()
  })

  // Month and weekday names as the languages write them (French: "jeudi 3 décembre"; German:
  // "Donnerstag, 3. Dezember" in full dates, here only the names) — common usage, no source.
  it('names months and weekdays in the locale', async () => {
    await applyLocale('fr-FR')
    expect(formatDate('2026-12-03', 'longWeekdayDate')).toBe('jeudi 3 décembre 2026')
    await applyLocale('de')
    expect(formatDate('2026-12-03', 'longWeekdayDate')).toBe('Donnerstag 3 Dezember 2026')
    await applyLocale('en-GB')
    expect(formatDate('2026-12-03', 'longWeekdayDate')).toBe('Thursday 3 December 2026')
  })
})
