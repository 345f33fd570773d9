import Papa from 'papaparse'
import { detectLayout, type LayoutGuess } from '@shared/import/detect'
import { guessMapping } from '@shared/import/guessRoles'
import { headerSignature } from '@shared/import/headerSignature'
import { SINGLE_ROLES, type ColumnMapping, type ColumnRole } from '@shared/import/mapping'

/** How much of a log the preview reads: enough for a header and a screenful of rows. */
export const PREVIEW_BYTES = 64 * 1024
/** Data rows shown in the preview table. */
export const PREVIEW_ROWS = 8

/** The start of a delimited log as the form shows it. */
export interface LogPreview {
  layout: LayoutGuess
  header: string[]
  rows: string[][]
  signature: string
}

export type LogKind = 'delimited' | 'gpx' | 'unsupported'

/** What kind of log a file name says it is (.csv/.txt/.tsv, each optionally .gz, or .gpx). */
export function logKind(fileName: string): LogKind {
  const n = fileName.toLowerCase()
  if (/\.gpx(\.gz)?$/.test(n)) return 'gpx'
  if (/\.(csv|txt|tsv|log)(\.gz)?$/.test(n)) return 'delimited'
  return 'unsupported'
}

/**
 * Header and first rows of a log from its first kilobytes, with the layout detected by the shared
 * import rules (the server reads the file the same way).
 * @param text decoded start of the file; the last line may be cut off and is dropped
 * @param complete true when `text` is the whole file (then the last line is kept)
 */
export function previewFromText(text: string, complete: boolean): LogPreview {
  const layout = detectLayout(text)
  let body = text.replace(/^\uFEFF/, '')
  if (!complete) {
    const cut = Math.max(body.lastIndexOf('\n'), body.lastIndexOf('\r'))
    if (cut > 0) body = body.slice(0, cut)
  }
  const parsed = Papa.parse<string[]>(body, {
    delimiter: layout.delimiter,
    preview: PREVIEW_ROWS + 1,
    skipEmptyLines: 'greedy',
  })
  const [header = [], ...rows] = parsed.data
  const names = header.map((h) => h.trim())
  return { layout, header: names, rows, signature: headerSignature(names) }
}

/**
 * A full mapping proposal for a preview: roles guessed from names and values, units the values
 * suggest, the detected delimiter and decimal separator, and a neutral percent-to-dBm line.
 */
export function proposeMapping(p: LogPreview): ColumnMapping {
  const guess = guessMapping(p.header, p.rows, p.layout.decimalComma)
  return {
    delimiter: p.layout.delimiter,
    decimalComma: p.layout.decimalComma,
    columns: guess.columns.map((c) => ({ index: c.index, name: c.name, role: c.role })),
    altUnit: guess.altUnit,
    altReference: 'agl',
    signalUnit: guess.signalUnit,
    percentMap: guess.signalUnit === 'percent' ? { pct0Dbm: -110, pct100Dbm: -50 } : null,
    timeFormat: guess.timeFormat,
  }
}

/**
 * Reads the start of a file as text, gunzipping .gz files in the browser.
 * @returns the text and whether it is the whole file
 */
export async function readLogHead(file: File, maxBytes = PREVIEW_BYTES): Promise<{ text: string; complete: boolean }> {
  let stream: ReadableStream<Uint8Array> = file.stream()
  if (file.name.toLowerCase().endsWith('.gz')) stream = stream.pipeThrough(
      new DecompressionStream('gzip') as unknown as ReadableWritablePair<Uint8Array, Uint8Array>,
    )
  const reader = stream.getReader()
  // keep a byte-order mark in the text: the layout check reports it
  const decoder = new TextDecoder('utf-8', { ignoreBOM: true })
  let text = ''
  let total = 0
  let complete = false
  try {
    for (;;) {
      const { value, done } = await reader.read()
      if (done) {
        complete = true
        break
      }
      total += value.byteLength
      text += decoder.decode(value, { stream: true })
      if (total >= maxBytes) break
    }
  } finally {
    await reader.cancel().catch(() => undefined)
  }
  return { text, complete }
}

/**
 * Gives a column a role; a role that may be held once moves from its previous column, which
 * becomes "keep as extra", so the mapping never holds two latitude columns.
 */
export function assignRole(m: ColumnMapping, index: number, role: ColumnMapping['columns'][number]['role']): ColumnMapping {
  const single = SINGLE_ROLES.includes(role)
  const columns = m.columns.map((c) => {
    if (c.index === index) return { ...c, role }
    if (single && c.role === role) return { ...c, role: 'extra' as const }
    return c
  })
  const timeFormat = role === 'date' ? 'date+time' : m.timeFormat
  return { ...m, columns, timeFormat }
}

/** What each column role is called in the form. */
export const ROLE_LABELS: Record<ColumnRole, string> = {
  time: 'Time',
  date: 'Date (time in another column)',
  lat: 'Latitude',
  lon: 'Longitude',
  alt: 'Altitude',
  rssi1: 'Signal, antenna 1',
  rssi2: 'Signal, antenna 2',
  lq: 'Link quality (%)',
  snr: 'SNR (dB)',
  extra: 'Keep as extra',
  ignore: 'Leave out',
}

/** A shared-schema message with role ids ("rssi1") replaced by the names the form shows. */
export function friendlyMappingMessage(message: string): string {
  return message.replace(/\b(time|date|lat|lon|alt|rssi1|rssi2|lq|snr)\b(?= column)/g, (r) => `"${ROLE_LABELS[r as ColumnRole]}"`)
    .replace(/^Only one column may be (\w+)$/, (_m, r: string) => `Only one column may be "${ROLE_LABELS[r as ColumnRole] ?? r}"`)
}
