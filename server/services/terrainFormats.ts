import type { TerrainFormat } from '../../shared/types/course.js'
import type { ElevationGrid } from '../../shared/terrain/grid.js'
import { HttpError, badRequest } from '../errors.js'

/** Largest grid kept: a 1-arc-second SRTM tile (3601²) fits. */
export const TERRAIN_MAX_SAMPLES = 3601 * 3601
const HGT_VOID = -32768
const HGT_SIDES = [1201, 3601]

export interface ParsedTerrain {
  format: TerrainFormat
  grid: ElevationGrid
}

const unsupported = () =>
  new HttpError(415, 'UNSUPPORTED_MEDIA_TYPE', 'Upload a GeoTIFF (.tif) or an SRTM .hgt tile (1201² or 3601² samples)')
const unprocessable = (message: string) => new HttpError(422, 'UNPROCESSABLE', message)

function isTiff(buf: Buffer): boolean {
  if (buf.length < 8) return false
  const sig = buf.subarray(0, 4).toString('latin1')
  return sig === 'II*\0' || sig === 'MM\0*' || sig === 'II+\0' || sig === 'MM\0+'
}

/**
 * Reads an uploaded elevation file. The type comes from the content: TIFF magic bytes, or the exact
 * size of an SRTM tile; only the tile's position comes from its name (e.g. N51W002.hgt).
 * @param buf the whole file
 * @param fileName the name given by the client (for an .hgt, it must hold the tile name)
 * @returns the format and the grid (north row first, bbox of sample centres)
 * @throws HttpError 415 for other content, 422 for a file that cannot be used, 400 for a bad tile name
 */
export async function parseTerrainFile(buf: Buffer, fileName: string): Promise<ParsedTerrain> {
  if (isTiff(buf)) return { format: 'geotiff', grid: await parseGeoTiff(buf) }
  const side = HGT_SIDES.find((s) => buf.length === s * s * 2)
  if (side) return { format: 'hgt', grid: parseHgt(buf, side, fileName) }
  throw unsupported()
}

function parseHgt(buf: Buffer, side: number, fileName: string): ElevationGrid {
  const m = /([NS])(\d{2})([EW])(\d{3})/i.exec(fileName)
  if (!m) {
    throw badRequest('Name the .hgt file after its tile, e.g. N51W002.hgt, so its position is known', [
      { path: 'file', message: 'tile name missing' },
    ])
  }
  const lat = Number(m[2]) * (m[1]!.toUpperCase() === 'S' ? -1 : 1)
  const lon = Number(m[4]) * (m[3]!.toUpperCase() === 'W' ? -1 : 1)
  if (Math.abs(lat) > 89 || Math.abs(lon) > 179) throw badRequest(`No SRTM tile is named ${m[0]}`)
  const elevationsM = new Float32Array(side * side)
  // SRTM: big-endian int16, rows from north to south, edges shared with the neighbouring tiles
  for (let i = 0; i < elevationsM.length; i++) {
    const v = buf.readInt16BE(i * 2)
    elevationsM[i] = v === HGT_VOID ? NaN : v
  }
  return { width: side, height: side, west: lon, south: lat, east: lon + 1, north: lat + 1, elevationsM }
}

async function parseGeoTiff(buf: Buffer): Promise<ElevationGrid> {
  let image
  try {
    const ab = buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength) as ArrayBuffer
    // Loaded on first use: only terrain uploads need the TIFF reader.
    const { fromArrayBuffer } = await import('geotiff')
    image = await (await fromArrayBuffer(ab)).getImage()
  } catch {
    throw unprocessable('The TIFF could not be read')
  }
  const width = image.getWidth()
  const height = image.getHeight()
  if (width < 2 || height < 2) throw unprocessable('The GeoTIFF needs at least 2×2 samples')
  if (width * height > TERRAIN_MAX_SAMPLES) {
    throw unprocessable(`The GeoTIFF has ${width}×${height} samples; at most ${TERRAIN_MAX_SAMPLES} are accepted`)
  }
  const keys = image.getGeoKeys() ?? {}
  if (keys.ProjectedCSTypeGeoKey || keys.GTModelTypeGeoKey === 1) {
    throw unprocessable('The GeoTIFF is in a projected system; upload it in WGS-84 latitude/longitude (EPSG:4326)')
  }
  let bbox: number[]
  try {
    bbox = image.getBoundingBox()
  } catch {
    throw unprocessable('The GeoTIFF carries no georeference (tie point and pixel scale)')
  }
  const [w, s, e, n] = bbox as [number, number, number, number]
  if (!(w >= -180 && e <= 180 && s >= -90 && n <= 90 && e > w && n > s)) {
    throw unprocessable('The GeoTIFF bounds are not latitude/longitude degrees')
  }
  const rasters = (await image.readRasters({ samples: [0] })) as unknown as ArrayLike<number>[]
  const band = rasters[0]!
  const noData = image.getGDALNoData()
  const elevationsM = new Float32Array(width * height)
  for (let i = 0; i < elevationsM.length; i++) {
    const v = band[i]!
    elevationsM[i] = v === noData || !Number.isFinite(v) || v < -1000 ? NaN : v
  }
  // pixel-is-area (the default): the bounding box is the outer edge, samples sit half a pixel inside
  const isPoint = keys.GTRasterTypeGeoKey === 2
  const dx = isPoint ? 0 : (e - w) / width / 2
  const dy = isPoint ? 0 : (n - s) / height / 2
  return { width, height, west: w + dx, south: s + dy, east: e - dx, north: n - dy, elevationsM }
}
