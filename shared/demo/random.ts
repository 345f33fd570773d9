/** A seeded pseudo-random source: uniform and standard-normal draws. */
export interface SeededRandom {
  /** Uniform draw in [0, 1). */
  uniform(): number
  /** Standard normal draw (mean 0, standard deviation 1). */
  normal(): number
}

/**
 * Creates a deterministic random source (mulberry32 with a Box–Muller normal), so demo data is the same every run.
 * @param seed any 32-bit integer
 * @returns the random source
 * @throws RangeError when seed is not an integer
 */
export function createSeededRandom(seed: number): SeededRandom {
  if (!Number.isInteger(seed)) throw new RangeError(`seed must be an integer, got ${seed}`)
  let state = seed >>> 0
  const uniform = (): number => {
    // mulberry32 (public-domain 32-bit generator)
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
  let spare: number | null = null
  const normal = (): number => {
    if (spare !== null) {
      const s = spare
      spare = null
      return s
    }
    // Box–Muller transform; 1 − u keeps the logarithm finite
    const u = 1 - uniform()
    const v = uniform()
    const r = Math.sqrt(-2 * Math.log(u))
    spare = r * Math.sin(2 * Math.PI * v)
    return r * Math.cos(2 * Math.PI * v)
  }
  return { uniform, normal }
}
