import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { setCsrfToken } from '@/api/http'
import * as api from '@/api/profiles'

type Call = { url: string; init: RequestInit }
let calls: Call[]
let responses: Array<{ status: number; body?: unknown }>

beforeEach(() => {
  calls = []
  responses = []
  setCsrfToken('tok-1')
  vi.stubGlobal('fetch', async (url: string, init: RequestInit = {}) => {
    calls.push({ url, init })
    const next = responses.shift() ?? {
      status: 500,
      body: { error: { code: 'NO_MOCK', message: 'no mock' } },
    }
    return new Response(next.body === undefined ? null : JSON.stringify(next.body), {
      status: next.status,
    })
  })
})
afterEach(() => vi.unstubAllGlobals())

const options = {
  name: 'Launch 12Z',
  description: '',
  mapping: { pressure: 0, temperature: 2 },
  units: { pressure: 'hPa' as const, temperature: 'degC' as const },
  surfaceEmissivity: 1,
  surfaceHeightM: 0,
  fillMissingHumidity: false,
  fillMissingOzone: false,
  thinToMaxLevels: true,
}

describe('the profiles API client', () => {
  it('when a sounding is checked, posts the file and the options as multipart with the CSRF header', async () => {
    responses.push({ status: 200, body: { levels: [], report: {} } })
    const file = new File(['PRES,TEMP\n1000,15\n'], 'launch.csv', { type: 'text/csv' })
    await api.convertSounding(file, options)
    expect(calls[0].url).toBe('/api/profiles/soundings/convert')
    expect(calls[0].init.method).toBe('POST')
    const headers = calls[0].init.headers as Record<string, string>
    expect(headers['x-csrf-token']).toBe('tok-1')
    expect(headers['Content-Type']).toBeUndefined()
    const form = calls[0].init.body as FormData
    expect(form).toBeInstanceOf(FormData)
    expect(JSON.parse(form.get('options') as string)).toEqual(options)
    expect((form.get('file') as File).name).toBe('launch.csv')
  })

  it('when a sounding is previewed, sends only the file', async () => {
    responses.push({ status: 200, body: { header: [] } })
    await api.previewSounding(new File(['x'], 'a.txt'))
    const form = calls[0].init.body as FormData
    expect(calls[0].url).toBe('/api/profiles/soundings/preview')
    expect(form.has('options')).toBe(false)
    expect(form.has('file')).toBe(true)
  })

  it('when profiles are listed, sends the page and search in the query and skips empty ones', async () => {
    responses.push({ status: 200, body: { items: [], total: 0, page: 2, pageSize: 15 } })
    await api.fetchProfiles({ page: 2, pageSize: 15, search: '' })
    expect(calls[0].url).toBe('/api/profiles?page=2&pageSize=15')
  })

  it('when a preset is previewed, posts the request as JSON', async () => {
    responses.push({ status: 200, body: { profile: {}, derived: {} } })
    await api.previewPreset({ preset: 'tropical', levelCount: 31 })
    expect(calls[0].url).toBe('/api/profiles/presets/preview')
    expect(JSON.parse(calls[0].init.body as string)).toEqual({ preset: 'tropical', levelCount: 31 })
  })
})
