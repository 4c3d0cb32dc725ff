import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ENGINE_VERSION } from '../../shared/version'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp
beforeAll(async () => {
  t = await createTestApp()
})
afterAll(async () => {
  await t.close()
})

describe('health and unknown routes', () => {
  it('when the database answers, reports ok with the engine version', async () => {
    const res = await request(t.app).get('/api/health').expect(200)
    expect(res.body).toEqual({ status: 'ok', database: 'ok', engineVersion: ENGINE_VERSION })
  })

  it('when an API path does not exist, answers 404 in the error shape', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404)
    expect(res.body.error.code).toBe('NOT_FOUND')
  })

  it('sends security headers and no x-powered-by', async () => {
    const res = await request(t.app).get('/api/health')
    expect(res.headers['x-powered-by']).toBeUndefined()
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/)
  })
})
