import type { ListResult } from '@shared/types/api'
import type { ColumnMappingDto, SaveColumnMappingInput } from '@shared/import/mapping'
import { apiGet, apiPost } from './client'

/** The team's saved mappings; with a header signature, only those made for that header. */
export function listColumnMappings(signature?: string): Promise<ListResult<ColumnMappingDto>> {
  const q = signature ? `?signature=${encodeURIComponent(signature)}` : ''
  return apiGet(`/column-mappings${q}`)
}

export function saveColumnMapping(input: SaveColumnMappingInput): Promise<ColumnMappingDto> {
  return apiPost('/column-mappings', input)
}
