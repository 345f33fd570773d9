import type { ListResult } from '@shared/types/api'
import type { CourseDto, TerrainProfileDto } from '@shared/types/course'
import type { CourseInput, CourseListQuery } from '@shared/schemas/course'
import { apiDelete, apiGet, apiPost, apiPut, upload, type UploadProgress } from './client'

/** Query string of a list request; undefined values are left out. */
export function listQuery(q: Partial<Record<string, string | number | undefined>>): string {
  const params = new URLSearchParams()
  for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== '') params.set(k, String(v))
  const s = params.toString()
  return s ? `?${s}` : ''
}

export const listCourses = (q: Partial<CourseListQuery> = {}) =>
  apiGet<ListResult<CourseDto>>(`/courses${listQuery(q)}`)
export const getCourse = (id: number) => apiGet<CourseDto>(`/courses/${id}`)
export const createCourse = (input: CourseInput) => apiPost<CourseDto>('/courses', input)
export const updateCourse = (id: number, input: CourseInput) => apiPut<CourseDto>(`/courses/${id}`, input)
export const deleteCourse = (id: number) => apiDelete(`/courses/${id}`)

/** Uploads a GeoTIFF or .hgt file as the course's terrain, with progress. */
export function uploadTerrain(id: number, file: File, onProgress?: UploadProgress): Promise<CourseDto> {
  const form = new FormData()
  form.append('file', file, file.name)
  return upload<CourseDto>(`/courses/${id}/terrain`, form, onProgress)
}
export const deleteTerrain = (id: number) => apiDelete<CourseDto>(`/courses/${id}/terrain`)

/** The course terrain sampled at n evenly spaced points from one position to another; 404 without terrain. */
export function getTerrainProfile(
  id: number,
  from: { lat: number; lon: number },
  to: { lat: number; lon: number },
  n: number,
): Promise<TerrainProfileDto> {
  return apiGet<TerrainProfileDto>(
    `/courses/${id}/terrain/profile${listQuery({ fromLat: from.lat, fromLon: from.lon, toLat: to.lat, toLon: to.lon, n })}`,
  )
}
