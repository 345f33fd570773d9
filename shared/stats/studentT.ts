import { requireInRange, requirePositive } from '../units/guards.js'

// Lanczos series, γ = 671/128, 14 terms (Numerical Recipes 3rd ed. §6.1 gammln); ~1e-15 for x > 0
const LANCZOS = [
  57.1562356658629235, -59.5979603554754912, 14.1360979747417471, -0.491913816097620199,
  0.339946499848118887e-4, 0.465236289270485756e-4, -0.983744753048795646e-4, 0.158088703224912494e-3,
  -0.210264441724104883e-3, 0.217439618115212643e-3, -0.164318106536763890e-3, 0.844182239838527433e-4,
  -0.261908384015814087e-4, 0.368991826595316234e-5,
]

function logGamma(x: number): number {
  let y = x
  const t = x + 5.2421875
  let series = 0.999999999999997092
  for (const c of LANCZOS) series += c / ++y
  return (x + 0.5) * Math.log(t) - t + Math.log((2.5066282746310005 * series) / x)
}

function betaContinuedFraction(a: number, b: number, x: number): number {
  // modified Lentz evaluation of the incomplete-beta continued fraction (Numerical Recipes §6.4)
  const tiny = 1e-300
  let c = 1
  let d = 1 - ((a + b) * x) / (a + 1)
  if (Math.abs(d) < tiny) d = tiny
  d = 1 / d
  let h = d
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2))
    d = 1 + aa * d
    if (Math.abs(d) < tiny) d = tiny
    c = 1 + aa / c
    if (Math.abs(c) < tiny) c = tiny
    d = 1 / d
    h *= d * c
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1))
    d = 1 + aa * d
    if (Math.abs(d) < tiny) d = tiny
    c = 1 + aa / c
    if (Math.abs(c) < tiny) c = tiny
    d = 1 / d
    const del = d * c
    h *= del
    if (Math.abs(del - 1) < 1e-15) break
  }
  return h
}

function regularisedIncompleteBeta(a: number, b: number, x: number): number {
  if (x <= 0) return 0
  if (x >= 1) return 1
  const lnFront = logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x)
  const front = Math.exp(lnFront)
  // use the symmetry I_x(a,b) = 1 − I_(1−x)(b,a) where the fraction converges faster
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(a, b, x)) / a
  return 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b
}

/**
 * Cumulative distribution function of Student's t distribution.
 * @param t value of the statistic, finite
 * @param degreesOfFreedom degrees of freedom, > 0
 * @returns probability P(T <= t), in [0, 1]
 * @throws RangeError when t is not finite or degreesOfFreedom is not positive
 */
export function studentTCdf(t: number, degreesOfFreedom: number): number {
  requireInRange('t', t, -Number.MAX_VALUE, Number.MAX_VALUE)
  requirePositive('degreesOfFreedom', degreesOfFreedom)
  const v = degreesOfFreedom
  // P(|T| > t) = I_(v/(v+t²))(v/2, 1/2) (Abramowitz & Stegun 26.7.1 with 26.5)
  const tail = regularisedIncompleteBeta(v / 2, 0.5, v / (v + t * t)) / 2
  return t >= 0 ? 1 - tail : tail
}

/**
 * Quantile (inverse CDF) of Student's t distribution.
 * @param probability lower-tail probability, in (0, 1)
 * @param degreesOfFreedom degrees of freedom, > 0
 * @returns t such that P(T <= t) = probability, e.g. 2.228 for (0.975, 10)
 * @throws RangeError when probability is outside (0, 1) or degreesOfFreedom is not positive
 */
export function studentTQuantile(probability: number, degreesOfFreedom: number): number {
  requireInRange('probability', probability, 0, 1)
  if (probability === 0 || probability === 1) {
    throw new RangeError(`probability must be in (0, 1), got ${probability}`)
  }
  requirePositive('degreesOfFreedom', degreesOfFreedom)
  if (probability === 0.5) return 0
  // bracket then bisect: the CDF is monotone, 200 halvings reach double precision
  let lo = -1
  let hi = 1
  while (studentTCdf(lo, degreesOfFreedom) > probability) lo *= 2
  while (studentTCdf(hi, degreesOfFreedom) < probability) hi *= 2
  for (let i = 0; i < 200 && hi - lo > 1e-14 * Math.max(1, Math.abs(hi)); i++) {
    const mid = (lo + hi) / 2
    if (studentTCdf(mid, degreesOfFreedom) < probability) lo = mid
    else hi = mid
  }
  return (lo + hi) / 2
}
