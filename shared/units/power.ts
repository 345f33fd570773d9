import { requireFinite, requirePositive } from './guards.js'

/**
 * Converts a power in milliwatts to dBm.
 * @param powerMw power in milliwatts, finite and > 0
 * @returns power in dBm (any finite value)
 * @throws RangeError when powerMw is not a finite positive number
 */
export function mwToDbm(powerMw: number): number {
  requirePositive('powerMw', powerMw)
  // ITU-R V.574: P[dB(mW)] = 10·log10(P / 1 mW)
  return 10 * Math.log10(powerMw)
}

/**
 * Converts a power in dBm to milliwatts.
 * @param powerDbm power in dBm, finite
 * @returns power in milliwatts, > 0
 * @throws RangeError when powerDbm is not finite
 */
export function dbmToMw(powerDbm: number): number {
  requireFinite('powerDbm', powerDbm)
  // ITU-R V.574: inverse of the dB(mW) definition
  return 10 ** (powerDbm / 10)
}

/**
 * Converts a linear power ratio to decibels.
 * @param powerRatio ratio of two powers, finite and > 0
 * @returns ratio in dB
 * @throws RangeError when powerRatio is not a finite positive number
 */
export function ratioToDb(powerRatio: number): number {
  requirePositive('powerRatio', powerRatio)
  // ITU-R V.574: power ratio in dB = 10·log10(P2/P1)
  return 10 * Math.log10(powerRatio)
}

/**
 * Converts decibels to a linear power ratio.
 * @param ratioDb ratio in dB, finite
 * @returns linear power ratio, > 0
 * @throws RangeError when ratioDb is not finite
 */
export function dbToRatio(ratioDb: number): number {
  requireFinite('ratioDb', ratioDb)
  // ITU-R V.574: inverse of 10·log10
  return 10 ** (ratioDb / 10)
}
