import type { ZodType } from 'zod'
import { badRequest } from '../errors.js'

/** Parses a value with a shared zod schema or throws 400 VALIDATION_FAILED naming each field. */
export function parseWith<T>(schema: ZodType<T>, value: unknown): T {
  const r = schema.safeParse(value)
  if (r.success) return r.data
  throw badRequest(
    'Invalid input',
    r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })),
  )
}

/** Parses a positive integer id from a route parameter. */
export function parseId(raw: unknown, name = 'id'): number {
  const s = String(raw ?? '')
  if (!/^\d{1,15}$/.test(s) || Number(s) < 1) throw badRequest(`Invalid ${name}`, [{ path: name, message: 'must be a positive integer' }])
  return Number(s)
}
