import type { TimeFormat } from './mapping.js'

// Exact powers of ten: a mantissa below 2^53 divided by one of these is correctly rounded, as Number() is
// (Clinger 1990, "How to read floating point numbers accurately", fast path).
const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i)

/** Plain `[-+]digits[.digits]` with at most 15 digits, read exactly; NaN for anything else (the caller falls back). */
function fastDecimal(s: string): number {
  const n = s.length
  let i = 0
  let c = s.charCodeAt(0)
  const neg = c === 45
  if (neg || c === 43) i = 1
  let mant = 0
  let digits = 0
  let frac = 0
  let dot = false
  for (; i < n; i++) {
    c = s.charCodeAt(i)
    if (c >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48)
      digits++
      if (dot) frac++
    } else if (c === 46 && !dot) dot = true
    else return NaN
  }
  if (digits === 0 || digits > 15) return NaN
  const v = frac ? mant / POW10[frac]! : mant
  return neg ? -v : v
}

/**
 * Reads a numeric cell strictly: decimal notation with optional sign and exponent; no hex, no Infinity, no blanks.
 * @param cell raw cell text
 * @param decimalComma true when the file writes `12,5` for 12.5
 * @returns the number, or NaN when the cell is empty or not a plain decimal number
 */
export function parseNumberCell(cell: string, decimalComma: boolean): number {
  let s = cell.length && (cell.charCodeAt(0) === 32 || cell.charCodeAt(cell.length - 1) === 32) ? cell.trim() : cell
  if (s.length === 0) return NaN
  if (decimalComma && s.indexOf(',') >= 0) s = s.replace(',', '.')
  const fast = fastDecimal(s)
  if (fast === fast) return fast
  const v = Number(s)
  if (!Number.isFinite(v)) return NaN
  // Number() also takes 0x10, 0b1, 0o7 and blanks; a letter in second place (other than an exponent) is one of those.
  if (s.length > 1) {
    const c = s.charCodeAt(1)
    if (c > 57 && c !== 101 && c !== 69) return NaN
  }
  return v
}

/**
 * Whether a cell that parsed as a number can go to the database as written (no spaces, no decimal comma), which
 * saves turning the number back into text.
 * @param cell raw cell text
 * @param decimalComma whether the file uses a decimal comma
 */
export function isPlainNumberText(cell: string, decimalComma: boolean): boolean {
  const n = cell.length
  return n > 0 && cell.charCodeAt(0) !== 32 && cell.charCodeAt(n - 1) !== 32 && !(decimalComma && cell.indexOf(',') >= 0)
}

const ZONE = /(?:[zZ]|[+-]\d\d:?\d\d)$/

/**
 * Reads an ISO-8601 timestamp; a timestamp without a zone is taken as UTC so results never depend on the reader's zone.
 * @param cell e.g. `2026-05-01T10:00:01.250Z` or `2026-05-01 10:00:01.25`
 * @returns epoch milliseconds, or NaN when unreadable
 */
export function parseIsoCell(cell: string): number {
  const s = cell.trim().replace(' ', 'T')
  if (s.length < 10 || !/^\d{4}-\d\d-\d\d/.test(s)) return NaN
  return Date.parse(ZONE.test(s) || s.length === 10 ? s : s + 'Z')
}

/**
 * Reads a date cell and a time-of-day cell: dates as 2026-05-01, 2026/05/01 or 01.05.2026; times as 10:00:01(.250).
 * @returns epoch milliseconds (UTC), or NaN when either part is unreadable
 */
export function parseDateTimeCells(dateCell: string, timeCell: string): number {
  const d = dateCell.trim()
  let iso: string
  let m = /^(\d{4})[-/](\d{1,2})[-/](\d{1,2})$/.exec(d)
  if (m) iso = `${m[1]}-${m[2]!.padStart(2, '0')}-${m[3]!.padStart(2, '0')}`
  else {
    m = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/.exec(d)
    if (!m) return NaN
    iso = `${m[3]}-${m[2]!.padStart(2, '0')}-${m[1]!.padStart(2, '0')}`
  }
  const t = /^(\d{1,2}):(\d\d):(\d\d)(?:[.,](\d{1,6}))?$/.exec(timeCell.trim())
  if (!t) return NaN
  const frac = t[4] ? `.${t[4].padEnd(3, '0').slice(0, 3)}` : ''
  return Date.parse(`${iso}T${t[1]!.padStart(2, '0')}:${t[2]}:${t[3]}${frac}Z`)
}

/**
 * Turns a time cell into milliseconds on the log's own clock (absolute or relative, as written).
 * @param cell raw cell text
 * @param format how the column is written (not 'date+time', which needs two cells)
 * @param decimalComma whether numbers use a decimal comma
 * @returns milliseconds, or NaN when unreadable
 */
export function parseTimeCell(cell: string, format: Exclude<TimeFormat, 'date+time'>, decimalComma: boolean): number {
  if (format === 'iso') return parseIsoCell(cell)
  const v = parseNumberCell(cell, decimalComma)
  return format === 's-from-start' || format === 'unix-s' ? v * 1000 : v
}
