import type { ListResult } from '@shared/types/api'
import type { ComparisonInput, ComparisonPreviewInput } from '@shared/schemas/comparison'
import type { ComparisonDetailDto, ComparisonDto, ComparisonResultDto } from '@shared/types/comparison'
import { apiDelete, apiGet, apiPost, apiPut } from './client'

export const previewComparison = (input: ComparisonPreviewInput) =>
  apiPost<ComparisonResultDto>('/comparisons/preview', input)
export const listComparisons = () => apiGet<ListResult<ComparisonDto>>('/comparisons')
export const getComparison = (id: number) => apiGet<ComparisonDetailDto>(`/comparisons/${id}`)
export const createComparison = (input: ComparisonInput) => apiPost<ComparisonDto>('/comparisons', input)
export const updateComparison = (id: number, input: ComparisonInput) =>
  apiPut<ComparisonDto>(`/comparisons/${id}`, input)
export const deleteComparison = (id: number) => apiDelete(`/comparisons/${id}`)
