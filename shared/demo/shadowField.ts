import { requireNonNegative, requirePositive } from '../units/guards.js'
import { createSeededRandom } from './random.js'

/** A fixed log-normal shadowing field over the ground: the same trees shadow the same spots on every flight. */
export interface ShadowField {
  /** Shadowing at a point east/north of the station, dB (zero mean, about sigmaDb spread). */
  atDb(eastM: number, northM: number): number
}

/**
 * Builds a smooth Gaussian-like random field as a sum of plane waves with random directions, wavelengths and
 * phases (a spectral method), so shadowing depends on where the aircraft is, not when.
 * @param seed integer seed; one per course gives the same field on every flight
 * @param sigmaDb spread of the field, dB, >= 0
 * @param correlationM typical size of a shadowed patch, m, > 0
 * @param waves number of plane waves, >= 8 (default 48)
 * @returns the field
 * @throws RangeError when an argument is out of range
 */
export function createShadowField(seed: number, sigmaDb: number, correlationM: number, waves = 48): ShadowField {
  requireNonNegative('sigmaDb', sigmaDb)
  requirePositive('correlationM', correlationM)
  if (!Number.isInteger(waves) || waves < 8) throw new RangeError(`waves must be an integer >= 8, got ${waves}`)
  const rng = createSeededRandom(seed)
  const kx = new Float64Array(waves)
  const ky = new Float64Array(waves)
  const ph = new Float64Array(waves)
  for (let w = 0; w < waves; w++) {
    const dir = rng.uniform() * 2 * Math.PI
    // spatial frequencies spread around 1/correlation length (Gaussian spectrum)
    const k = Math.abs(rng.normal()) / correlationM
    kx[w] = k * Math.cos(dir)
    ky[w] = k * Math.sin(dir)
    ph[w] = rng.uniform() * 2 * Math.PI
  }
  // each cosine has variance 1/2, so √(2/W) scales the sum to unit variance
  const scale = sigmaDb * Math.sqrt(2 / waves)
  return {
    atDb(eastM: number, northM: number): number {
      let s = 0
      for (let w = 0; w < waves; w++) s += Math.cos(kx[w]! * eastM + ky[w]! * northM + ph[w]!)
      return scale * s
    },
  }
}
