import { requireFinite, requireNonNegative, requirePositive } from '../units/guards.js'
import { type LinkBudget, receivedPowerDbm } from '../rf/linkBudget.js'
import { type LogDistanceModel, predictRxPowerDbm } from './logDistanceFit.js'

function checkModel(model: LogDistanceModel): void {
  requireFinite('model.interceptDbm', model.interceptDbm)
  requirePositive('model.exponent', model.exponent)
  requirePositive('model.referenceDistanceM', model.referenceDistanceM)
}

/**
 * Range multiplier bought by a change in link budget under exponent n, 10^(Δ/(10n)).
 * @param deltaDb budget change in dB (power, gain or sensitivity), finite
 * @param exponent path-loss exponent n, > 0
 * @returns ratio of new to old range, > 0 (√2 for +3.01 dB at n = 2)
 * @throws RangeError when deltaDb is not finite or exponent is not positive
 */
export function rangeFactor(deltaDb: number, exponent: number): number {
  requireFinite('deltaDb', deltaDb)
  requirePositive('exponent', exponent)
  // log-distance model: d2/d1 = 10^(Δ/(10n)) (Rappaport §4.9)
  return 10 ** (deltaDb / (10 * exponent))
}

/**
 * Percentage of extra range bought by a budget change, (10^(Δ/(10n)) − 1)·100.
 * @param deltaDb budget change in dB, finite
 * @param exponent path-loss exponent n, > 0
 * @returns extra range in percent (41.42 % for doubling the power at n = 2)
 * @throws RangeError when an argument is out of range
 */
export function rangeGainPercent(deltaDb: number, exponent: number): number {
  // common practice, no single source: follows from the range factor
  return (rangeFactor(deltaDb, exponent) - 1) * 100
}

/**
 * Transmit power that gives the same link as a given power plus an antenna-gain change.
 * @param txPowerMw transmit power in milliwatts, > 0
 * @param gainChangeDb change in antenna gain in dB, finite
 * @returns equivalent transmit power in milliwatts (200 mW with +10 dB → 2000 mW)
 * @throws RangeError when an argument is out of range
 */
export function equivalentTxPowerMw(txPowerMw: number, gainChangeDb: number): number {
  requirePositive('txPowerMw', txPowerMw)
  requireFinite('gainChangeDb', gainChangeDb)
  // link-budget symmetry: gain in dB adds like power in dBm (common practice)
  return txPowerMw * 10 ** (gainChangeDb / 10)
}

/**
 * Distance at which a model's received power falls to sensitivity plus fade margin.
 * @param model log-distance model (fitted or free-space); exponent > 0
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @param fadeMarginDb margin kept above sensitivity in dB, >= 0
 * @returns range in metres, > 0
 * @throws RangeError when an argument is out of range
 */
export function predictedRangeM(model: LogDistanceModel, sensitivityDbm: number, fadeMarginDb: number): number {
  checkModel(model)
  requireFinite('sensitivityDbm', sensitivityDbm)
  requireNonNegative('fadeMarginDb', fadeMarginDb)
  // invert the log-distance model at Pr = S + FM
  const excessDb = model.interceptDbm - (sensitivityDbm + fadeMarginDb)
  return model.referenceDistanceM * 10 ** (excessDb / (10 * model.exponent))
}

/**
 * Margin of a model's predicted received power above receiver sensitivity at a distance.
 * @param model log-distance model; exponent > 0
 * @param distanceM distance in metres, > 0
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @returns margin in dB (negative below sensitivity)
 * @throws RangeError when an argument is out of range
 */
export function linkMarginAtDistanceDb(model: LogDistanceModel, distanceM: number, sensitivityDbm: number): number {
  checkModel(model)
  requireFinite('sensitivityDbm', sensitivityDbm)
  return predictRxPowerDbm(model, distanceM) - sensitivityDbm
}

/**
 * Transmit power needed to keep sensitivity plus fade margin at a target range, given the power the model was measured with.
 * @param model log-distance model measured at modelTxPowerDbm; exponent > 0
 * @param modelTxPowerDbm transmit power behind the model in dBm, finite
 * @param targetRangeM target range in metres, > 0
 * @param sensitivityDbm receiver sensitivity in dBm, finite
 * @param fadeMarginDb margin kept above sensitivity in dB, >= 0
 * @returns required transmit power in dBm
 * @throws RangeError when an argument is out of range
 */
export function txPowerForRangeDbm(
  model: LogDistanceModel,
  modelTxPowerDbm: number,
  targetRangeM: number,
  sensitivityDbm: number,
  fadeMarginDb: number,
): number {
  checkModel(model)
  requireFinite('modelTxPowerDbm', modelTxPowerDbm)
  requireFinite('sensitivityDbm', sensitivityDbm)
  requireNonNegative('fadeMarginDb', fadeMarginDb)
  // received power shifts dB for dB with transmit power (log-distance model)
  return modelTxPowerDbm + sensitivityDbm + fadeMarginDb - predictRxPowerDbm(model, targetRangeM)
}

/**
 * Free-space (n = 2) log-distance model of a link budget, referenced to 1 m.
 * @param budget link terms; gains in dBi, losses in dB (>= 0), freqHz > 0
 * @returns model with intercept = Friis received power at 1 m, exponent 2, d0 = 1 m
 * @throws RangeError when a budget term is out of range
 */
export function freeSpaceModel(budget: LinkBudget): LogDistanceModel {
  // Friis at d0 = 1 m; free space is the log-distance model with n = 2
  return { interceptDbm: receivedPowerDbm(budget, 1), exponent: 2, referenceDistanceM: 1 }
}
