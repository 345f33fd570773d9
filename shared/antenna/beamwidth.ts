import { requireFinite, requirePositive } from '../units/guards.js'

/** Ideal beam-area constant: 4π sr in square degrees, rounded (Kraus, Antennas; Balanis ch. 2). */
export const BEAM_AREA_IDEAL_DEG2 = 41253
/** Practical beam-area constant for real antennas; recalled from memory (Balanis ch. 2), treat as rough. */
export const BEAM_AREA_PRACTICAL_DEG2 = 32400

/**
 * Directivity estimate from the two principal-plane half-power beamwidths, G ≈ C/(θE·θH).
 * @param eBeamwidthDeg E-plane half-power beamwidth in degrees, (0, 360]
 * @param hBeamwidthDeg H-plane half-power beamwidth in degrees, (0, 360]
 * @param beamAreaDeg2 constant C in square degrees, > 0 (41253 ideal, 32400 practical)
 * @returns gain in dBi
 * @throws RangeError when an argument is not a finite positive number
 */
export function gainFromBeamwidthsDbi(
  eBeamwidthDeg: number,
  hBeamwidthDeg: number,
  beamAreaDeg2 = BEAM_AREA_PRACTICAL_DEG2,
): number {
  requirePositive('eBeamwidthDeg', eBeamwidthDeg)
  requirePositive('hBeamwidthDeg', hBeamwidthDeg)
  requirePositive('beamAreaDeg2', beamAreaDeg2)
  // Kraus / Balanis ch. 2: D ≈ C/(θE θH) with beamwidths in degrees
  return 10 * Math.log10(beamAreaDeg2 / (eBeamwidthDeg * hBeamwidthDeg))
}

/**
 * Plausible half-power beamwidth of a symmetric beam from its gain, θ = √(C/10^(G/10)).
 * @param gainDbi antenna gain in dBi, finite
 * @param beamAreaDeg2 constant C in square degrees, > 0 (default practical 32400)
 * @returns beamwidth in degrees, capped at 360
 * @throws RangeError when an argument is out of range
 */
export function beamwidthFromGainDeg(gainDbi: number, beamAreaDeg2 = BEAM_AREA_PRACTICAL_DEG2): number {
  requireFinite('gainDbi', gainDbi)
  requirePositive('beamAreaDeg2', beamAreaDeg2)
  // inverse of the Kraus/Balanis estimate for θE = θH
  return Math.min(360, Math.sqrt(beamAreaDeg2 / 10 ** (gainDbi / 10)))
}

/**
 * Width of a beam across its axis at a distance (chord of the half-power cone).
 * @param distanceM distance along the axis in metres, >= 0
 * @param beamwidthDeg full half-power beamwidth in degrees, (0, 180)
 * @returns width in metres, 2·d·tan(θ/2)
 * @throws RangeError when an argument is out of range
 */
export function beamWidthAtDistanceM(distanceM: number, beamwidthDeg: number): number {
  requireFinite('distanceM', distanceM)
  if (distanceM < 0) throw new RangeError(`distanceM must be >= 0, got ${distanceM}`)
  requirePositive('beamwidthDeg', beamwidthDeg)
  if (beamwidthDeg >= 180) throw new RangeError(`beamwidthDeg must be < 180, got ${beamwidthDeg}`)
  // plane geometry of a cone of full angle θ
  return 2 * distanceM * Math.tan((beamwidthDeg * Math.PI) / 360)
}
