import type { ColumnMapping } from '../import/mapping.js'
import type { SignalLogMapping } from '../import/signalLog.js'
import type { RowReportDto } from '../import/rowReport.js'
import type { FieldIssue, ErrorCode } from './api.js'

export type FlightStatus = 'queued' | 'importing' | 'analysing' | 'ready' | 'failed'
export type ImportStatus = FlightStatus
export type SourceFormat = 'delimited' | 'gpx'

/** How far an import has got. */
export interface ImportProgress {
  bytesDone: number
  bytesTotal: number
  rowsDone: number
}

/** Why an import or analysis failed, in the API's error shape plus the HTTP status it maps to. */
export interface ImportFailure {
  status: number
  code: ErrorCode
  message: string
  details?: FieldIssue[]
}

/** The metadata an upload carries, kept with the import job. */
export interface ImportParams {
  courseId: number
  setupId: number
  name: string
  flownOn: string
  notes: string
  mapping: ColumnMapping | null
  /** Whether the file the job reads is gzip-compressed. */
  compressed?: boolean
  /** Server-side path of a separate signal log for a GPX track without signal values. */
  signalFile?: string | null
  signalCompressed?: boolean
  signalMapping?: SignalLogMapping | null
}

/** GET /api/flights/:id/status */
export interface FlightStatusDto {
  id: number
  status: FlightStatus
  progress: ImportProgress
  failure: ImportFailure | null
  /** True once the flight's samples are committed (it shows in lists). */
  stored: boolean
}

/** A flight in lists and on its own (analysis only on its own). */
export interface FlightDto {
  id: number
  courseId: number
  setupId: number
  createdBy: number | null
  name: string
  flownOn: string
  notes: string
  status: FlightStatus
  failureReason: string | null
  rowCount: number
  badRowCount: number
  sourceFormat: SourceFormat
  analysisVersion: string | null
  createdAt: string
  updatedAt: string
}

export interface FlightDetailDto extends FlightDto {
  mapping: ColumnMapping | null
  rowErrors: RowReportDto | null
  analysis: unknown
}

/** GET /api/flights/:id/samples: columnar, decimated; null where a value was not logged. */
export interface FlightSamplesDto {
  total: number
  decimated: boolean
  tMs: number[]
  lat: number[]
  lon: number[]
  altM: (number | null)[]
  rssi1Dbm: (number | null)[]
  rssi2Dbm: (number | null)[]
  lq: (number | null)[]
  snr: (number | null)[]
  distM: (number | null)[]
}
