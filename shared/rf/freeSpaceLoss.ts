import { requirePositive } from '../units/guards.js'
import { SPEED_OF_LIGHT_M_S, wavelengthM } from './wavelength.js'

/** Exact constant of the MHz/km free-space loss form, 20·log10(4π·10⁹/c) ≈ 32.4478 dB (ITU-R P.525). */
export const FSPL_EXACT_CONSTANT_DB = 20 * Math.log10((4 * Math.PI * 1e9) / SPEED_OF_LIGHT_M_S)
/** Four-digit constant of the practical form, 32.45 dB (P.525 prints 32.4). */
export const FSPL_PRACTICAL_CONSTANT_DB = 32.45

/**
 * Free-space path loss, exact form 20·log10(4πd/λ).
 * @param distanceM path length in metres, > 0
 * @param freqHz carrier frequency in hertz, > 0
 * @returns loss in dB (may be negative when d < λ/4π, outside the far field)
 * @throws RangeError when distanceM or freqHz is not a finite positive number
 */
export function freeSpaceLossDb(distanceM: number, freqHz: number): number {
  requirePositive('distanceM', distanceM)
  // ITU-R P.525 §2.1: L_bf = 20·log10(4πd/λ)
  return 20 * Math.log10((4 * Math.PI * distanceM) / wavelengthM(freqHz))
}

/**
 * Free-space path loss, practical form 32.45 + 20·log10(f_MHz) + 20·log10(d_km).
 * @param distanceM path length in metres, > 0
 * @param freqHz carrier frequency in hertz, > 0
 * @returns loss in dB, within 0.003 dB of the exact form
 * @throws RangeError when distanceM or freqHz is not a finite positive number
 */
export function freeSpaceLossPracticalDb(distanceM: number, freqHz: number): number {
  requirePositive('distanceM', distanceM)
  requirePositive('freqHz', freqHz)
  // ITU-R P.525 §2.1 practical units, constant rounded to 32.45
  return FSPL_PRACTICAL_CONSTANT_DB + 20 * Math.log10(freqHz / 1e6) + 20 * Math.log10(distanceM / 1000)
}

/**
 * Distance at which the exact free-space loss equals a given loss.
 * @param lossDb path loss in dB, finite
 * @param freqHz carrier frequency in hertz, > 0
 * @returns distance in metres, > 0
 * @throws RangeError when lossDb is not finite or freqHz is not positive
 */
export function freeSpaceDistanceForLossM(lossDb: number, freqHz: number): number {
  if (!Number.isFinite(lossDb)) throw new RangeError(`lossDb must be finite, got ${lossDb}`)
  // inverse of ITU-R P.525: d = λ/(4π)·10^(L/20)
  return (wavelengthM(freqHz) / (4 * Math.PI)) * 10 ** (lossDb / 20)
}

/**
 * Distance at which the practical (32.45) free-space loss equals a given loss.
 * @param lossDb path loss in dB, finite
 * @param freqHz carrier frequency in hertz, > 0
 * @returns distance in metres, > 0
 * @throws RangeError when lossDb is not finite or freqHz is not positive
 */
export function freeSpaceDistanceForLossPracticalM(lossDb: number, freqHz: number): number {
  if (!Number.isFinite(lossDb)) throw new RangeError(`lossDb must be finite, got ${lossDb}`)
  requirePositive('freqHz', freqHz)
  // inverse of the P.525 practical form: d_km = 10^((L − 32.45 − 20·log10 f_MHz)/20)
  return 1000 * 10 ** ((lossDb - FSPL_PRACTICAL_CONSTANT_DB - 20 * Math.log10(freqHz / 1e6)) / 20)
}
