/** Error codes of the API's one error shape. */
export type ErrorCode =
  | 'VALIDATION_FAILED'
  | 'UNAUTHENTICATED'
  | 'FORBIDDEN'
  | 'NOT_FOUND'
  | 'CONFLICT'
  | 'PAYLOAD_TOO_LARGE'
  | 'UNSUPPORTED_MEDIA_TYPE'
  | 'UNPROCESSABLE'
  | 'RATE_LIMITED'
  | 'CSRF_FAILED'
  | 'UNAVAILABLE'
  | 'INTERNAL'

/** One problem with one field, row or column. */
export interface FieldIssue {
  path: string
  message: string
  row?: number
  column?: string
}

export interface ApiErrorBody {
  error: { code: ErrorCode; message: string; details?: FieldIssue[] }
}

export interface ListResult<T> {
  items: T[]
  total: number
}

export type Role = 'admin' | 'pilot' | 'instructor' | 'viewer'
export const ROLES: readonly Role[] = ['admin', 'instructor', 'pilot', 'viewer']
export type UnitSystem = 'metric' | 'imperial'

export interface TeamRef {
  id: number
  name: string
  role: Role
}

export interface MeDto {
  id: number
  email: string
  name: string
  units: UnitSystem
  currentTeamId: number
  teams: TeamRef[]
}

export interface MemberDto {
  userId: number
  email: string
  name: string
  role: Role
}

export interface InviteDto {
  id: number
  email: string
  role: Role
  expiresAt: string
  acceptedAt: string | null
}

export interface OutboxMessageDto {
  id: number
  to: string
  subject: string
  text: string
  receivedAt: string
}

export interface HealthDto {
  status: 'ok' | 'degraded'
  database: 'up' | 'down'
  time: string
}
