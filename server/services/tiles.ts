import type { Config } from '../config'

/**
 * Where map tiles come from. With no TILE_URL the client draws the demo town's own streets as a
 * vector basemap (GET /api/v1/basemap): an invented town has no real map to fetch.
 */
export function tileSettings(config: Config) {
  if (config.TILE_URL) {
    return {
      url: config.TILE_URL,
      attribution: config.TILE_ATTRIBUTION,
      maxZoom: config.TILE_MAX_ZOOM,
      local: false,
    }
  }
  return { url: null, attribution: 'Lampwright demo basemap', maxZoom: 20, local: true }
}

/** The tile host to allow in the Content-Security-Policy, or none for the local basemap. */
export function tileOrigin(config: Config): string | null {
  if (!config.TILE_URL) return null
  try {
    const u = new URL(config.TILE_URL.replace(/\{s\}/g, 'a').replace(/\{[^}]+\}/g, '0'))
    const host = config.TILE_URL.includes('{s}') ? u.host.replace(/^a\./, '*.') : u.host
    return `${u.protocol}//${host}`
  } catch {
    return null
  }
}

/**
 * Which basemap the client draws: the app's own PMTiles archive (BASEMAP_FILE), a tile server
 * (TILE_URL), the demo town's drawn streets (demo mode only), or none — strings on a plain background.
 */
export function basemapSettings(config: Config): {
  kind: 'pmtiles' | 'tile_server' | 'demo' | 'none'
  url: string | null
} {
  if (config.BASEMAP_FILE) return { kind: 'pmtiles', url: '/basemap.pmtiles' }
  if (config.TILE_URL) return { kind: 'tile_server', url: config.TILE_URL }
  if (config.DEMO_MODE) return { kind: 'demo', url: null }
  return { kind: 'none', url: null }
}
