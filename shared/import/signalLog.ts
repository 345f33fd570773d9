import { z } from 'zod'
import { DELIMITERS, TIME_FORMATS } from './mapping.js'
import { parseDateTimeCells, parseNumberCell, parseTimeCell } from './cellValues.js'
import { LQ_PCT_RANGE, SIGNAL_DBM_RANGE, SNR_DB_RANGE, type RowProblem } from './rowConverter.js'

/** Roles a separate signal log (beside a GPX track) may map. */
export const SIGNAL_LOG_ROLES = ['time', 'date', 'rssi1', 'rssi2', 'lq', 'snr', 'ignore'] as const

/** How to read a signal log: time plus signal columns, no position. */
export const signalLogMappingSchema = z
  .object({
    delimiter: z.enum(DELIMITERS),
    decimalComma: z.boolean(),
    columns: z.array(z.object({ index: z.number().int().min(0).max(999), name: z.string().max(200), role: z.enum(SIGNAL_LOG_ROLES) })).min(2).max(1000),
    timeFormat: z.enum(TIME_FORMATS),
  })
  .superRefine((m, ctx) => {
    for (const r of ['time', 'rssi1'] as const) {
      if (m.columns.filter((c) => c.role === r).length !== 1) ctx.addIssue({ code: 'custom', path: ['columns'], message: `Choose one ${r} column` })
    }
    if (m.timeFormat === 'date+time' && m.columns.filter((c) => c.role === 'date').length !== 1) {
      ctx.addIssue({ code: 'custom', path: ['columns'], message: 'Date and time columns need one date column' })
    }
  })
export type SignalLogMapping = z.infer<typeof signalLogMappingSchema>

/** One converted signal-log row; NaN where not logged. */
export interface SignalRow {
  /** Time as written: epoch ms for absolute formats, ms from the log's start for relative ones. */
  timeMs: number
  rssi1Dbm: number
  rssi2Dbm: number
  lq: number
  snr: number
}

/** Whether a time format gives wall-clock time (so it can be matched to GPX timestamps). */
export function isAbsoluteTime(format: SignalLogMapping['timeFormat']): boolean {
  return format !== 'ms-from-start' && format !== 's-from-start'
}

/**
 * Converts and validates the rows of a separate signal log (time never going backwards, signal in dBm).
 */
export class SignalRowConverter {
  private readonly idx: Partial<Record<(typeof SIGNAL_LOG_ROLES)[number], { index: number; name: string }>> = {}
  private lastT = -Infinity

  /**
   * @param mapping signal-log mapping
   * @param header header cells
   * @throws Error naming the first mapped column missing from the header
   */
  constructor(
    private readonly mapping: SignalLogMapping,
    header: readonly string[],
  ) {
    const names = header.map((h) => h.trim().toLowerCase())
    for (const c of mapping.columns) {
      if (c.role === 'ignore') continue
      const want = c.name.trim().toLowerCase()
      const index = names[c.index] === want ? c.index : names.indexOf(want)
      if (index < 0) throw new Error(`The signal log has no column "${c.name}"`)
      this.idx[c.role] = { index, name: c.name }
    }
  }

  /**
   * @param fields cells of one row
   * @param out reused result
   * @returns 'ok' or the problem
   */
  convert(fields: readonly string[], out: SignalRow): 'ok' | RowProblem {
    const m = this.mapping
    const dc = m.decimalComma
    const i = this.idx
    const t =
      m.timeFormat === 'date+time'
        ? parseDateTimeCells(fields[i.date!.index] ?? '', fields[i.time!.index] ?? '')
        : parseTimeCell(fields[i.time!.index] ?? '', m.timeFormat, dc)
    if (!Number.isFinite(t)) return { column: i.time!.name, reason: 'time is missing or unreadable' }
    if (t < this.lastT) return { column: i.time!.name, reason: 'time goes backwards' }
    const r1 = parseNumberCell(fields[i.rssi1!.index] ?? '', dc)
    if (!(r1 >= SIGNAL_DBM_RANGE[0] && r1 <= SIGNAL_DBM_RANGE[1])) {
      return { column: i.rssi1!.name, reason: `signal must be a number in [${SIGNAL_DBM_RANGE.join(', ')}] dBm` }
    }
    const opt = (role: 'rssi2' | 'lq' | 'snr', range: readonly [number, number]): number | null => {
      const slot = i[role]
      if (!slot) return NaN
      const cell = fields[slot.index] ?? ''
      if (cell.trim() === '') return NaN
      const v = parseNumberCell(cell, dc)
      return v >= range[0] && v <= range[1] ? v : null
    }
    const r2 = opt('rssi2', SIGNAL_DBM_RANGE)
    const lq = opt('lq', LQ_PCT_RANGE)
    const snr = opt('snr', SNR_DB_RANGE)
    if (r2 === null) return { column: i.rssi2!.name, reason: 'signal out of range' }
    if (lq === null) return { column: i.lq!.name, reason: 'link quality must be in [0, 100]' }
    if (snr === null) return { column: i.snr!.name, reason: 'SNR out of range' }
    this.lastT = t
    out.timeMs = t
    out.rssi1Dbm = r1
    out.rssi2Dbm = r2
    out.lq = lq
    out.snr = snr
    return 'ok'
  }
}
