import { requirePositive } from '../units/guards.js'

/** Speed of light in vacuum, metres per second (exact, SI definition of the metre). */
export const SPEED_OF_LIGHT_M_S = 299792458

/**
 * Free-space wavelength of a carrier.
 * @param freqHz carrier frequency in hertz, finite and > 0
 * @returns wavelength in metres
 * @throws RangeError when freqHz is not a finite positive number
 */
export function wavelengthM(freqHz: number): number {
  requirePositive('freqHz', freqHz)
  // λ = c/f
  return SPEED_OF_LIGHT_M_S / freqHz
}

/**
 * Converts megahertz to hertz.
 * @param freqMHz frequency in megahertz, finite and > 0
 * @returns frequency in hertz
 * @throws RangeError when freqMHz is not a finite positive number
 */
export function mhzToHz(freqMHz: number): number {
  return requirePositive('freqMHz', freqMHz) * 1e6
}
