import { readFileSync } from 'node:fs'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Profile } from '../../server/models/index'
import { signedInAgent } from '../support/http-agent'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp
beforeAll(async () => {
  t = await createTestApp()
})
afterAll(async () => {
  await t.close()
})

const csv = readFileSync('tests/fixtures/soundings/comma-degc-hpa-dewpoint.csv')
const goodOptions = {
  name: 'Site A launch',
  mapping: { pressure: 0, height: 1, temperature: 2, dewPoint: 3 },
  units: { pressure: 'hPa', height: 'm', temperature: 'degC', dewPoint: 'degC' },
}

/** Level table in SI with a simple lapse rate, for form-built profiles. */
function formLevels(n = 6) {
  return Array.from({ length: n }, (_, i) => ({
    pressurePa: 100000 * Math.exp(-i * 0.5),
    temperatureK: 288 - 6.5 * i * 1.5,
    heightM: i * 3500,
    vmr: { H2O: 0.005 * Math.exp(-i), O3: 1e-7 },
  }))
}

/** Uploads a file as the given role and checks the status; returns the response. */
async function upload(role: 'analyst' | 'admin', path: string, file: Buffer | string, options: object | undefined, status: number) {
  const a = await signedInAgent(t, role)
  const fields: Record<string, string> = options ? { options: JSON.stringify(options) } : {}
  return a.upload(`/api/profiles${path}`, fields, { field: 'file', name: 'sounding.csv', content: Buffer.isBuffer(file) ? file : Buffer.from(file) }).expect(status)
}

describe('profiles API', () => {
  it('lists presets and previews one with adjustments without storing it', async () => {
    const a = await signedInAgent(t, 'analyst')
    const presets = await a.get('/api/profiles/presets').expect(200)
    expect(presets.body.presets.map((p: { id: string }) => p.id)).toContain('us-standard-1976')
    const before = await Profile.count()
    const res = await a.post('/api/profiles/presets/preview', { preset: 'tropical', surfaceTemperatureK: 302, humidityScale: 0.5, levelCount: 41 }).expect(200)
    expect(res.body.profile.levels).toHaveLength(41)
    expect(res.body.profile.surfaceTemperatureK).toBe(302)
    expect(res.body.derived.precipitableWaterCm).toBeGreaterThan(0)
    expect(await Profile.count()).toBe(before)
  })

  it('when an analyst saves a form profile, it is stored with its derived column totals', async () => {
    const a = await signedInAgent(t, 'analyst')
    const res = await a
      .post('/api/profiles', { name: 'Hand-built column', source: 'form', surfaceTemperatureK: 289, surfaceEmissivity: 0.98, levels: formLevels() })
      .expect(201)
    expect(res.body.profile.derived.levelCount).toBe(6)
    expect(res.body.profile.derived.precipitableWaterCm).toBeGreaterThan(0)
    const list = await a.get('/api/profiles?search=hand-built').expect(200)
    expect(list.body.total).toBe(1)
    expect(list.body.items[0]).not.toHaveProperty('levels')
  })

  it('when levels are not monotonic in pressure, answers 400 naming the level and stores nothing', async () => {
    const a = await signedInAgent(t, 'analyst')
    const levels = formLevels()
    levels[3].pressurePa = levels[1].pressurePa
    const before = await Profile.count()
    const res = await a.post('/api/profiles', { name: 'Bad', source: 'form', surfaceTemperatureK: 289, surfaceEmissivity: 1, levels }).expect(400)
    expect(res.body.error.code).toBe('INVALID_LEVELS')
    expect(res.body.error.details.issues[0]).toMatchObject({ levelIndex: 3, field: 'pressurePa' })
    expect(await Profile.count()).toBe(before)
  })

  it('when a reviewer tries to save, answers 403; only the owner or an admin may change a profile', async () => {
    const reviewer = await signedInAgent(t, 'reviewer')
    await reviewer.post('/api/profiles', { name: 'R', source: 'form', surfaceTemperatureK: 289, surfaceEmissivity: 1, levels: formLevels() }).expect(403)
    const admin = await signedInAgent(t, 'admin')
    const id = (await admin.post('/api/profiles', { name: 'Admin column', source: 'form', surfaceTemperatureK: 289, surfaceEmissivity: 1, levels: formLevels() }).expect(201)).body.profile.id
    const analyst = await signedInAgent(t, 'analyst')
    await analyst.delete(`/api/profiles/${id}`).expect(403)
    const copy = (await analyst.post(`/api/profiles/${id}/duplicate`).expect(201)).body.profile
    expect(copy.name).toBe('Admin column (copy)')
    await analyst.delete(`/api/profiles/${copy.id}`).expect(204)
  })
})

describe('sounding upload', () => {
  it('previews a file: columns, sample rows and guessed units', async () => {
    const res = await upload('analyst', '/soundings/preview', csv, undefined, 200)
    expect(res.body.header).toEqual(['PRES', 'HGHT', 'TEMP', 'DWPT', 'DRCT', 'SKNT'])
    expect(res.body.guess.mapping).toMatchObject({ pressure: 0, height: 1, temperature: 2, dewPoint: 3 })
    expect(res.body.guess.units).toMatchObject({ pressure: 'hPa', temperature: 'degC' })
  })

  it('stores a good sounding, extended above its top with a climatology, with the report kept', async () => {
    const res = await upload('analyst', '/soundings', csv, { ...goodOptions, extendAbove: { climatology: 'tropical', topPressurePa: 100 } }, 201)
    const p = res.body.profile
    expect(p.source).toBe('sounding')
    expect(p.sourceDetails.extendedAbove.climatology).toBe('tropical')
    expect(p.derived.topPressurePa).toBeCloseTo(100, 6)
    expect(p.levels[0].pressurePa).toBe(100000)
  })

  const bad: [string, Buffer | string, object, number, string, { lineNumber?: number; field?: string }?][] = [
    ['an empty file', '', goodOptions, 400, 'SOUNDING_UNREADABLE'],
    ['a binary file', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0x0d, 1, 2, 3, 0, 0, 0]), goodOptions, 400, 'SOUNDING_UNREADABLE'],
    ['a wrong delimiter', 'PRES|TEMP|DWPT\n1000|20|10\n900|15|5\n800|10|0\n', goodOptions, 400, 'SOUNDING_UNREADABLE'],
    ['a non-numeric cell', 'PRES,HGHT,TEMP,DWPT\n1000,100,20,10\n900,1000,abc,5\n800,2000,10,0\n700,3000,5,-5\n', goodOptions, 400, 'SOUNDING_INVALID', { lineNumber: 3, field: 'temperature' }],
    ['non-monotonic pressure', 'PRES,HGHT,TEMP,DWPT\n1000,100,20,10\n900,1000,15,5\n950,2000,10,0\n700,3000,5,-5\n', goodOptions, 400, 'SOUNDING_INVALID', { field: 'pressure' }],
    ['a negative pressure', 'PRES,HGHT,TEMP,DWPT\n1000,100,20,10\n900,1000,15,5\n-800,2000,10,0\n700,3000,5,-5\n', goodOptions, 400, 'SOUNDING_INVALID', { lineNumber: 4, field: 'pressure' }],
    ['an impossible temperature', 'PRES,HGHT,TEMP,DWPT\n1000,100,20,10\n900,1000,95,5\n800,2000,10,0\n700,3000,5,-5\n', goodOptions, 400, 'SOUNDING_INVALID', { lineNumber: 3, field: 'temperature' }],
    ['relative humidity above 110 %', 'PRES,HGHT,TEMP,RELH\n1000,100,20,50\n900,1000,15,130\n800,2000,10,40\n700,3000,5,30\n', { ...goodOptions, mapping: { pressure: 0, height: 1, temperature: 2, relativeHumidity: 3 }, units: { pressure: 'hPa', height: 'm', temperature: 'degC', relativeHumidity: 'percent' } }, 400, 'SOUNDING_INVALID', { lineNumber: 3, field: 'relativeHumidity' }],
    ['too few levels', 'PRES,HGHT,TEMP,DWPT\n1000,100,20,10\n900,1000,15,5\n', goodOptions, 400, 'SOUNDING_UNREADABLE'],
    ['a missing required column', 'PRES,HGHT,DWPT\n1000,100,10\n900,1000,5\n800,2000,0\n', { ...goodOptions, mapping: { pressure: 0, height: 1, temperature: 5, dewPoint: 2 } }, 400, 'VALIDATION_FAILED'],
    ['a file over the size limit', Buffer.alloc(2 * 1024 * 1024 + 10, 'a'), goodOptions, 413, 'FILE_TOO_LARGE'],
  ]

  it.each(bad)('when the upload has %s, answers with a clear error and stores nothing', async (_label, file, options, status, code, where) => {
    const before = await Profile.count()
    const res = await upload('analyst', '/soundings', file, options, status)
    expect(res.body.error.code).toBe(code)
    expect(res.body.error.message.length).toBeGreaterThan(10)
    if (where) {
      const errors = res.body.error.details.errors as { lineNumber: number; field: string }[]
      expect(errors[0]).toMatchObject(where)
    }
    expect(await Profile.count()).toBe(before)
  })

  it('when no file is attached, answers 400 naming the field', async () => {
    const a = await signedInAgent(t, 'analyst')
    const res = await a.post('/api/profiles/soundings/preview').expect(400)
    expect(res.body.error.details.field).toBe('file')
  })

  it('when signed out, refuses uploads', async () => {
    // Refused before the body is read: a multipart body still being written when the answer comes
    // can fail the client's write (EPIPE), so the request carries none; the guard does not look.
    await request(t.app).post('/api/profiles/soundings/preview').send({}).expect(403)
  })
})
