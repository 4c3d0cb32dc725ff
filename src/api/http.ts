import type { ApiErrorBody } from '@shared/schemas/errors'

/** An API failure with the server's code, message and details. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
    this.name = 'ApiError'
  }
}

let csrfToken: string | null = null
let onUnauthenticated: (() => void) | null = null

export function setCsrfToken(token: string | null) {
  csrfToken = token
}

/** Called once by the auth store: what to do when any request answers 401. */
export function setUnauthenticatedHandler(handler: () => void) {
  onUnauthenticated = handler
}

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' })
  const body = (await res.json()) as { csrfToken: string }
  csrfToken = body.csrfToken
  return csrfToken
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'

/** The one HTTP client of the app: JSON in and out, CSRF header on writes, errors as ApiError. */
export async function request<T>(method: Method, path: string, body?: unknown, retried = false): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' }
  // A FormData body (file uploads) goes as it is: the browser sets the multipart boundary.
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json'
  if (method !== 'GET') headers['x-csrf-token'] = csrfToken ?? (await fetchCsrfToken())
  const res = await fetch(`/api${path}`, {
    method,
    headers,
    credentials: 'same-origin',
    body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
  })
  if (res.status === 204) return undefined as T
  const text = await res.text()
  const data = text ? (JSON.parse(text) as unknown) : undefined
  if (res.ok) return data as T
  const err = (data as ApiErrorBody | undefined)?.error
  // A token from an older session: fetch a fresh one and try once more.
  if (res.status === 403 && err?.code === 'CSRF_INVALID' && !retried) {
    await fetchCsrfToken()
    return request<T>(method, path, body, true)
  }
  if (res.status === 401 && onUnauthenticated && !path.startsWith('/auth/')) onUnauthenticated()
  throw new ApiError(res.status, err?.code ?? 'HTTP_ERROR', err?.message ?? `Request failed (${res.status})`, err?.details)
}

export const http = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, body),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, body),
  delete: <T>(path: string) => request<T>('DELETE', path),
  /** POST a multipart form (a file and its fields), with the same CSRF and error handling. */
  upload: <T>(path: string, form: FormData) => request<T>('POST', path, form),
}

/** A query string of the set parameters (undefined, null and '' are left out), without the '?'. */
export function queryString(params: Record<string, string | number | boolean | null | undefined>): string {
  const q = new URLSearchParams()
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') q.set(k, String(v))
  return q.toString()
}
