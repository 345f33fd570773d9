import type { ColumnRole, TimeFormat } from './mapping.js'
import { parseDateTimeCells, parseIsoCell, parseNumberCell } from './cellValues.js'

/** A proposed role (and, for time, format) for each column. */
export interface RoleGuess {
  index: number
  name: string
  role: ColumnRole
}

export interface MappingGuess {
  columns: RoleGuess[]
  timeFormat: TimeFormat
  altUnit: 'm' | 'ft'
  signalUnit: 'dbm' | 'percent'
}

const NAME_RULES: ReadonlyArray<[ColumnRole, RegExp]> = [
  ['date', /^(date|datum|day)$/],
  ['time', /^(time|timestamp|t|ms|time_?ms|time_?s|elapsed|clock|datetime|utc)(\W.*)?$|time/],
  ['lat', /^(lat|latitude|gps_?lat)\b|lat(itude)?$/],
  ['lon', /^(lon|lng|long|longitude|gps_?lon)\b|lon(gitude)?$|lng$/],
  ['alt', /^(alt|altitude|height|elev|ele|gps_?alt|baro_?alt)|alt(itude)?(\W|_|$)/],
  ['rssi2', /(rssi|signal|rx)[\s_-]*(2|b)\b|ant(enna)?[\s_-]*2|rssi.?2/],
  ['rssi1', /(rssi|signal|rx[\s_-]*power|rxpwr|dbm)/],
  ['lq', /(^|\W|_)(lq|link[\s_-]*quality|rqly|quality)(\W|_|$)/],
  ['snr', /snr/],
]

/**
 * Proposes a role for each column from its name, then from its values (a column of ISO timestamps is time, numbers in
 * [-90, 90] next to numbers in [-180, 180] are latitude/longitude), plus units the values suggest.
 * @param header header cells
 * @param rows a few parsed data rows
 * @param decimalComma whether numbers use a decimal comma
 * @returns one guess per column (unrecognised ones become 'extra') and the likely time format and units
 */
export function guessMapping(header: readonly string[], rows: readonly string[][], decimalComma: boolean): MappingGuess {
  const used = new Set<ColumnRole>()
  const columns: RoleGuess[] = header.map((raw, index) => {
    const name = raw.replace(/^\uFEFF/, '').trim()
    const key = name.toLowerCase()
    for (const [role, re] of NAME_RULES) {
      if (!used.has(role) && re.test(key)) {
        used.add(role)
        return { index, name, role }
      }
    }
    return { index, name, role: 'extra' as ColumnRole }
  })
  const col = (i: number) => rows.map((r) => r[i] ?? '')
  if (!used.has('time')) {
    const c = columns.find((g) => g.role === 'extra' && col(g.index).every((v) => Number.isFinite(parseIsoCell(v))))
    if (c) c.role = 'time'
  }
  const timeCol = columns.find((g) => g.role === 'time')
  const dateCol = columns.find((g) => g.role === 'date')
  const timeFormat = timeCol ? guessTimeFormat(col(timeCol.index), dateCol ? col(dateCol.index) : null, decimalComma) : 'ms-from-start'
  if (timeFormat !== 'date+time' && dateCol) dateCol.role = 'extra'
  const alt = columns.find((g) => g.role === 'alt')
  const rssi = columns.find((g) => g.role === 'rssi1')
  const rssiValues = rssi ? col(rssi.index).map((v) => parseNumberCell(v, decimalComma)).filter(Number.isFinite) : []
  return {
    columns,
    timeFormat,
    altUnit: alt && /ft|feet/i.test(alt.name) ? 'ft' : 'm',
    signalUnit: rssiValues.length && rssiValues.every((v) => v >= 0 && v <= 100) && !/dbm/i.test(rssi!.name) ? 'percent' : 'dbm',
  }
}

/**
 * Guesses how a time column is written from its values.
 * @param values time cells
 * @param dates date cells when the file has a separate date column
 * @returns the most likely format
 */
export function guessTimeFormat(values: readonly string[], dates: readonly string[] | null, decimalComma: boolean): TimeFormat {
  const sample = values.filter((v) => v.trim() !== '')
  if (!sample.length) return 'ms-from-start'
  if (dates && sample.every((v, i) => Number.isFinite(parseDateTimeCells(dates[i] ?? '', v)))) return 'date+time'
  if (sample.every((v) => Number.isFinite(parseIsoCell(v)))) return 'iso'
  const nums = sample.map((v) => parseNumberCell(v, decimalComma))
  if (!nums.every(Number.isFinite)) return 'iso'
  const first = nums[0]!
  if (first > 1e11) return 'unix-ms'
  if (first > 1e8) return 'unix-s'
  const steps = nums.slice(1).map((v, i) => v - nums[i]!).filter((d) => d > 0)
  const typical = steps.length ? steps.sort((a, b) => a - b)[Math.floor(steps.length / 2)]! : 1
  return typical < 5 && nums.some((v) => !Number.isInteger(v)) ? 's-from-start' : 'ms-from-start'
}
