import { describe, expect, it } from 'vitest'
import { badgeText, bellLabel, NOTICE_KIND } from '../../src/components/layout/notice-format'
import { NOTICE_KINDS } from '../../shared/schemas/notices'

// Words for the bell (hand-written expectations: the label a screen reader announces, the badge text).
describe('the notice bell', () => {
  it('names the unread count in its accessible label', () => {
    expect(bellLabel(0)).toBe('Notices, none unread')
    expect(bellLabel(1)).toBe('Notices, 1 unread')
    expect(bellLabel(12)).toBe('Notices, 12 unread')
  })
  it('caps the badge at 99+ so it fits beside the bell on a phone', () => {
    expect(badgeText(7)).toBe('7')
    expect(badgeText(99)).toBe('99')
    expect(badgeText(100)).toBe('99+')
  })
  it('has a label and an icon for every kind of notice', () => {
    for (const kind of NOTICE_KINDS) {
      expect(NOTICE_KIND[kind].label.length).toBeGreaterThan(0)
      expect(NOTICE_KIND[kind].icon.length).toBeGreaterThan(0)
    }
  })
})
