import type { ListResult } from '@shared/types/api'
import type { FlightAnalysis } from '@shared/analysis/types'
import type { ColumnMapping } from '@shared/import/mapping'
import type { SignalLogMapping } from '@shared/import/signalLog'
import type {
  FlightDetailDto,
  FlightDto as SharedFlightDto,
  FlightSamplesDto,
  FlightStatus,
  FlightStatusDto,
} from '@shared/types/flight'
import { apiDelete, apiGet, apiPatch, apiPost, upload, type UploadProgress } from './client'

export type { FlightStatus, ImportProgress, FlightStatusDto } from '@shared/types/flight'

/** A flight as lists show it (shared FlightDto). */
export type FlightListItemDto = SharedFlightDto

/** One flight with its analysis typed, as the flight screen reads it. */
export interface FlightDetail extends Omit<FlightDetailDto, 'analysis'> {
  analysis: FlightAnalysis | null
}
/** Kept for callers written against the first version of this module: a flight with its analysis. */
export type FlightDto = FlightDetail

/** Decimated samples of a time window, as parallel columns (null where a value was not logged). */
export type SamplesDto = Omit<FlightSamplesDto, 'total' | 'decimated' | 'lat' | 'lon'> & {
  lat: (number | null)[]
  lon: (number | null)[]
  total?: number
  decimated?: boolean
}

export interface FlightListQuery {
  courseId?: number
  setupId?: number
  from?: string
  to?: string
  q?: string
  /** A key of flownOn, name, createdAt, rowCount; a leading '-' sorts descending. */
  sort?: string
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
  /** How to read a GPX track's separate signal log; required with one. */
  signalMapping?: SignalLogMapping | null
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

export function getFlight(id: number): Promise<FlightDetail> {
  return apiGet(`/flights/${id}`)
}

export function getFlightStatus(id: number): Promise<FlightStatusDto> {
  return apiGet(`/flights/${id}/status`)
}

/** Samples of [fromMs, toMs] (toMs undefined: to the end), decimated to at most maxPoints. */
export function getSamples(id: number, fromMs: number, toMs: number | undefined, maxPoints: number): Promise<SamplesDto> {
  const to = toMs === undefined ? undefined : Math.ceil(toMs)
  return apiGet(`/flights/${id}/samples${query({ fromMs: Math.floor(fromMs), toMs: to, maxPoints })}`)
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
  if (signalFile && fields.signalMapping) form.append('signalMapping', JSON.stringify(fields.signalMapping))
  // files last: multer sees the fields first
  form.append('file', file, file.name)
  if (signalFile) form.append('signalFile', signalFile, signalFile.name)
  return upload('/flights', form, onProgress)
}

export function updateFlight(id: number, patch: FlightUpdate): Promise<FlightDetail> {
  return apiPatch(`/flights/${id}`, patch)
}

export function deleteFlight(id: number): Promise<void> {
  return apiDelete(`/flights/${id}`)
}

export function reanalyseFlight(id: number): Promise<FlightStatusDto> {
  return apiPost(`/flights/${id}/reanalyse`)
}
