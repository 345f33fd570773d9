import { gainOffBoresightDbi } from '../antenna/pattern.js'
import { beamwidthFromGainDeg } from '../antenna/beamwidth.js'
import { offBoresightAngleDeg } from '../geo/boresight.js'
import { freeSpaceLossDb } from '../rf/freeSpaceLoss.js'
import { requireInRange, requirePositive } from '../units/guards.js'

/** A receive antenna as the generator needs it. */
export interface GeneratorAntenna {
  kind: 'omni' | 'directional'
  gainDbi: number
  /** Half-power beamwidth, degrees; null = estimate from the gain. */
  beamwidthDeg: number | null
  /** Boresight azimuth (degrees from north) and elevation (degrees); used for directional antennas. */
  azimuthDeg: number | null
  elevationDeg: number | null
}

/** The "true" propagation the generator simulates. */
export interface PropagationTruth {
  /** Log-distance exponent n beyond 1 m, dimensionless, in [1.5, 5]. */
  exponent: number
  /** Log-normal shadowing spread fixed to the ground (same on every flight of the course), dB, >= 0. */
  shadowSigmaDb: number
  /** Typical size of a shadowed patch on the ground, m (default 40). */
  shadowCorrelationM?: number
  /** Seed of the ground shadowing field; one per course (default 1). */
  shadowFieldSeed?: number
  /** Shadowing that changes from flight to flight (aircraft attitude, people moving), dB, >= 0 (default 1.5). */
  flightShadowSigmaDb?: number
  /** Distance over which the per-flight part decorrelates, m (default 8). */
  flightShadowDecorrelationM?: number
  /** Ground reflection coefficient magnitude, [0, 1] (default 0.75; the sign is negative as for grazing incidence). */
  reflectionMagnitude?: number
  /** Distance scale over which the ground reflection weakens, m (default 300): rough ground scatters it far out. */
  reflectionTaperM?: number
  /** Loss when the airframe sits between its antenna and the station (flying straight away), dB, >= 0 (default 0). */
  tailShadowDb?: number
  /** Extra loss not in the setup (unlisted cable, bad connector), dB, >= 0 (default 0). */
  hiddenLossDb?: number
}

/** Geometry of one sample seen from the ground antenna. */
export interface SampleGeometry {
  horizontalM: number
  /** Aircraft bearing and elevation from the ground antenna, degrees. */
  azimuthDeg: number
  elevationDeg: number
  antennaHeightM: number
  aircraftHeightM: number
}

/**
 * Gain of a receive antenna toward a direction: full gain for an omni, gain plus the parabolic main-lobe pattern for a directional one.
 * @param antenna kind, gain (dBi), beamwidth (deg, null = estimated), boresight azimuth/elevation (deg)
 * @param azimuthDeg direction azimuth in degrees, finite
 * @param elevationDeg direction elevation in degrees, [-90, 90]
 * @returns gain in dBi toward that direction
 * @throws RangeError when an argument is out of range
 */
export function antennaGainTowardDbi(antenna: GeneratorAntenna, azimuthDeg: number, elevationDeg: number): number {
  if (antenna.kind === 'omni') return antenna.gainDbi
  const bw = antenna.beamwidthDeg ?? beamwidthFromGainDeg(antenna.gainDbi)
  const off = offBoresightAngleDeg(antenna.azimuthDeg ?? 0, antenna.elevationDeg ?? 0, azimuthDeg, elevationDeg)
  return gainOffBoresightDbi(antenna.gainDbi, off, bw)
}

/**
 * Mean path loss of the log-distance truth: free space to 1 m, then 10·n·log10(d).
 * @param slantM 3-D distance in metres, > 0 (clamped to >= 1 m)
 * @param freqHz carrier frequency in hertz, > 0
 * @param exponent path-loss exponent n, in [1.5, 5]
 * @returns loss in dB
 * @throws RangeError when an argument is out of range
 */
export function truthPathLossDb(slantM: number, freqHz: number, exponent: number): number {
  requirePositive('slantM', slantM)
  requireInRange('exponent', exponent, 1.5, 5)
  // log-distance model with d0 = 1 m in free space (Rappaport §4.9)
  return freeSpaceLossDb(1, freqHz) + 10 * exponent * Math.log10(Math.max(1, slantM))
}

/**
 * Two-ray ground-reflection fade relative to the direct ray, tapered with distance; a directional antenna's
 * pattern toward the reflection point weakens the reflected ray.
 * @param g sample geometry (m, deg)
 * @param antenna receive antenna
 * @param wavelengthMetres carrier wavelength, m, > 0
 * @param truth reflection magnitude and taper
 * @returns fade in dB (negative in a null, up to about +5 dB on a peak), floored at −30 dB
 * @throws RangeError when an argument is out of range
 */
export function reflectionFadeDb(
  g: SampleGeometry,
  antenna: GeneratorAntenna,
  wavelengthMetres: number,
  truth: PropagationTruth,
): number {
  const h1 = Math.max(0.1, g.antennaHeightM)
  const h2 = Math.max(0.1, g.aircraftHeightM)
  const d = Math.max(1, g.horizontalM)
  const r1 = Math.hypot(d, h2 - h1)
  const r2 = Math.hypot(d, h2 + h1)
  // two-ray model (Rappaport §4.6): E = E_d·(1 + Γ·(r1/r2)·e^(−jkΔ)), Γ ≈ −|Γ| at grazing incidence
  const taper = Math.exp(-d / (truth.reflectionTaperM ?? 300))
  const reflectedElevDeg = (-Math.atan2(h1 + h2, d) * 180) / Math.PI
  const patternDb =
    antennaGainTowardDbi(antenna, g.azimuthDeg, reflectedElevDeg) -
    antennaGainTowardDbi(antenna, g.azimuthDeg, g.elevationDeg)
  const amp = (truth.reflectionMagnitude ?? 0.75) * taper * (r1 / r2) * 10 ** (Math.min(0, patternDb) / 20)
  const phase = (2 * Math.PI * (r2 - r1)) / wavelengthMetres
  const re = 1 - amp * Math.cos(phase)
  const im = amp * Math.sin(phase)
  return Math.max(-30, 10 * Math.log10(re * re + im * im))
}
