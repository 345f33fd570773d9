import { beamwidthFromGainDeg } from '../antenna/beamwidth.js'
import { requireFinite } from '../units/guards.js'
import type { AntennaKind } from '../types/setup.js'

/** Gain (dBi) at or below which an omni's elevation beam is taken as a full half-plane (180°). */
const OMNI_FLAT_GAIN_DBI = 0.4

/**
 * Half-power beamwidth estimated from an antenna's gain, for a setup whose beamwidth was left blank.
 * Directional: the symmetric-beam estimate of shared/antenna. Omni: the elevation-plane width from
 * McDonald's omni approximation D ≈ 101/(θ − 0.0027·θ²) (as quoted by Pozar, IEEE AP Magazine, 1993;
 * recalled, treat as rough), which gives about 78° for a 2.15 dBi dipole.
 * @param kind 'omni' or 'directional'
 * @param gainDbi antenna gain in dBi, finite
 * @returns beamwidth in degrees, in (0, 360]; at most 180 for an omni
 * @throws RangeError when gainDbi is not finite
 */
export function estimateBeamwidthDeg(kind: AntennaKind, gainDbi: number): number {
  requireFinite('gainDbi', gainDbi)
  if (kind === 'directional') return beamwidthFromGainDeg(gainDbi)
  if (gainDbi <= OMNI_FLAT_GAIN_DBI) return 180
  const d = 10 ** (gainDbi / 10)
  // solve 0.0027θ² − θ + 101/D = 0 for the smaller root
  const disc = 1 - 4 * 0.0027 * (101 / d)
  if (disc <= 0) return 180
  return Math.min(180, (1 - Math.sqrt(disc)) / (2 * 0.0027))
}
