import { apiGet } from './client'

/** The tile source the server hands out (TILE_URL or its own graticule tiles). */
export interface MapConfigDto {
  tileUrl: string
  attribution: string
}

export function getMapConfig(): Promise<MapConfigDto> {
  return apiGet<MapConfigDto>('/config/map')
}
