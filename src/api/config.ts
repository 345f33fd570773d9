import { apiGet } from './client'

/** Tile source for every map: a URL template with {z}/{x}/{y} and its attribution. */
export interface MapConfigDto {
  tileUrl: string
  attribution: string
}

export const getMapConfig = () => apiGet<MapConfigDto>('/config/map')
