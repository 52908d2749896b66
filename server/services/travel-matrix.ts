// Travel times from a routing service when ROUTING_URL is set: the table endpoint of an
// OSRM-compatible server (GET /table/v1/driving/{lng,lat;…}?annotations=duration → durations in
// seconds). Without it, or when the service fails, the planner uses straight-line distance × detour.
import type { Config } from '../config'
import { logger } from '../logger'

export type TravelSource = 'straight_line' | 'routing_service'

export async function travelMatrix(
  config: Pick<Config, 'ROUTING_URL'>,
  points: { lat: number; lng: number }[],
): Promise<{ source: TravelSource; minutes?: number[][] }> {
  if (!config.ROUTING_URL || points.length < 2) return { source: 'straight_line' }
  const coords = points.map((p) => `${p.lng.toFixed(6)},${p.lat.toFixed(6)}`).join(';')
  const url = `${config.ROUTING_URL.replace(/\/$/, '')}/table/v1/driving/${coords}?annotations=duration`
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(8000) })
    const body = (await res.json()) as { code?: string; durations?: (number | null)[][] }
    const d = body.durations
    if (
      !res.ok ||
      body.code !== 'Ok' ||
      !d ||
      d.length !== points.length ||
      d.some((row) => row.length !== points.length)
    ) {
      throw new Error(`routing service answered ${res.status} ${body.code ?? ''}`)
    }
    // An unreachable pair (null) is treated as a long way round rather than a failure of the whole plan.
    return {
      source: 'routing_service',
      minutes: d.map((row) => row.map((s) => (s === null ? 24 * 60 : s / 60))),
    }
  } catch (err) {
    logger.warn({ err: String(err) }, 'routing service unavailable; planning with straight-line travel')
    return { source: 'straight_line' }
  }
}
