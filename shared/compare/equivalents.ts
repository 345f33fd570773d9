import { rangeFactor } from '../propagation/predictions.js'
import { requireFinite, requireNonNegative } from '../units/guards.js'
import { dbToRatio } from '../units/power.js'

/** What an advantage in dB equals in transmit power and in range. */
export interface AdvantageEquivalents {
  /** Transmit-power factor giving the same received power, 10^(Δ/10). */
  powerFactor: number
  /** Range factor under the exponent, 10^(Δ/(10n)); null without an exponent. */
  rangeFactor: number | null
  /** e.g. "+9.6 dB: like 9.1× the power". */
  phrase: string
}

function formatFactor(x: number): string {
  if (x >= 10) return x.toFixed(0)
  if (x >= 0.1) return x.toFixed(1)
  return x.toPrecision(1)
}

/**
 * Equivalent transmit-power and range factors of an advantage.
 * @param deltaDb advantage in dB, finite (negative = a disadvantage)
 * @param exponent path-loss exponent n (> 0), or null when no fit is available
 * @returns factors and a one-line phrase
 * @throws RangeError when deltaDb is not finite or exponent is not positive
 */
export function advantageEquivalents(deltaDb: number, exponent: number | null): AdvantageEquivalents {
  requireFinite('deltaDb', deltaDb)
  // gain and power add alike in the link budget
  const powerFactor = dbToRatio(deltaDb)
  const range = exponent === null ? null : rangeFactor(deltaDb, exponent)
  const sign = deltaDb >= 0 ? '+' : '−'
  return {
    powerFactor,
    rangeFactor: range,
    phrase: `${sign}${Math.abs(deltaDb).toFixed(1)} dB: like ${formatFactor(powerFactor)}× the power`,
  }
}

/** How the measured advantage sits against the datasheet prediction. */
export type PredictionFlag = 'shortfall' | 'excess' | null

/**
 * Flags a measured advantage whose distance from the prediction exceeds its confidence half-width.
 * @param measuredDb measured advantage, dB, finite
 * @param halfWidthDb half-width of its confidence interval, dB, >= 0 (null = unknown: no flag)
 * @param predictedDb advantage the datasheets predict, dB, finite
 * @returns 'shortfall' when measured is lower, 'excess' when higher, null when within the interval
 * @throws RangeError when a value is out of range
 */
export function predictionFlag(measuredDb: number, halfWidthDb: number | null, predictedDb: number): PredictionFlag {
  requireFinite('measuredDb', measuredDb)
  requireFinite('predictedDb', predictedDb)
  if (halfWidthDb === null) return null
  requireNonNegative('halfWidthDb', halfWidthDb)
  const diff = measuredDb - predictedDb
  if (Math.abs(diff) <= halfWidthDb) return null
  return diff < 0 ? 'shortfall' : 'excess'
}
