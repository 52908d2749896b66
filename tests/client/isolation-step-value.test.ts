// A step's recorded value on the safety officer's timeline: an RCD trip time always with its unit,
// milliseconds (BS EN 61008-1 states RCD trip times in ms).
import { describe, expect, it } from 'vitest'
import { stepValueText } from '../../src/components/isolations/isolation-format'

describe('isolation step values', () => {
  it('write a trip time with its unit however it was typed', () => {
    expect(stepValueText('rcd_test', '24')).toBe('tripped in 24 ms')
    expect(stepValueText('rcd_test', '24 ms')).toBe('tripped in 24 ms')
    expect(stepValueText('rcd_test', '18.5')).toBe('tripped in 18.5 ms')
  })
  it('leave other words and empty values alone', () => {
    expect(stepValueText('rcd_test', 'did not trip')).toBe('did not trip')
    expect(stepValueText('rcd_test', ' ')).toBeNull()
    expect(stepValueText('prove_dead', null)).toBeNull()
  })
})
