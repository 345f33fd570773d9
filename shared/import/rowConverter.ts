import type { ColumnMapping, ColumnRole } from './mapping.js'
import { isPlainNumberText, parseDateTimeCells, parseNumberCell, parseTimeCell } from './cellValues.js'

const FT_TO_M = 0.3048

/** Plausible ranges; a value outside is a bad row, not a clipped value. */
export const SIGNAL_DBM_RANGE = [-150, 20] as const
export const LQ_PCT_RANGE = [0, 100] as const
export const SNR_DB_RANGE = [-60, 80] as const
export const ALT_M_RANGE = [-1000, 20_000] as const

/** Converted values of one row; NaN marks a value the row does not have. */
export interface SampleRow {
  /** ms from the first stored row. */
  tMs: number
  lat: number
  lon: number
  altM: number
  rssi1Dbm: number
  rssi2Dbm: number
  lq: number
  snr: number
  /** Extra columns as written, as a JSON object text, or null when the mapping keeps none. */
  extrasJson: string | null
  /** The cells as written when they can be stored unchanged (plain decimal text in final units), else null. */
  text: SampleText
}

/** Cell text usable as stored value, per field; null means "format the number". */
export interface SampleText {
  lat: string | null
  lon: string | null
  altM: string | null
  rssi1Dbm: string | null
  rssi2Dbm: string | null
  lq: string | null
  snr: string | null
}

/** Why a row was refused, naming the column. */
export interface RowProblem {
  column: string
  reason: string
}

/** Outcome of converting one row. */
export type RowOutcome = 'ok' | 'no-fix' | RowProblem

export interface RowConverterOptions {
  /** Ground elevation at the station, m AMSL; used when altitude is above sea level. */
  groundElevM: number
}

/** Where a converter reads its cells; extraKeys[i] is the JSON text written before extra i's value (`{"name":`). */
export interface ConverterLayout {
  slots: Partial<Record<ColumnRole, number>>
  extras: number[]
  extraKeys: string[]
  headerCount: number
}

/** A mapped column that the header does not have. */
export class MappingMismatchError extends Error {
  constructor(public column: string) {
    super(`The file has no column "${column}" that the mapping uses`)
  }
}

interface Slot {
  index: number
  name: string
}

/**
 * Converts and validates delimited rows under a column mapping: units to metres and dBm, time to ms from the first
 * row, range checks, time never going backwards, and leading rows without a GPS fix (0, 0) skipped.
 */
export class RowConverter {
  private readonly slot: Partial<Record<ColumnRole, Slot>> = {}
  private readonly extras: Slot[] = []
  private extraKeys: string[] = []
  private readonly needed: number
  private readonly headerCount: number
  private t0 = NaN
  private lastT = -Infinity
  private stored = 0

  /**
   * @param mapping the confirmed mapping
   * @param header header cells of this file
   * @param options ground elevation for AMSL altitudes
   * @throws MappingMismatchError when a mapped column is not in the header
   */
  constructor(
    private readonly mapping: ColumnMapping,
    header: readonly string[],
    private readonly options: RowConverterOptions,
  ) {
    const names = header.map((h) => h.trim().toLowerCase())
    let needed = 0
    for (const c of mapping.columns) {
      if (c.role === 'ignore') continue
      const want = c.name.trim().toLowerCase()
      const index = names[c.index] === want ? c.index : names.indexOf(want)
      if (index < 0) throw new MappingMismatchError(c.name)
      const s = { index, name: c.name }
      if (c.role === 'extra') this.extras.push(s)
      else this.slot[c.role] = s
      needed = Math.max(needed, index + 1)
    }
    this.needed = needed
    this.headerCount = header.length
    this.extraKeys = this.extras.map((e, i) => `${i ? ',' : '{'}${JSON.stringify(e.name)}:`)
  }

  /** Rows accepted so far. */
  get rowsAccepted(): number {
    return this.stored
  }

  /**
   * Converts one row into `out`; on a problem `out` is left partly written and must be ignored.
   * @param fields the row's cells
   * @param out reused result object
   * @returns 'ok', 'no-fix' for a leading row without a GPS fix, or the problem
   */
  convert(fields: readonly string[], out: SampleRow): RowOutcome {
    if (fields.length < this.needed) {
      return { column: '*', reason: `has ${fields.length} fields, the mapping needs ${this.needed}` }
    }
    if (fields.length > this.headerCount && !onlyBlanksFrom(fields, this.headerCount)) {
      return { column: `#${this.headerCount + 1}`, reason: `has ${fields.length} fields, the header has ${this.headerCount}` }
    }
    const m = this.mapping
    const dc = m.decimalComma
    const s = this.slot
    const lat = parseNumberCell(fields[s.lat!.index]!, dc)
    if (!(lat >= -90 && lat <= 90)) return problem(s.lat!, fields, 'latitude must be a number in [-90, 90]')
    const lon = parseNumberCell(fields[s.lon!.index]!, dc)
    if (!(lon >= -180 && lon <= 180)) return problem(s.lon!, fields, 'longitude must be a number in [-180, 180]')
    if (lat === 0 && lon === 0) {
      return this.stored === 0 ? 'no-fix' : { column: s.lat!.name, reason: 'no GPS fix (0, 0)' }
    }
    const abs =
      m.timeFormat === 'date+time'
        ? parseDateTimeCells(fields[s.date!.index]!, fields[s.time!.index]!)
        : parseTimeCell(fields[s.time!.index]!, m.timeFormat, dc)
    if (!Number.isFinite(abs)) return problem(s.time!, fields, 'time is missing or unreadable')
    const t = this.relativeTime(abs)
    if (Number.isNaN(t)) return { column: s.time!.name, reason: 'time goes backwards' }
    const rssi1 = this.signal(fields[s.rssi1!.index]!)
    if (Number.isNaN(rssi1)) return problem(s.rssi1!, fields, this.signalReason())
    let rssi2 = NaN
    if (s.rssi2) {
      const cell = fields[s.rssi2.index]!
      rssi2 = this.signal(cell)
      if (Number.isNaN(rssi2) && cell.trim() !== '') return { column: s.rssi2.name, reason: this.signalReason() }
    }
    const altM = s.alt ? this.altitude(fields[s.alt.index]!) : NaN
    if (s.alt && Number.isNaN(altM)) return problem(s.alt, fields, 'altitude must be a number in metres or feet')
    const lq = s.lq ? optional(fields[s.lq.index]!, dc, LQ_PCT_RANGE) : NaN
    if (lq === null) return { column: s.lq!.name, reason: 'link quality must be a number in [0, 100]' }
    const snr = s.snr ? optional(fields[s.snr.index]!, dc, SNR_DB_RANGE) : NaN
    if (snr === null) return { column: s.snr!.name, reason: 'SNR must be a number in [-60, 80] dB' }
    this.accept(abs, t)
    out.tMs = t
    out.lat = lat
    out.lon = lon
    out.altM = altM
    out.rssi1Dbm = rssi1
    out.rssi2Dbm = rssi2
    out.lq = lq
    out.snr = snr
    out.extrasJson = this.extras.length ? this.readExtras(fields) : null
    this.fillText(fields, out.text)
    return 'ok'
  }

  /** Column positions of the mapped roles and extras, for a scanner that reads cells itself (it must agree with convert()). */
  layout(): ConverterLayout {
    const slots: Partial<Record<ColumnRole, number>> = {}
    for (const [role, slot] of Object.entries(this.slot)) slots[role as ColumnRole] = slot.index
    return { slots, extras: this.extras.map((e) => e.index), extraKeys: [...this.extraKeys], headerCount: this.headerCount }
  }

  /**
   * Time from the first stored row for an absolute reading.
   * @returns ms, or NaN when the row would go backwards in time
   */
  relativeTime(abs: number): number {
    const t = this.stored === 0 ? 0 : abs - this.t0
    return t < this.lastT ? NaN : t
  }

  /** Records a row as stored (its absolute and relative time), for rows accepted by a caller's own fast check. */
  accept(abs: number, t: number): void {
    if (this.stored === 0) this.t0 = abs
    this.lastT = t
    this.stored++
  }

  /** Keeps cell text for values stored exactly as written (no unit change, no decimal comma, no spaces). */
  private fillText(fields: readonly string[], t: SampleText): void {
    const s = this.slot
    const m = this.mapping
    const dc = m.decimalComma
    t.lat = keepText(fields, s.lat, true, dc)
    t.lon = keepText(fields, s.lon, true, dc)
    t.altM = keepText(fields, s.alt, m.altUnit === 'm' && m.altReference === 'agl', dc)
    t.rssi1Dbm = keepText(fields, s.rssi1, m.signalUnit === 'dbm', dc)
    t.rssi2Dbm = keepText(fields, s.rssi2, m.signalUnit === 'dbm', dc)
    t.lq = keepText(fields, s.lq, true, dc)
    t.snr = keepText(fields, s.snr, true, dc)
  }

  private signal(cell: string): number {
    const v = parseNumberCell(cell, this.mapping.decimalComma)
    if (this.mapping.signalUnit === 'percent') {
      if (!(v >= 0 && v <= 100)) return NaN
      const pm = this.mapping.percentMap!
      return pm.pct0Dbm + (v / 100) * (pm.pct100Dbm - pm.pct0Dbm)
    }
    return v >= SIGNAL_DBM_RANGE[0] && v <= SIGNAL_DBM_RANGE[1] ? v : NaN
  }

  private signalReason(): string {
    return this.mapping.signalUnit === 'percent'
      ? 'signal must be a percentage in [0, 100]'
      : `signal must be a number in [${SIGNAL_DBM_RANGE[0]}, ${SIGNAL_DBM_RANGE[1]}] dBm`
  }

  private altitude(cell: string): number {
    let v = parseNumberCell(cell, this.mapping.decimalComma)
    if (this.mapping.altUnit === 'ft') v *= FT_TO_M
    if (this.mapping.altReference === 'amsl') v -= this.options.groundElevM
    return v >= ALT_M_RANGE[0] && v <= ALT_M_RANGE[1] ? v : NaN
  }

  private readExtras(fields: readonly string[]): string {
    let json = ''
    for (let i = 0; i < this.extras.length; i++) json += this.extraKeys[i]! + JSON.stringify(fields[this.extras[i]!.index] ?? '')
    return json + '}'
  }
}

// Module-level (not a closure per row): this runs for every cell of every row.
function keepText(fields: readonly string[], slot: Slot | undefined, asIs: boolean, dc: boolean): string | null {
  if (!slot || !asIs) return null
  const cell = fields[slot.index]!
  return isPlainNumberText(cell, dc) ? cell : null
}

function problem(slot: Slot, fields: readonly string[], reason: string): RowProblem {
  const cell = fields[slot.index] ?? ''
  return { column: slot.name, reason: cell.trim() === '' ? `${slot.name} is empty` : reason }
}

/** An optional numeric cell: NaN when blank, null when present but unreadable or out of range. */
function optional(cell: string, dc: boolean, range: readonly [number, number]): number | null {
  const v = parseNumberCell(cell, dc)
  if (Number.isNaN(v)) return cell.trim() === '' ? NaN : null
  return v >= range[0] && v <= range[1] ? v : null
}

/** True when every field from `start` on is blank (a trailing delimiter is harmless). */
function onlyBlanksFrom(fields: readonly string[], start: number): boolean {
  for (let i = start; i < fields.length; i++) if (fields[i]!.trim() !== '') return false
  return true
}

/** A fresh, reusable row object. */
export function emptySampleRow(): SampleRow {
  return {
    tMs: 0,
    lat: 0,
    lon: 0,
    altM: NaN,
    rssi1Dbm: NaN,
    rssi2Dbm: NaN,
    lq: NaN,
    snr: NaN,
    extrasJson: null,
    text: { lat: null, lon: null, altM: null, rssi1Dbm: null, rssi2Dbm: null, lq: null, snr: null },
  }
}
