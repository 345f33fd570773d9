import type { ApiErrorBody, ErrorCode, FieldIssue } from '@shared/types/api'

/** Every path below is relative to this prefix: `request('/auth/me')` calls `/api/auth/me`. */
export const API_BASE = '/api'

const MUTATING = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

/** A non-2xx answer (or no answer at all: status 0) turned into one error type views can show. */
export class ApiError extends Error {
  readonly status: number
  readonly code: ErrorCode
  readonly details: FieldIssue[]

  constructor(status: number, code: ErrorCode, message: string, details: FieldIssue[] = []) {
    super(message)
    this.name = 'ApiError'
    this.status = status
    this.code = code
    this.details = details
  }
}

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'

let csrfToken: Promise<string> | null = null
let onUnauthenticated: ((path: string) => void) | null = null

/**
 * Registers what happens when a signed-in call answers 401 (the session ended elsewhere or
 * expired). Calls under /auth/ are exempt: there 401 means "wrong password" or "nobody".
 */
export function setUnauthenticatedHandler(handler: ((path: string) => void) | null): void {
  onUnauthenticated = handler
}

/** Forgets the CSRF token; the next state-changing request fetches a fresh one (after sign-in/out). */
export function resetCsrfToken(): void {
  csrfToken = null
}

async function fetchCsrfToken(): Promise<string> {
  const res = await rawFetch('GET', '/auth/csrf')
  const body = (await readJson(res)) as { token?: unknown } | null
  if (!res.ok || typeof body?.token !== 'string') throw toApiError(res.status, body)
  return body.token
}

function csrf(): Promise<string> {
  if (!csrfToken) {
    csrfToken = fetchCsrfToken()
    // a failed fetch must not stick: the next request tries again
    csrfToken.catch(() => (csrfToken = null))
  }
  return csrfToken
}

async function rawFetch(
  method: HttpMethod,
  path: string,
  body?: unknown,
  headers: Record<string, string> = {},
): Promise<Response> {
  const init: RequestInit = {
    method,
    credentials: 'same-origin',
    headers: { Accept: 'application/json', ...headers },
  }
  if (body !== undefined) {
    init.body = JSON.stringify(body)
    ;(init.headers as Record<string, string>)['Content-Type'] = 'application/json'
  }
  try {
    return await fetch(`${API_BASE}${path}`, init)
  } catch {
    throw new ApiError(0, 'UNAVAILABLE', 'Cannot reach the Ellipsoid server. Check your connection and try again.')
  }
}

async function readJson(res: Response): Promise<unknown> {
  if (res.status === 204) return null
  const text = await res.text()
  if (!text) return null
  try {
    return JSON.parse(text)
  } catch {
    return null
  }
}

const FALLBACK_MESSAGES: Record<number, [ErrorCode, string]> = {
  401: ['UNAUTHENTICATED', 'Please sign in.'],
  403: ['FORBIDDEN', 'Your role does not allow this.'],
  404: ['NOT_FOUND', 'Not found.'],
  429: ['RATE_LIMITED', 'Too many attempts. Wait a minute and try again.'],
  503: ['UNAVAILABLE', 'The server is not available right now. Try again shortly.'],
}

/** Maps a status and a (possibly missing or foreign) body onto an ApiError. */
export function toApiError(status: number, body: unknown): ApiError {
  const err = (body as Partial<ApiErrorBody> | null)?.error
  if (err && typeof err.message === 'string' && typeof err.code === 'string') {
    return new ApiError(status, err.code, err.message, Array.isArray(err.details) ? err.details : [])
  }
  const [code, message] = FALLBACK_MESSAGES[status] ?? [
    'INTERNAL',
    `The server answered with an unexpected error (HTTP ${status}).`,
  ]
  return new ApiError(status, code, message)
}

function isCsrfFailure(e: unknown): boolean {
  return e instanceof ApiError && e.status === 403 && e.code === 'CSRF_FAILED'
}

async function once<T>(method: HttpMethod, path: string, body?: unknown): Promise<T> {
  const headers: Record<string, string> = MUTATING.has(method) ? { 'X-CSRF-Token': await csrf() } : {}
  const res = await rawFetch(method, path, body, headers)
  const data = await readJson(res)
  if (!res.ok) {
    if (res.status === 401 && !path.startsWith('/auth/')) onUnauthenticated?.(path)
    throw toApiError(res.status, data)
  }
  return data as T
}

/**
 * Sends one JSON request to the API. State-changing methods carry the CSRF header; when the server
 * refuses the token (403 CSRF_FAILED, e.g. after the session changed) it is refetched and the request
 * retried once. Resolves with the parsed body (undefined for 204), rejects with ApiError.
 */
export async function request<T>(method: HttpMethod, path: string, body?: unknown): Promise<T> {
  try {
    return await once<T>(method, path, body)
  } catch (e) {
    if (!isCsrfFailure(e)) throw e
    resetCsrfToken()
    return once<T>(method, path, body)
  }
}

export const apiGet = <T>(path: string) => request<T>('GET', path)
export const apiPost = <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {})
export const apiPut = <T>(path: string, body?: unknown) => request<T>('PUT', path, body ?? {})
export const apiPatch = <T>(path: string, body?: unknown) => request<T>('PATCH', path, body ?? {})
export const apiDelete = <T = void>(path: string) => request<T>('DELETE', path)

/** Upload progress: bytes sent so far and the total (0 when the browser cannot tell). */
export type UploadProgress = (loadedBytes: number, totalBytes: number) => void

function xhrOnce<T>(path: string, form: FormData, token: string, onProgress?: UploadProgress) {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', `${API_BASE}${path}`)
    xhr.setRequestHeader('Accept', 'application/json')
    xhr.setRequestHeader('X-CSRF-Token', token)
    if (onProgress) {
      xhr.upload.onprogress = (ev) => onProgress(ev.loaded, ev.lengthComputable ? ev.total : 0)
    }
    xhr.onerror = () =>
      reject(new ApiError(0, 'UNAVAILABLE', 'The upload was interrupted. Check your connection and try again.'))
    xhr.onload = () => {
      let data: unknown = null
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : null
      } catch {
        data = null
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(data as T)
      else reject(toApiError(xhr.status, data))
    }
    xhr.send(form)
  })
}

/**
 * POSTs multipart form data (files) with upload progress, through XMLHttpRequest since fetch
 * reports no upload progress. Same CSRF header and one retry as `request`.
 */
export async function upload<T>(path: string, form: FormData, onProgress?: UploadProgress): Promise<T> {
  try {
    return await xhrOnce<T>(path, form, await csrf(), onProgress)
  } catch (e) {
    if (!isCsrfFailure(e)) throw e
    resetCsrfToken()
    return xhrOnce<T>(path, form, await csrf(), onProgress)
  }
}
