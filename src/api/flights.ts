import type { ListResult } from '@shared/types/api'
import type { FlightAnalysis } from '@shared/analysis/types'
import type { ColumnMapping } from '@shared/import/mapping'
import type { RowReportDto } from '@shared/import/rowReport'
import { apiDelete, apiGet, apiPatch, apiPost, upload, type UploadProgress } from './client'

// TODO(#4): move these DTOs to shared/types/flight.ts once the import side publishes its own there
export type FlightStatus = 'queued' | 'importing' | 'analysing' | 'ready' | 'failed'

export interface ImportProgress {
  bytesDone: number
  bytesTotal: number
  rowsDone: number
}

export interface FlightStatusDto {
  id: number
  status: FlightStatus
  progress: ImportProgress | null
  failureReason?: string | null
  rowErrors?: RowReportDto | null
}

export interface FlightListItemDto {
  id: number
  name: string
  flownOn: string
  courseId: number
  setupId: number
  status: FlightStatus
  rowCount: number | null
  courseName?: string
  setupName?: string
  pilotName?: string
  dropoutCount?: number | null
  maxDistanceWithLinkM?: number | null
  createdAt: string
}

export interface FlightDto extends FlightListItemDto {
  notes: string
  createdBy: number | null
  failureReason: string | null
  progress: ImportProgress | null
  badRowCount: number | null
  rowErrors: RowReportDto | null
  mapping: ColumnMapping | null
  sourceFormat: 'delimited' | 'gpx'
  analysis: FlightAnalysis | null
  analysisVersion: string | null
  updatedAt: string
}

/** Decimated samples of a time window, as parallel columns. */
export interface SamplesDto {
  tMs: number[]
  lat: (number | null)[]
  lon: (number | null)[]
  altM: (number | null)[]
  rssi1Dbm: (number | null)[]
  rssi2Dbm: (number | null)[]
  lq: (number | null)[]
  snr: (number | null)[]
  distM: (number | null)[]
}

export interface FlightListQuery {
  courseId?: number
  setupId?: number
  from?: string
  to?: string
  q?: string
  sort?: string
  order?: 'asc' | 'desc'
  page?: number
  pageSize?: number
}

/** The metadata fields sent with the file. */
export interface NewFlightFields {
  courseId: number
  setupId: number
  name: string
  flownOn: string
  notes: string
  mapping: ColumnMapping | null
}

export interface FlightUpdate {
  name?: string
  flownOn?: string
  notes?: string
  courseId?: number
  setupId?: number
}

function query(params: object): string {
  const q = new URLSearchParams()
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') q.set(k, String(v))
  const s = q.toString()
  return s ? `?${s}` : ''
}

export function listFlights(params: FlightListQuery): Promise<ListResult<FlightListItemDto>> {
  return apiGet(`/flights${query(params)}`)
}

export function getFlight(id: number): Promise<FlightDto> {
  return apiGet(`/flights/${id}`)
}

export function getFlightStatus(id: number): Promise<FlightStatusDto> {
  return apiGet(`/flights/${id}/status`)
}

export function getSamples(id: number, fromMs: number, toMs: number, maxPoints: number): Promise<SamplesDto> {
  return apiGet(`/flights/${id}/samples${query({ fromMs: Math.floor(fromMs), toMs: Math.ceil(toMs), maxPoints })}`)
}

/** Sends the log (and, for GPX, an optional separate signal log) with the form fields; 202 {id, status}. */
export function createFlight(
  fields: NewFlightFields,
  file: File,
  signalFile: File | null,
  onProgress?: UploadProgress,
): Promise<{ id: number; status: FlightStatus }> {
  const form = new FormData()
  form.append('courseId', String(fields.courseId))
  form.append('setupId', String(fields.setupId))
  form.append('name', fields.name)
  form.append('flownOn', fields.flownOn)
  form.append('notes', fields.notes)
  if (fields.mapping) form.append('mapping', JSON.stringify(fields.mapping))
  // files last: multer sees the fields first
  form.append('file', file, file.name)
  if (signalFile) form.append('signalFile', signalFile, signalFile.name)
  return upload('/flights', form, onProgress)
}

export function updateFlight(id: number, patch: FlightUpdate): Promise<FlightDto> {
  return apiPatch(`/flights/${id}`, patch)
}

export function deleteFlight(id: number): Promise<void> {
  return apiDelete(`/flights/${id}`)
}

export function reanalyseFlight(id: number): Promise<FlightStatusDto> {
  return apiPost(`/flights/${id}/reanalyse`)
}
