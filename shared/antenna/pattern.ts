import { requireNonNegative, requirePositive } from '../units/guards.js'

/** Default maximum main-lobe attenuation A_m, dB (3GPP TR 36.942 §4.2.1.1). */
export const DEFAULT_MAX_ATTENUATION_DB = 20

/**
 * Parabolic main-lobe pattern, relative gain −min(12(θ/θ3dB)², A_m).
 * @param offBoresightDeg angle off boresight in degrees, >= 0
 * @param beamwidthDeg full half-power beamwidth θ3dB in degrees, > 0
 * @param maxAttenuationDb floor A_m in dB, >= 0 (default 20)
 * @returns relative gain in dB, in [−A_m, 0]; −3 dB at half the beamwidth
 * @throws RangeError when an argument is out of range
 */
export function parabolicPatternDb(
  offBoresightDeg: number,
  beamwidthDeg: number,
  maxAttenuationDb = DEFAULT_MAX_ATTENUATION_DB,
): number {
  requireNonNegative('offBoresightDeg', offBoresightDeg)
  requirePositive('beamwidthDeg', beamwidthDeg)
  requireNonNegative('maxAttenuationDb', maxAttenuationDb)
  const r = offBoresightDeg / beamwidthDeg
  // 3GPP TR 36.942 §4.2.1.1 / TR 36.814 A.2.1.1; main-lobe term of ITU-R F.1336
  return -Math.min(12 * r * r, maxAttenuationDb)
}

/**
 * Gain of an antenna toward a direction off its boresight: peak gain plus the parabolic main-lobe pattern.
 * @param peakGainDbi boresight gain in dBi, finite
 * @param offBoresightDeg angle off boresight in degrees, >= 0
 * @param beamwidthDeg full half-power beamwidth in degrees, > 0
 * @param maxAttenuationDb pattern floor A_m in dB, >= 0 (default 20)
 * @returns gain in dBi toward that direction
 * @throws RangeError when an argument is out of range
 */
export function gainOffBoresightDbi(
  peakGainDbi: number,
  offBoresightDeg: number,
  beamwidthDeg: number,
  maxAttenuationDb = DEFAULT_MAX_ATTENUATION_DB,
): number {
  if (!Number.isFinite(peakGainDbi)) throw new RangeError(`peakGainDbi must be finite, got ${peakGainDbi}`)
  // 3GPP TR 36.942 §4.2.1.1: G(θ) = G_max + A(θ)
  return peakGainDbi + parabolicPatternDb(offBoresightDeg, beamwidthDeg, maxAttenuationDb)
}
