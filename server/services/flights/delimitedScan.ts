import { distanceFromStation } from './stationDistance.js'
import type { ColumnMapping } from '../../../shared/import/mapping.js'
import { RecordError, RecordSplitter } from '../../../shared/import/recordSplitter.js'
import { MappingMismatchError, RowConverter, emptySampleRow, type SampleRow } from '../../../shared/import/rowConverter.js'
import { RowReport } from '../../../shared/import/rowReport.js'
import { unprocessable } from './importErrors.js'
import type { TextChunk } from './source.js'

/** Header columns accepted at most. */
export const MAX_COLUMNS = 1000
/** Longest record accepted, characters. */
export const MAX_RECORD_CHARS = 64 * 1024

/** Where accepted rows go: COPY during an import, nowhere during a pre-check. */
export interface RowSink {
  row(seq: number, r: SampleRow, distM: number): void
  /** Called after each input chunk; may wait for the database. */
  afterChunk(bytesRead: number, rowsDone: number): Promise<void>
}

export interface ScanOptions {
  mapping: ColumnMapping
  groundElevM: number
  station: { latDeg: number; lonDeg: number }
  /** The text is a cut-off head of the file (pre-check): the last line may be incomplete, so it is not read. */
  partial?: boolean
}

export interface ScanResult {
  header: string[]
  report: RowReport
}

/**
 * Reads the header record and builds the row converter for it.
 * @throws 422 for too many columns or a mapped column the header lacks
 */
export function openConverter(fields: string[], opts: ScanOptions): { header: string[]; conv: RowConverter } {
  const header = fields.map((f) => f.trim())
  if (header.length > MAX_COLUMNS) {
    throw unprocessable(`The header has ${header.length} columns; at most ${MAX_COLUMNS} are read`, [
      { path: 'rows.1', message: 'too many columns', row: 1 },
    ])
  }
  try {
    return { header, conv: new RowConverter(opts.mapping, header, { groundElevM: opts.groundElevM }) }
  } catch (e) {
    if (e instanceof MappingMismatchError) {
      throw unprocessable(e.message, [{ path: 'mapping', message: e.message, row: 1, column: e.column }])
    }
    throw e
  }
}

/**
 * Streams a delimited log through the record splitter and the row converter, handing each good row (with its ground
 * distance from the station) to the sink and counting bad ones.
 * @throws 422 for a header that does not fit the mapping, too many columns, or an unreadable record
 */
export async function scanDelimited(chunks: AsyncIterable<TextChunk>, opts: ScanOptions, sink: RowSink): Promise<ScanResult> {
  const report = new RowReport()
  const out = emptySampleRow()
  const distM = distanceFromStation(opts.station.latDeg, opts.station.lonDeg)
  let header: string[] | null = null
  let conv: RowConverter | null = null
  let seq = 0
  const onRecord = (fields: string[], row: number) => {
    if (!conv) {
      ;({ header, conv } = openConverter(fields, opts))
      return
    }
    const outcome = conv.convert(fields, out)
    if (outcome === 'ok') {
      sink.row(seq++, out, distM(out.lat, out.lon))
      report.goodRows++
    } else if (outcome === 'no-fix') report.noFixRows++
    else report.bad(row, outcome.column, outcome.reason)
  }
  const splitter = new RecordSplitter({ delimiter: opts.mapping.delimiter, maxRecordChars: MAX_RECORD_CHARS }, onRecord)
  try {
    for await (const chunk of chunks) {
      splitter.push(chunk.text)
      await sink.afterChunk(chunk.bytesRead, seq)
    }
    if (!opts.partial) splitter.end()
  } catch (e) {
    if (e instanceof RecordError) throw unprocessable(e.message, [{ path: `rows.${e.row}`, message: e.message, row: e.row }])
    throw e
  }
  if (!header) throw unprocessable('The file is empty')
  return { header, report }
}
