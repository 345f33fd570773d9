import { requireInRange, requirePositive } from '../units/guards.js'
import { studentTQuantile } from '../stats/studentT.js'

/** Log-distance model Pr(d) = Pr(d0) − 10·n·log10(d/d0). */
export interface LogDistanceModel {
  /** Received power at the reference distance, dBm. */
  interceptDbm: number
  /** Path-loss exponent n, dimensionless (2 in free space). */
  exponent: number
  /** Reference distance d0, metres. */
  referenceDistanceM: number
}

/** Least-squares fit of a log-distance model with its uncertainty. */
export interface LogDistanceFit extends LogDistanceModel {
  /** Fitted slope of received power per decade of distance, dB/decade (= −10·n). */
  slopeDbPerDecade: number
  /** Number of samples used. */
  sampleCount: number
  /** Shadowing spread: residual standard deviation with N − 2 in the denominator, dB. */
  residualSigmaDb: number
  /** Residual standard deviation with N in the denominator, dB. */
  residualSigmaPopulationDb: number
  /** Coefficient of determination, 1 − SSR/SST. */
  rSquared: number
  /** Standard error of n. */
  exponentStdErr: number
  /** Standard error of the intercept, dB. */
  interceptStdErrDb: number
  /** Two-sided confidence level of the interval, e.g. 0.95. */
  confidenceLevel: number
  /** Lower bound of the confidence interval of n. */
  exponentLower: number
  /** Upper bound of the confidence interval of n. */
  exponentUpper: number
  /** Shortest and longest distance used, metres. */
  minDistanceM: number
  maxDistanceM: number
}

/** Options of {@link fitLogDistance}. */
export interface LogDistanceFitOptions {
  /** Reference distance d0 in metres, > 0 (default 1). */
  referenceDistanceM?: number
  /** Per-sample selection: non-zero means use the sample (default: all samples). */
  include?: Uint8Array
  /** Two-sided confidence level for n, in (0, 1) (default 0.95). */
  confidenceLevel?: number
}

/**
 * Ordinary least squares of received power on 10·log10(d/d0), giving n, intercept, shadowing σ, R² and a t-interval for n.
 * @param distanceM distances in metres; used samples must be > 0
 * @param rxPowerDbm received powers in dBm, same length; used samples must be finite
 * @param options referenceDistanceM (> 0, default 1 m), include mask, confidenceLevel (default 0.95)
 * @returns the fit; σ uses N − 2 (residualSigmaPopulationDb gives the N form)
 * @throws RangeError when lengths differ, a used sample is invalid, fewer than 3 samples are used, or all distances are equal
 */
export function fitLogDistance(
  distanceM: Float64Array,
  rxPowerDbm: Float64Array,
  options: LogDistanceFitOptions = {},
): LogDistanceFit {
  const len = distanceM.length
  const include = options.include
  if (include && include.length !== len) throw new RangeError('include must have the same length as distanceM')
  const log10DistanceM = new Float64Array(len)
  for (let i = 0; i < len; i++) {
    if (include && include[i] === 0) continue
    const d = distanceM[i]!
    if (!(d > 0) || !Number.isFinite(d)) throw new RangeError(`distanceM[${i}] must be > 0, got ${d}`)
    log10DistanceM[i] = Math.log10(d)
  }
  return fitLogDistanceFromLog10(log10DistanceM, rxPowerDbm, options)
}

/**
 * Same fit as {@link fitLogDistance} from precomputed log10(distance / 1 m), for callers that already hold them.
 * @param log10DistanceM log10 of each distance in metres; used samples must be finite
 * @param rxPowerDbm received powers in dBm, same length; used samples must be finite
 * @param options referenceDistanceM (> 0, default 1 m), include mask, confidenceLevel (default 0.95)
 * @returns the fit; σ uses N − 2 (residualSigmaPopulationDb gives the N form)
 * @throws RangeError when lengths differ, a used sample is invalid, fewer than 3 samples are used, or all distances are equal
 */
export function fitLogDistanceFromLog10(
  log10DistanceM: Float64Array | Float32Array,
  rxPowerDbm: Float64Array | Float32Array,
  options: LogDistanceFitOptions = {},
): LogDistanceFit {
  // options are checked before the data, as before the sums were split out
  requirePositive('referenceDistanceM', options.referenceDistanceM ?? 1)
  requireInRange('confidenceLevel', options.confidenceLevel ?? 0.95, 1e-9, 1 - 1e-9)
  const include = options.include
  const len = log10DistanceM.length
  if (rxPowerDbm.length !== len) throw new RangeError('rxPowerDbm must have the same length as the distances')
  if (include && include.length !== len) throw new RangeError('include must have the same length as the distances')
  // one pass of sums shifted by the first used sample (Chan, Golub & LeVeque 1983, "shifted data"):
  // with the shift near the data, the centred moments below keep ~1e-12 relative accuracy
  let n = 0
  let x0 = NaN
  let y0 = NaN
  let sx = 0
  let sy = 0
  let sxxRaw = 0
  let sxyRaw = 0
  let syyRaw = 0
  let xMin = Infinity
  let xMax = -Infinity
  for (let i = 0; i < len; i++) {
    if (include && include[i] === 0) continue
    const x = log10DistanceM[i]!
    const y = rxPowerDbm[i]!
    // x − x is 0 only for finite x: one test for NaN and ±Infinity
    if (x - x !== 0) throw new RangeError(`log10DistanceM[${i}] must be finite, got ${x}`)
    if (y - y !== 0) throw new RangeError(`rxPowerDbm[${i}] must be finite, got ${y}`)
    if (n === 0) (x0 = x), (y0 = y)
    const dx = x - x0
    const dy = y - y0
    sx += dx
    sy += dy
    sxxRaw += dx * dx
    sxyRaw += dx * dy
    syyRaw += dy * dy
    n++
    if (x < xMin) xMin = x
    if (x > xMax) xMax = x
  }
  return fitLogDistanceFromSums({ n, x0, y0, sx, sy, sxxRaw, sxyRaw, syyRaw, xMin, xMax }, options)
}

/**
 * One-pass sums of a log-distance fit, shifted by the first used sample (x0, y0) (Chan, Golub & LeVeque 1983):
 * sx = Σ(x − x0), sxxRaw = Σ(x − x0)², and so on, with x = log10(d / 1 m) and y = received power, dBm.
 * For callers that accumulate them inside their own pass over the samples.
 */
export interface LogDistanceSums {
  n: number
  x0: number
  y0: number
  sx: number
  sy: number
  sxxRaw: number
  sxyRaw: number
  syyRaw: number
  /** Smallest and largest x used. */
  xMin: number
  xMax: number
}

/**
 * The fit of {@link fitLogDistanceFromLog10} from sums accumulated by the caller in the same order (identical result).
 * @param sums shifted sums over the used samples
 * @param options referenceDistanceM (> 0, default 1 m), confidenceLevel (default 0.95); include is ignored
 * @returns the fit; σ uses N − 2 (residualSigmaPopulationDb gives the N form)
 * @throws RangeError when an option is out of range, fewer than 3 samples were used, or all distances are equal
 */
export function fitLogDistanceFromSums(sums: LogDistanceSums, options: LogDistanceFitOptions = {}): LogDistanceFit {
  const d0 = requirePositive('referenceDistanceM', options.referenceDistanceM ?? 1)
  const level = requireInRange('confidenceLevel', options.confidenceLevel ?? 0.95, 1e-9, 1 - 1e-9)
  const logD0 = Math.log10(d0)
  const { n, x0, y0, sx, sy, sxxRaw, sxyRaw, syyRaw, xMin, xMax } = sums
  if (n < 3) throw new RangeError(`fitLogDistance needs at least 3 samples, got ${n}`)
  const mx = x0 + sx / n
  const my = y0 + sy / n
  const sxx = sxxRaw - (sx * sx) / n
  const sxy = sxyRaw - (sx * sy) / n
  const syy = syyRaw - (sy * sy) / n
  if (!(sxx > 0)) throw new RangeError('distances must hold at least two different values')
  // OLS normal equations (e.g. Montgomery & Runger, Applied Statistics, §11.2)
  const slope = sxy / sxx
  const interceptAt1m = my - slope * mx
  // SSR from centred sums: rounding stays ~1e-16·Syy, far below the residuals of any real fit
  const ssr = Math.max(0, syy - slope * sxy)
  const sigma = Math.sqrt(ssr / (n - 2))
  const seSlope = sigma / Math.sqrt(sxx)
  const mxD0 = mx - logD0
  const seIntercept = sigma * Math.sqrt(1 / n + (mxD0 * mxD0) / sxx)
  const exponent = -slope / 10
  const seN = seSlope / 10
  // two-sided t interval with N − 2 degrees of freedom (Montgomery & Runger §11.5)
  const t = studentTQuantile(0.5 + level / 2, n - 2)
  return {
    interceptDbm: interceptAt1m + slope * logD0,
    exponent,
    referenceDistanceM: d0,
    slopeDbPerDecade: slope,
    sampleCount: n,
    residualSigmaDb: sigma,
    residualSigmaPopulationDb: Math.sqrt(ssr / n),
    rSquared: syy > 0 ? 1 - ssr / syy : 1,
    exponentStdErr: seN,
    interceptStdErrDb: seIntercept,
    confidenceLevel: level,
    exponentLower: exponent - t * seN,
    exponentUpper: exponent + t * seN,
    minDistanceM: 10 ** xMin,
    maxDistanceM: 10 ** xMax,
  }
}

/**
 * Received power predicted by a log-distance model.
 * @param model intercept (dBm), exponent (> 0) and reference distance (m, > 0)
 * @param distanceM distance in metres, > 0
 * @returns received power in dBm
 * @throws RangeError when the distance or model terms are out of range
 */
export function predictRxPowerDbm(model: LogDistanceModel, distanceM: number): number {
  requirePositive('distanceM', distanceM)
  requirePositive('model.referenceDistanceM', model.referenceDistanceM)
  requireInRange('model.interceptDbm', model.interceptDbm, -1e6, 1e6)
  requireInRange('model.exponent', model.exponent, -1e6, 1e6)
  // log-distance model (Rappaport, Wireless Communications §4.9)
  return model.interceptDbm - 10 * model.exponent * Math.log10(distanceM / model.referenceDistanceM)
}

/**
 * Path loss at the reference distance implied by a fit, PL(d0) = EIRP − Pr(d0).
 * @param model fitted intercept in dBm
 * @param eirpDbm EIRP of the transmitter in dBm (include the receive gain/losses if they are not in the fit), finite
 * @returns reference loss in dB
 * @throws RangeError when eirpDbm or the intercept is not finite
 */
export function referenceLossDb(model: LogDistanceModel, eirpDbm: number): number {
  requireInRange('eirpDbm', eirpDbm, -1e6, 1e6)
  requireInRange('model.interceptDbm', model.interceptDbm, -1e6, 1e6)
  // log-distance model: Pr(d0) = EIRP − PL(d0)
  return eirpDbm - model.interceptDbm
}
