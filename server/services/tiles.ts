import { encodePngRgb } from './png.js'
import { notFound } from '../errors.js'

/** Side of a map tile, pixels. */
export const TILE_SIZE_PX = 256
export const TILE_MAX_ZOOM = 22
const CACHE_MAX = 512

const BACKGROUND: [number, number, number] = [244, 242, 236]
const MINOR: [number, number, number] = [218, 214, 204]
const MAJOR: [number, number, number] = [178, 172, 160]
const STEPS_DEG = [30, 10, 5, 2, 1, 0.5, 0.2, 0.1, 0.05, 0.02, 0.01, 0.005, 0.002, 0.001, 0.0005, 0.0002, 0.0001, 0.00005, 0.00002]

const cache = new Map<string, Buffer>()

/**
 * The graticule step for a zoom: the smallest round step that leaves at least a third of a tile
 * between lines, so each tile shows a few.
 * @param z zoom level, 0–22
 * @returns step in degrees
 */
export function graticuleStepDeg(z: number): number {
  const tileDeg = 360 / 2 ** z
  let step = STEPS_DEG[0]!
  for (const s of STEPS_DEG) if (s >= tileDeg / 3) step = s
  return step
}

// Web Mercator (EPSG:3857) tile scheme: x grows east, y grows south
function lonAt(px: number, worldPx: number): number {
  return (px / worldPx) * 360 - 180
}
function latAt(py: number, worldPx: number): number {
  const n = Math.PI - (2 * Math.PI * py) / worldPx
  return (180 / Math.PI) * Math.atan(Math.sinh(n))
}

function paint(rgb: Uint8Array, i: number, c: [number, number, number]): void {
  rgb[i * 3] = c[0]
  rgb[i * 3 + 1] = c[1]
  rgb[i * 3 + 2] = c[2]
}

/** For each pixel column (or row) edge, the line colour when a graticule line falls inside it. */
function lineMask(edges: (i: number) => number, step: number): ([number, number, number] | null)[] {
  const out: ([number, number, number] | null)[] = []
  for (let i = 0; i < TILE_SIZE_PX; i++) {
    const a = edges(i)
    const b = edges(i + 1)
    const lo = Math.min(a, b)
    const hi = Math.max(a, b)
    const k = Math.ceil(lo / step - 1e-9)
    const v = k * step
    if (v < hi) out.push(Math.abs(Math.round(v / step) % 5) === 0 ? MAJOR : MINOR)
    else out.push(null)
  }
  return out
}

function renderTile(z: number, x: number, y: number): Buffer {
  const worldPx = TILE_SIZE_PX * 2 ** z
  const step = graticuleStepDeg(z)
  const cols = lineMask((i) => lonAt(x * TILE_SIZE_PX + i, worldPx), step)
  const rows = lineMask((i) => latAt(y * TILE_SIZE_PX + i, worldPx), step)
  const rgb = new Uint8Array(TILE_SIZE_PX * TILE_SIZE_PX * 3)
  for (let r = 0; r < TILE_SIZE_PX; r++) {
    for (let c = 0; c < TILE_SIZE_PX; c++) {
      const line = cols[c] === MAJOR || rows[r] === MAJOR ? MAJOR : (cols[c] ?? rows[r] ?? BACKGROUND)
      paint(rgb, r * TILE_SIZE_PX + c, line)
    }
  }
  return encodePngRgb(TILE_SIZE_PX, TILE_SIZE_PX, rgb)
}

/**
 * A plain light map tile with a latitude/longitude graticule, so maps work with no network.
 * Tiles are kept in a small in-memory LRU.
 * @param z zoom, integer 0–22
 * @param x column, integer in [0, 2^z)
 * @param y row, integer in [0, 2^z)
 * @returns the PNG bytes
 * @throws HttpError 404 for a tile outside the scheme
 */
export function getTilePng(z: number, x: number, y: number): Buffer {
  const n = 2 ** z
  if (!Number.isInteger(z) || z < 0 || z > TILE_MAX_ZOOM || !Number.isInteger(x) || !Number.isInteger(y) || x < 0 || y < 0 || x >= n || y >= n) {
    throw notFound(`Tile ${z}/${x}/${y}`)
  }
  const key = `${z}/${x}/${y}`
  const hit = cache.get(key)
  if (hit) {
    cache.delete(key)
    cache.set(key, hit)
    return hit
  }
  const png = renderTile(z, x, y)
  cache.set(key, png)
  if (cache.size > CACHE_MAX) cache.delete(cache.keys().next().value!)
  return png
}
