import { describe, expect, it } from 'vitest'
import { assessmentView, isLiveSocket, reasonText } from '../../src/components/string/assessment-view'
import { powerLine } from '../../src/components/string/key-numbers'
import { ISOLATION_CAUTION } from '../../shared/engine/reason-codes'

// The string page's reading of the engine's answer. Fixtures are written by hand, not computed by the
// engine: the figures are the issue's own example and hand arithmetic.
const base = {
  lit: true,
  state: 'lit',
  lawsApply: true,
  stringVolts: 240,
  stringAmps: 0.066,
  stringWatts: 15.84, // 240 × 0.066 = 15.84 (issue 11: "an electrician multiplies the two numbers")
  maxRatio: 1,
  replaceNow: false,
  reasons: [{ code: 'no_lamps_out', text: 'No lamps out.' }],
  classes: [
    {
      lampsInCircuit: 20,
      voltsPerLamp: 12,
      ampsPerLamp: 0.066,
      wattsPerLamp: 0.792, // 12 × 0.066
      ratio: 1,
      currentFactor: 1,
      lifeFactor: 1,
    },
  ],
}

describe('volts × amps = watts on the string page', () => {
  it('writes the string line so the product checks by hand', () => {
    const p = powerLine(assessmentView(base, 240, [{ ratedAmps: 0.066 }]))
    // Figures and units joined by no-break spaces (U+00A0) so a phone never wraps "15.84 | W".
    expect(p).toEqual({ volts: '240\u00a0V', amps: '0.066\u00a0A', factor: null, watts: '15.84\u00a0W' })
  })

  it('shows the power factor of an LED string: 230 V × 0.1 A = 23 VA, × 0.9 = 20.7 W', () => {
    const led = { ...base, stringVolts: 230, stringAmps: 0.1, stringWatts: 20.7, powerFactor: 0.9 }
    expect(powerLine(assessmentView(led, 230, [{ ratedAmps: 0.01 }]))).toEqual({
      volts: '230\u00a0V',
      amps: '0.1\u00a0A',
      factor: '0.9',
      watts: '20.7\u00a0W',
    })
  })

  it('gives no life figure where the lamp laws do not hold', () => {
    const out = { ...base, lawsApply: false, classes: [{ ...base.classes[0], lifeFactor: 1e-20 }] }
    expect(assessmentView(out, 240, []).classes[0].lifeFactor).toBeNull()
  })

  it('extrapolates nothing the engine leaves out: no current, no power line', () => {
    // 19 of 20 lamps shorted on 240 V: r = 240 / 12 = 20 (issue 11): the engine sends null amps.
    const blown = {
      ...base,
      lawsApply: false,
      stringAmps: null,
      stringWatts: null,
      classes: [
        {
          ...base.classes[0],
          lampsInCircuit: 1,
          voltsPerLamp: 240,
          ratio: 20,
          ampsPerLamp: null,
          wattsPerLamp: null,
          currentFactor: null,
          lifeFactor: null,
        },
      ],
    }
    const v = assessmentView(blown, 240, [{ ratedAmps: 0.066 }])
    expect(powerLine(v)).toBeNull()
    expect(v.classes[0].ampsPerLamp).toBeNull()
    expect(v.classes[0].wattsPerLamp).toBeNull()
  })
})

describe('reasons from the engine', () => {
  it('reads a page saved by an older release: plain sentences, no volts per lamp, no string volts', () => {
    const old = {
      ...base,
      lawsApply: undefined,
      stringVolts: undefined,
      reasons: ['No lamps out: all 20 run at 100 % of rating.'],
      classes: [{ lampsInCircuit: 20, voltsPerLamp: 12, ratio: 1, currentFactor: 1, lifeFactor: 1 }],
    }
    const v = assessmentView(old, 240, [{ ratedAmps: 0.066 }])
    expect(v.reasons[0].text).toBe('No lamps out: all 20 run at 100 % of rating.')
    expect(v.stringVolts).toBe(240)
    expect(v.lawsApply).toBe(true)
    // Rated 0.066 A at ratio 1: 0.066 A a lamp; 12 V × 0.066 A = 0.792 W.
    expect(v.classes[0].ampsPerLamp).toBeCloseTo(0.066, 9)
    expect(v.classes[0].wattsPerLamp).toBeCloseTo(0.792, 9)
  })

  it('marks the live-socket codes and shows the caution once, beside the reason', () => {
    const fuse = { code: 'fuse_lamp_failed' as const, text: `The fuse lamp has failed. ${ISOLATION_CAUTION}` }
    expect(isLiveSocket(fuse)).toBe(true)
    expect(reasonText(fuse)).toBe('The fuse lamp has failed.')
    expect(isLiveSocket({ code: 'lamps_shorted', text: '2 lamps shorted.' })).toBe(false)
  })
})
