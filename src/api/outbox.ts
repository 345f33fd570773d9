import type { ListResult, OutboxMessageDto } from '@shared/types/api'
import { ApiError, apiGet } from './client'

/** Messages caught by the local mail sink; null when the sink is off (404) or the user may not read it. */
export async function listOutbox(): Promise<ListResult<OutboxMessageDto> | null> {
  try {
    return await apiGet<ListResult<OutboxMessageDto>>('/dev/outbox')
  } catch (e) {
    if (e instanceof ApiError && (e.status === 404 || e.status === 403)) return null
    throw e
  }
}
