import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../units/guards.js'
import { wavelengthM } from '../rf/wavelength.js'

function checkHeights(groundHeightM: number, aircraftHeightM: number): void {
  requirePositive('groundHeightM', groundHeightM)
  requirePositive('aircraftHeightM', aircraftHeightM)
}

/**
 * Path difference between the ground-reflected and the direct ray over flat ground.
 * @param groundDistanceM horizontal distance in metres, >= 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height above ground in metres, > 0
 * @returns Δ = √((h1+h2)²+d²) − √((h1−h2)²+d²) in metres
 * @throws RangeError when an argument is out of range
 */
export function twoRayPathDifferenceM(groundDistanceM: number, groundHeightM: number, aircraftHeightM: number): number {
  requireNonNegative('groundDistanceM', groundDistanceM)
  checkHeights(groundHeightM, aircraftHeightM)
  const s = groundHeightM + aircraftHeightM
  const t = groundHeightM - aircraftHeightM
  // two-ray geometry (Rappaport, Wireless Communications §4.6), rationalised to avoid cancellation
  const r2 = Math.hypot(s, groundDistanceM)
  const r1 = Math.hypot(t, groundDistanceM)
  return (4 * groundHeightM * aircraftHeightM) / (r1 + r2)
}

/**
 * Ground distance at which the two-ray path difference equals a given value (closed form).
 * @param pathDifferenceM path difference Δ in metres, in (0, 2·min(h1, h2))
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @returns distance in metres, > 0
 * @throws RangeError when Δ is outside (0, 2·min(h1, h2)) or a height is not positive
 */
export function twoRayDistanceForPathDifferenceM(
  pathDifferenceM: number,
  groundHeightM: number,
  aircraftHeightM: number,
): number {
  checkHeights(groundHeightM, aircraftHeightM)
  const maxDelta = 2 * Math.min(groundHeightM, aircraftHeightM)
  requireFinite('pathDifferenceM', pathDifferenceM)
  if (pathDifferenceM <= 0 || pathDifferenceM >= maxDelta) {
    throw new RangeError(`pathDifferenceM must be in (0, ${maxDelta}), got ${pathDifferenceM}`)
  }
  // r2 − r1 = Δ and r2² − r1² = 4h1h2 give r1 = (4h1h2 − Δ²)/(2Δ); d = √(r1² − (h1−h2)²)
  const r1 = (4 * groundHeightM * aircraftHeightM - pathDifferenceM ** 2) / (2 * pathDifferenceM)
  const dh = groundHeightM - aircraftHeightM
  return Math.sqrt(Math.max(0, r1 * r1 - dh * dh))
}

/**
 * Exact distance of the k-th two-ray null (Δ = kλ, reflection coefficient −1); k = 1 is the outermost.
 * @param nullIndex k, integer >= 1 with kλ < 2·min(h1, h2)
 * @param freqHz carrier frequency in hertz, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @returns distance in metres
 * @throws RangeError when k is not a positive integer, the null does not exist, or an argument is out of range
 */
export function twoRayNullDistanceM(
  nullIndex: number,
  freqHz: number,
  groundHeightM: number,
  aircraftHeightM: number,
): number {
  if (!Number.isInteger(nullIndex) || nullIndex < 1) {
    throw new RangeError(`nullIndex must be an integer >= 1, got ${nullIndex}`)
  }
  // two-ray model: nulls where the path difference is a whole number of wavelengths (Goldsmith §2.4)
  return twoRayDistanceForPathDifferenceM(nullIndex * wavelengthM(freqHz), groundHeightM, aircraftHeightM)
}

/**
 * Far-field approximation of the k-th null distance, d ≈ 2·h1·h2/(kλ).
 * @param nullIndex k, integer >= 1
 * @param freqHz carrier frequency in hertz, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @returns distance in metres
 * @throws RangeError when an argument is out of range
 */
export function twoRayNullDistanceApproxM(
  nullIndex: number,
  freqHz: number,
  groundHeightM: number,
  aircraftHeightM: number,
): number {
  if (!Number.isInteger(nullIndex) || nullIndex < 1) {
    throw new RangeError(`nullIndex must be an integer >= 1, got ${nullIndex}`)
  }
  checkHeights(groundHeightM, aircraftHeightM)
  // Δ ≈ 2h1h2/d for d ≫ h (Rappaport §4.6)
  return (2 * groundHeightM * aircraftHeightM) / (nullIndex * wavelengthM(freqHz))
}

/**
 * Number of two-ray nulls between the station and a maximum distance.
 * @param freqHz carrier frequency in hertz, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @param maxDistanceM outer distance in metres, > 0
 * @returns count of nulls in (0, maxDistanceM]
 * @throws RangeError when an argument is out of range
 */
export function twoRayNullCount(
  freqHz: number,
  groundHeightM: number,
  aircraftHeightM: number,
  maxDistanceM: number,
): number {
  requirePositive('maxDistanceM', maxDistanceM)
  const lambda = wavelengthM(freqHz)
  const kMax = Math.ceil((2 * Math.min(groundHeightM, aircraftHeightM)) / lambda) - 1
  // Δ falls with distance, so nulls inside maxDistance have kλ >= Δ(maxDistance)
  const kMin = Math.max(1, Math.ceil(twoRayPathDifferenceM(maxDistanceM, groundHeightM, aircraftHeightM) / lambda))
  return Math.max(0, kMax - kMin + 1)
}

/**
 * Breakpoint (critical) distance 4·h1·h2/λ beyond which two-ray power falls as d⁻⁴.
 * @param freqHz carrier frequency in hertz, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @returns distance in metres
 * @throws RangeError when an argument is out of range
 */
export function twoRayBreakpointM(freqHz: number, groundHeightM: number, aircraftHeightM: number): number {
  checkHeights(groundHeightM, aircraftHeightM)
  // Goldsmith, Wireless Communications §2.4: d_c = 4 ht hr/λ
  return (4 * groundHeightM * aircraftHeightM) / wavelengthM(freqHz)
}

/**
 * Exact distance of the last two-ray maximum (Δ = λ/2).
 * @param freqHz carrier frequency in hertz, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0 (with λ/2 < 2·min(h1, h2))
 * @returns distance in metres
 * @throws RangeError when the peak does not exist or an argument is out of range
 */
export function twoRayLastPeakM(freqHz: number, groundHeightM: number, aircraftHeightM: number): number {
  // two-ray model: constructive interference at Δ = λ/2 with reflection coefficient −1
  return twoRayDistanceForPathDifferenceM(wavelengthM(freqHz) / 2, groundHeightM, aircraftHeightM)
}

/**
 * Crossover distance 4π·h1·h2/λ where the d⁻⁴ asymptote meets free space.
 * @param freqHz carrier frequency in hertz, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @returns distance in metres
 * @throws RangeError when an argument is out of range
 */
export function twoRayCrossoverM(freqHz: number, groundHeightM: number, aircraftHeightM: number): number {
  checkHeights(groundHeightM, aircraftHeightM)
  // Rappaport §4.6: equate Pt Gt Gr ht² hr²/d⁴ with Friis
  return (4 * Math.PI * groundHeightM * aircraftHeightM) / wavelengthM(freqHz)
}

/**
 * Distance of the two-ray null nearest to a given distance.
 * @param groundDistanceM distance of interest in metres, > 0
 * @param wavelengthMetres carrier wavelength in metres, > 0
 * @param groundHeightM ground antenna height in metres, > 0
 * @param aircraftHeightM aircraft height in metres, > 0
 * @returns distance of the nearest null in metres, or null when the heights allow no null
 * @throws RangeError when an argument is out of range
 */
export function nearestTwoRayNullM(
  groundDistanceM: number,
  wavelengthMetres: number,
  groundHeightM: number,
  aircraftHeightM: number,
): number | null {
  requirePositive('groundDistanceM', groundDistanceM)
  requirePositive('wavelengthMetres', wavelengthMetres)
  requireInRange('groundHeightM', groundHeightM, Number.MIN_VALUE, 1e7)
  requireInRange('aircraftHeightM', aircraftHeightM, Number.MIN_VALUE, 1e7)
  const maxDelta = 2 * Math.min(groundHeightM, aircraftHeightM)
  const kMax = Math.ceil(maxDelta / wavelengthMetres) - 1
  if (kMax < 1) return null
  const k = twoRayPathDifferenceM(groundDistanceM, groundHeightM, aircraftHeightM) / wavelengthMetres
  let best: number | null = null
  for (const kk of [Math.floor(k), Math.ceil(k)]) {
    if (kk < 1 || kk > kMax) continue
    const d = twoRayDistanceForPathDifferenceM(kk * wavelengthMetres, groundHeightM, aircraftHeightM)
    if (best === null || Math.abs(d - groundDistanceM) < Math.abs(best - groundDistanceM)) best = d
  }
  return best
}
