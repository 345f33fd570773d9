import type { ListResult } from '@shared/types/api'
import type { LinkSetupDto } from '@shared/types/setup'
import type { SetupInput, SetupListQuery } from '@shared/schemas/setup'
import { apiDelete, apiGet, apiPost, apiPut } from './client'
import { listQuery } from './courses'

export const listSetups = (q: Partial<SetupListQuery> = {}) =>
  apiGet<ListResult<LinkSetupDto>>(`/setups${listQuery(q)}`)
export const getSetup = (id: number) => apiGet<LinkSetupDto>(`/setups/${id}`)
export const listSetupVersions = (id: number) => apiGet<ListResult<LinkSetupDto>>(`/setups/${id}/versions`)
export const createSetup = (input: SetupInput) => apiPost<LinkSetupDto>('/setups', input)
export const updateSetup = (id: number, input: SetupInput) => apiPut<LinkSetupDto>(`/setups/${id}`, input)
export const deleteSetup = (id: number) => apiDelete(`/setups/${id}`)
