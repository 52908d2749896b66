// The queue's filters and page in the address (issue 13 part 7, issue 14): read back what was
// written, defaults left out, and anything unknown falls back to the default.
import { describe, expect, it } from 'vitest'
import { defaultQueueFilter, queryFromQueueView, queueViewFromQuery } from '../../src/pages/queue/queue-url'

describe('queue view in the address', () => {
  it('writes only what differs from the default and reads it back', () => {
    const view = {
      filter: { ...defaultQueueFilter(), state: 'all' as const, kind: 'dark' as const, siteId: 12 },
      page: 3,
    }
    const q = queryFromQueueView(view)
    expect(q).toEqual({ state: 'all', kind: 'dark', siteId: '12', page: '3' })
    expect(queueViewFromQuery(q as Record<string, string>)).toEqual(view)
    expect(queryFromQueueView({ filter: defaultQueueFilter(), page: 1 })).toEqual({})
  })

  it('ignores what it does not know', () => {
    expect(queueViewFromQuery({ state: 'burning', kind: 'x', clientId: '-4', page: '0' })).toEqual({
      filter: defaultQueueFilter(),
      page: 1,
    })
  })
})
