// Tungsten resistivity against temperature: Forsythe & Worthing, "The properties of tungsten and the
// characteristics of tungsten lamps", Astrophysical Journal 61 (1925), as reproduced in the CRC
// Handbook (values from secondary copies; trade-reference §4). Kelvin → µΩ·cm.
export const TUNGSTEN_RESISTIVITY: readonly (readonly [number, number])[] = [
  [300, 5.65],
  [400, 8.06],
  [500, 10.56],
  [600, 13.23],
  [800, 19.0],
  [1000, 24.93],
  [1500, 40.36],
  [2000, 56.67],
  [2500, 73.91],
  [2800, 84.7],
  [3000, 92.04],
  [3500, 111.1],
]

const ROOM = TUNGSTEN_RESISTIVITY[0][1]
const RATIOS = TUNGSTEN_RESISTIVITY.map(([k, rho]) => [k, rho / ROOM] as const)

// Piecewise-linear through the table (extended along the end segments), x and y picked from pairs.
function interpolate(points: readonly (readonly [number, number])[], x: number, from: 0 | 1): number {
  const to = from === 0 ? 1 : 0
  let i = 1
  while (i < points.length - 1 && x > points[i][from]) i++
  const [a, b] = [points[i - 1], points[i]]
  return a[to] + ((x - a[from]) * (b[to] - a[to])) / (b[from] - a[from])
}

// Hot/cold resistance ratio of a tungsten filament at `kelvin`, relative to 300 K.
export function resistanceRatio(kelvin: number): number {
  return interpolate(RATIOS, kelvin, 0)
}

// Filament temperature implied by a hot/cold resistance ratio (relative to 300 K).
export function filamentTemperature(hotColdRatio: number): number {
  return interpolate(RATIOS, hotColdRatio, 1)
}
