import { describe, expect, it } from 'vitest'
import { metresPerPixel, widthPx } from '../../src/components/map/basemap-geometry'

describe('drawing streets at their real width', () => {
  // Web Mercator ground resolution: 156543.03 m/px at zoom 0 on the equator, halving each zoom level;
  // 0.597 m/px at zoom 18 (OpenStreetMap wiki, "Zoom levels").
  it('matches the published ground resolution at zoom 18 on the equator', () => {
    expect(metresPerPixel(0, 18)).toBeCloseTo(0.597, 3)
  })
  it('shrinks with the cosine of latitude (60° N is half the equator’s)', () => {
    expect(metresPerPixel(60, 18) / metresPerPixel(0, 18)).toBeCloseTo(0.5, 6)
  })
  it('draws a 14 m street wider at zoom 18 than at zoom 16, never thinner than the minimum', () => {
    expect(widthPx(14, 54, 18)).toBeGreaterThan(widthPx(14, 54, 16))
    expect(widthPx(14, 54, 10)).toBe(1.5)
  })
})
