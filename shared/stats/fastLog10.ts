// Table of log2(1 + j/TABLE_SIZE) and 1/(1 + j/TABLE_SIZE) for the mantissa step of fastLog10.
const TABLE_BITS = 10
const TABLE_SIZE = 1 << TABLE_BITS
const LOG2_TABLE = new Float64Array(TABLE_SIZE + 1)
const INV_TABLE = new Float64Array(TABLE_SIZE + 1)
for (let j = 0; j <= TABLE_SIZE; j++) {
  LOG2_TABLE[j] = Math.log2(1 + j / TABLE_SIZE)
  INV_TABLE[j] = 1 / (1 + j / TABLE_SIZE)
}
const POW2_NEG = new Float64Array(32)
for (let k = 0; k < 32; k++) POW2_NEG[k] = 2 ** -k
const LOG10_2 = Math.log10(2)
const INV_LN2 = 1 / Math.LN2

/**
 * Base-10 logarithm for hot loops over distances: table plus a short series, within 1e-13 of Math.log10.
 * @param x any number; values outside [1, 2³²) (and NaN) go through Math.log10
 * @returns log10(x)
 * @throws never
 */
export function fastLog10(x: number): number {
  if (!(x >= 1 && x < 4294967296)) return Math.log10(x)
  // x = 2^k·m with m in [1, 2): k from the leading-zero count of the integer part
  const k = 31 - Math.clz32(x)
  const m = x * POW2_NEG[k]!
  const f = (m - 1) * TABLE_SIZE
  const j = f | 0
  // m = (1 + j/T)(1 + u) with 0 <= u < 1/T; ln(1 + u) by its Taylor series to u⁴ (error < u⁵/5 ≈ 2e-16)
  const u = ((f - j) / TABLE_SIZE) * INV_TABLE[j]!
  const ln1pu = u * (1 - u * (0.5 - u * (1 / 3 - u * 0.25)))
  return (k + LOG2_TABLE[j]! + ln1pu * INV_LN2) * LOG10_2
}
