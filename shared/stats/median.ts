/**
 * Median of the finite values in a slice of a typed array (sorts a copy; NaN entries are skipped).
 * @param values samples in any unit; NaN entries are ignored
 * @param start first index, inclusive, >= 0 (default 0)
 * @param end last index, exclusive, <= values.length (default values.length)
 * @returns median in the unit of the values
 * @throws RangeError when the slice bounds are invalid or the slice holds no finite value
 */
export function medianOf(values: Float64Array, start = 0, end = values.length): number {
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end > values.length || start > end) {
    throw new RangeError(`start/end must satisfy 0 <= start <= end <= ${values.length}, got ${start}, ${end}`)
  }
  const copy = new Float64Array(end - start)
  let n = 0
  for (let i = start; i < end; i++) {
    const v = values[i]!
    if (Number.isFinite(v)) copy[n++] = v
  }
  if (n === 0) throw new RangeError('values must hold at least one finite value in the slice')
  const sorted = copy.subarray(0, n).sort()
  const mid = n >> 1
  return n % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2
}
