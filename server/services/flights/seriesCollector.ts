import type { FlightSamples } from '../../../shared/analysis/types.js'
import type { SampleRow } from '../../../shared/import/rowConverter.js'

/** Most samples handed to the analysis; longer flights are thinned keeping the weaker sample of each pair. */
export const ANALYSIS_MAX_SAMPLES = 131_072

const FIELDS = ['t', 'lat', 'lon', 'alt', 'r1', 'r2', 'lq', 'snr'] as const
type Field = (typeof FIELDS)[number]

function best(r1: number, r2: number): number {
  const b = r2 > r1 || r1 !== r1 ? r2 : r1
  return b === b ? b : -Infinity
}

/**
 * Collects the analysis arrays while rows stream past, so the analysis never reads the samples back. Memory stays
 * bounded: past the cap, neighbouring samples are merged keeping the weaker signal (dropouts survive thinning).
 */
export class SeriesCollector {
  private a: Record<Field, Float64Array>
  private n = 0
  private stride = 1
  private inGroup = 0
  private cand = new Float64Array(8)
  private has = { alt: false, r2: false, lq: false, snr: false }
  /** Rows offered, before thinning. */
  offered = 0

  constructor(private readonly cap = ANALYSIS_MAX_SAMPLES) {
    this.a = alloc(Math.min(4096, cap))
  }

  /** Offers one converted row. */
  add(r: SampleRow): void {
    this.offered++
    if (r.altM === r.altM) this.has.alt = true
    if (r.rssi2Dbm === r.rssi2Dbm) this.has.r2 = true
    if (r.lq === r.lq) this.has.lq = true
    if (r.snr === r.snr) this.has.snr = true
    if (this.stride === 1) {
      this.push(r.tMs, r.lat, r.lon, r.altM, r.rssi1Dbm, r.rssi2Dbm, r.lq, r.snr)
      return
    }
    const c = this.cand
    if (this.inGroup === 0 || best(r.rssi1Dbm, r.rssi2Dbm) < best(c[4]!, c[5]!)) {
      c[0] = r.tMs
      c[1] = r.lat
      c[2] = r.lon
      c[3] = r.altM
      c[4] = r.rssi1Dbm
      c[5] = r.rssi2Dbm
      c[6] = r.lq
      c[7] = r.snr
    }
    if (++this.inGroup === this.stride) this.flushGroup()
  }

  /** The collected arrays (views, no copy); optional series only when the log had them. */
  samples(): FlightSamples & { thinnedBy: number } {
    if (this.inGroup) this.flushGroup()
    const v = (f: Field) => this.a[f].subarray(0, this.n)
    return {
      timeMs: v('t'),
      latDeg: v('lat'),
      lonDeg: v('lon'),
      altM: this.has.alt ? v('alt') : new Float64Array(this.n),
      rssiDbm: v('r1'),
      ...(this.has.r2 ? { rssi2Dbm: v('r2') } : {}),
      ...(this.has.lq ? { lqPct: v('lq') } : {}),
      ...(this.has.snr ? { snrDb: v('snr') } : {}),
      thinnedBy: this.stride,
    }
  }

  private flushGroup(): void {
    const c = this.cand
    this.inGroup = 0
    this.push(c[0]!, c[1]!, c[2]!, c[3]!, c[4]!, c[5]!, c[6]!, c[7]!)
  }

  private push(t: number, lat: number, lon: number, alt: number, r1: number, r2: number, lq: number, snr: number): void {
    if (this.n === this.a.t.length) {
      if (this.a.t.length < this.cap) this.grow()
      else this.halve()
    }
    const i = this.n++
    const a = this.a
    a.t[i] = t
    a.lat[i] = lat
    a.lon[i] = lon
    a.alt[i] = alt
    a.r1[i] = r1
    a.r2[i] = r2
    a.lq[i] = lq
    a.snr[i] = snr
  }

  private grow(): void {
    const next = alloc(Math.min(this.cap, this.a.t.length * 2))
    for (const f of FIELDS) next[f].set(this.a[f].subarray(0, this.n))
    this.a = next
  }

  /** Merges neighbouring pairs, keeping the weaker-signal sample, and doubles the stride for new rows. */
  private halve(): void {
    const a = this.a
    let w = 0
    for (let i = 0; i + 1 < this.n; i += 2) {
      const k = best(a.r1[i + 1]!, a.r2[i + 1]!) < best(a.r1[i]!, a.r2[i]!) ? i + 1 : i
      for (const f of FIELDS) a[f][w] = a[f][k]!
      w++
    }
    this.n = w
    this.stride *= 2
  }
}

function alloc(len: number): Record<Field, Float64Array> {
  return Object.fromEntries(FIELDS.map((f) => [f, new Float64Array(len)])) as Record<Field, Float64Array>
}
