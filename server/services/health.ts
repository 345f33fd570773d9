import type { HealthDto } from '../../shared/types/api.js'
import { databaseUp } from '../db.js'

/** Reports whether the database answers right now. */
export async function getHealth(): Promise<HealthDto> {
  const up = await databaseUp()
  return { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down', time: new Date().toISOString() }
}
