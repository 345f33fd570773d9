/**
 * An elevation grid on a regular lat/lon lattice. Samples are row-major with the north row first;
 * bbox gives the outermost sample centres (west, south, east, north) in degrees.
 */
export interface ElevationGrid {
  width: number
  height: number
  west: number
  south: number
  east: number
  north: number
  /** Elevations in metres above mean sea level; NaN where the source had no data. */
  elevationsM: Float32Array
}

/**
 * Bilinear elevation at a position from the four surrounding samples.
 * @param grid the grid; width and height >= 2 and elevationsM of width·height values
 * @param latDeg latitude in degrees
 * @param lonDeg longitude in degrees
 * @returns elevation in metres, or NaN outside the grid or next to a missing sample
 * @throws RangeError when the grid is malformed
 */
export function sampleGridBilinear(grid: ElevationGrid, latDeg: number, lonDeg: number): number {
  const { width, height } = grid
  if (width < 2 || height < 2 || grid.elevationsM.length !== width * height) {
    throw new RangeError(`grid must be at least 2×2 with width·height samples, got ${width}×${height}`)
  }
  // fractional column/row; rows count down from the north edge
  const fx = ((lonDeg - grid.west) / (grid.east - grid.west)) * (width - 1)
  const fy = ((grid.north - latDeg) / (grid.north - grid.south)) * (height - 1)
  if (!(fx >= 0 && fx <= width - 1 && fy >= 0 && fy <= height - 1)) return NaN
  const x0 = Math.min(Math.floor(fx), width - 2)
  const y0 = Math.min(Math.floor(fy), height - 2)
  const tx = fx - x0
  const ty = fy - y0
  const e = grid.elevationsM
  const i = y0 * width + x0
  // corners with zero weight are skipped, so a void next to an exact sample position does not spread
  let sum = 0
  const add = (w: number, v: number) => {
    if (w > 0) sum += w * v
  }
  add((1 - tx) * (1 - ty), e[i]!)
  add(tx * (1 - ty), e[i + 1]!)
  add((1 - tx) * ty, e[i + width]!)
  add(tx * ty, e[i + width + 1]!)
  return sum
}

/** A sampled ground profile between two points. */
export interface GroundProfile {
  /** Ground distance from the start, metres. */
  distanceM: Float64Array
  /** Terrain elevation above mean sea level, metres; NaN where the grid has no data. */
  elevationM: Float64Array
}

/**
 * Samples n evenly spaced points from one position to another (straight in lat/lon, which is close
 * enough to the great circle over the few kilometres of a range test).
 * @param sample elevation lookup (lat, lon) → metres or NaN
 * @param from start position in degrees
 * @param to end position in degrees
 * @param n number of points, integer >= 2
 * @param distanceM ground distance between from and to, metres, >= 0
 * @returns distances and elevations, n each
 * @throws RangeError when n < 2 or distanceM is negative
 */
export function sampleProfile(
  sample: (latDeg: number, lonDeg: number) => number,
  from: { latDeg: number; lonDeg: number },
  to: { latDeg: number; lonDeg: number },
  n: number,
  distanceM: number,
): GroundProfile {
  if (!Number.isInteger(n) || n < 2) throw new RangeError(`n must be an integer >= 2, got ${n}`)
  if (!(distanceM >= 0)) throw new RangeError(`distanceM must be >= 0, got ${distanceM}`)
  const out: GroundProfile = { distanceM: new Float64Array(n), elevationM: new Float64Array(n) }
  for (let i = 0; i < n; i++) {
    const t = i / (n - 1)
    out.distanceM[i] = t * distanceM
    out.elevationM[i] = sample(from.latDeg + (to.latDeg - from.latDeg) * t, from.lonDeg + (to.lonDeg - from.lonDeg) * t)
  }
  return out
}
