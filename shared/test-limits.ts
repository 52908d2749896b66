// Pass/fail rules for electrical test readings, from published standards (trade-reference §5).

/** General-type RCD maximum trip times in ms (BS EN 61008-1 / 61009-1). */
export const RCD_MAX_MS = { x1: 300, x5: 40 } as const

/** Minimum insulation resistance in MΩ by test voltage (BS 7671:2018 Table 64). */
export function insulationMinimumMegohms(testVolts: number): number {
  return testVolts <= 250 ? 0.5 : 1.0
}

export function judgeReadings(
  kind: string,
  r: Record<string, number | undefined>,
): { result: 'pass' | 'fail'; reasons: string[] } | null {
  const reasons: string[] = []
  if (kind === 'rcd_test') {
    if (r.tripMsAt1x === undefined && r.tripMsAt5x === undefined) return null
    if (r.tripMsAt1x !== undefined && r.tripMsAt1x > RCD_MAX_MS.x1)
      reasons.push(`Trip at 1 × IΔn took ${r.tripMsAt1x} ms (limit ${RCD_MAX_MS.x1} ms).`)
    if (r.tripMsAt5x !== undefined && r.tripMsAt5x > RCD_MAX_MS.x5)
      reasons.push(
        `Trip at 5 × IΔn took ${r.tripMsAt5x} ms (limit ${RCD_MAX_MS.x5} ms for additional protection).`,
      )
    if (r.ratedMa !== undefined && r.ratedMa > 30)
      reasons.push(`Rated ${r.ratedMa} mA: additional protection needs 30 mA or less.`)
    return { result: reasons.length ? 'fail' : 'pass', reasons }
  }
  if (kind === 'insulation_test') {
    if (r.megohms === undefined) return null
    const min = insulationMinimumMegohms(r.testVolts ?? 500)
    if (r.megohms < min)
      reasons.push(`${r.megohms} MΩ is below the ${min} MΩ minimum at ${r.testVolts ?? 500} V.`)
    return { result: reasons.length ? 'fail' : 'pass', reasons }
  }
  return null
}
