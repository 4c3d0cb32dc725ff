import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { ApiError, http, queryString, setCsrfToken, setUnauthenticatedHandler } from '@/api/http'

type Call = { url: string; init: RequestInit }
let calls: Call[]
let responses: Array<{ status: number; body?: unknown }>

function json(status: number, body?: unknown) {
  return { status, body }
}

beforeEach(() => {
  calls = []
  responses = []
  setCsrfToken(null)
  vi.stubGlobal('fetch', async (url: string, init: RequestInit = {}) => {
    calls.push({ url, init })
    const next = responses.shift() ?? json(500, { error: { code: 'NO_MOCK', message: 'no mock' } })
    return new Response(next.body === undefined ? null : JSON.stringify(next.body), { status: next.status })
  })
})
afterEach(() => vi.unstubAllGlobals())

describe('the HTTP client', () => {
  it('when writing without a token, fetches one first and sends it as x-csrf-token', async () => {
    responses.push(json(200, { csrfToken: 'tok-1' }), json(201, { ok: true }))
    await http.post('/things', { a: 1 })
    expect(calls[0].url).toBe('/api/auth/csrf')
    expect((calls[1].init.headers as Record<string, string>)['x-csrf-token']).toBe('tok-1')
    expect(calls[1].init.body).toBe('{"a":1}')
  })

  it('when the server rejects a stale token, refreshes it and retries once', async () => {
    setCsrfToken('stale')
    responses.push(
      json(403, { error: { code: 'CSRF_INVALID', message: 'old' } }),
      json(200, { csrfToken: 'fresh' }),
      json(200, { done: true }),
    )
    expect(await http.post('/things')).toEqual({ done: true })
    expect((calls[2].init.headers as Record<string, string>)['x-csrf-token']).toBe('fresh')
  })

  it('when the API answers an error, throws ApiError with its code, message and details', async () => {
    responses.push(json(400, { error: { code: 'VALIDATION_FAILED', message: 'Invalid body: email', details: { fields: [] } } }))
    const err = await http.get('/x').catch((e: unknown) => e)
    expect(err).toBeInstanceOf(ApiError)
    expect(err).toMatchObject({ status: 400, code: 'VALIDATION_FAILED', message: 'Invalid body: email' })
  })

  it('when a non-auth request answers 401, calls the unauthenticated handler', async () => {
    const handler = vi.fn()
    setUnauthenticatedHandler(handler)
    responses.push(json(401, { error: { code: 'UNAUTHENTICATED', message: 'Sign in' } }))
    await http.get('/runs').catch(() => undefined)
    expect(handler).toHaveBeenCalledOnce()
  })

  it('writes a query string of the set parameters only, encoded', () => {
    expect(queryString({ page: 2, pageSize: 20, status: undefined, search: '', mine: false, range: null })).toBe('page=2&pageSize=20&mine=false')
    expect(queryString({ search: 'CO₂ & co' })).toBe('search=CO%E2%82%82+%26+co')
    expect(queryString({})).toBe('')
  })
})
