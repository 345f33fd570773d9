import { config } from '../config.js'

/** Tile template the app serves itself (see routes/tiles.ts). */
export const LOCAL_TILE_URL = '/tiles/{z}/{x}/{y}.png'
const LOCAL_ATTRIBUTION = 'Plain graticule tiles by Ellipsoid'

export interface MapConfigDto {
  tileUrl: string
  attribution: string
}

/**
 * The map tile source for the client: TILE_URL and TILE_ATTRIBUTION when configured, else local tiles.
 * @returns the tile URL template and its attribution text
 */
export function getMapConfig(): MapConfigDto {
  const cfg = config()
  if (cfg.tileUrl) return { tileUrl: cfg.tileUrl, attribution: cfg.tileAttribution }
  return { tileUrl: LOCAL_TILE_URL, attribution: LOCAL_ATTRIBUTION }
}
