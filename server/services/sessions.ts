import { pgPool } from '../db.js'

/**
 * Ends every stored session of a user (sign-outs everywhere), except the one with `exceptSid`.
 * @returns how many sessions were ended
 */
export async function endUserSessions(userId: number, exceptSid: string | null = null): Promise<number> {
  const r = await pgPool().query(
    `DELETE FROM "session" WHERE (sess->'passport'->>'user') = $1 AND ($2::text IS NULL OR sid <> $2)`,
    [String(userId), exceptSid],
  )
  return r.rowCount ?? 0
}
