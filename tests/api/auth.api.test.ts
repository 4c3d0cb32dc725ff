import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ROLES } from '../../shared/schemas/auth'
import { csrfAgent, signedInAgent } from '../support/http-agent'
import { User } from '../../server/models/index'
import { hashPassword } from '../../server/services/password.service'
import { createTestApp, TEST_PASSWORD, type TestApp } from '../support/test-app'

async function addAccount(email: string, active: boolean) {
  return User.create({ email, displayName: 'Extra Person', role: 'analyst', passwordHash: await hashPassword(TEST_PASSWORD), active, lastSignInAt: null })
}

let t: TestApp

beforeAll(async () => {
  t = await createTestApp({ env: { LOGIN_RATE_LIMIT_MAX: '3' } })
})
afterAll(async () => {
  await t.close()
})

describe('sign-in', () => {
  it.each(ROLES)('when the %s signs in with the right password, returns the user and "who am I" knows them', async (role) => {
    const a = await csrfAgent(t.app)
    const res = await a.post('/api/auth/sign-in', t.account(role)).expect(200)
    expect(res.body.user).toMatchObject({ email: t.account(role).email, role, active: true })
    expect(res.body.user).not.toHaveProperty('passwordHash')
    const me = await a.get('/api/auth/me').expect(200)
    expect(me.body.user.role).toBe(role)
  })

  it('when the password is wrong, answers 401 with a clear message and no session', async () => {
    const a = await csrfAgent(t.app)
    const res = await a.post('/api/auth/sign-in', { email: t.account('analyst').email, password: 'not-the-password' }).expect(401)
    expect(res.body.error.code).toBe('BAD_CREDENTIALS')
    expect(res.body.error.message).toMatch(/password/i)
    await a.get('/api/auth/me').expect(401)
  })

  it('when the e-mail is unknown, answers with the same 401 as a wrong password', async () => {
    const a = await csrfAgent(t.app)
    const res = await a.post('/api/auth/sign-in', { email: 'nobody@example.org', password: 'whatever-it-is' }).expect(401)
    expect(res.body.error.code).toBe('BAD_CREDENTIALS')
  })

  it('when the e-mail is malformed, answers 400 naming the field', async () => {
    const a = await csrfAgent(t.app)
    const res = await a.post('/api/auth/sign-in', { email: 'not-an-email', password: 'x' }).expect(400)
    expect(res.body.error.code).toBe('VALIDATION_FAILED')
    expect(res.body.error.details.fields[0].field).toBe('email')
  })

  it('when the CSRF token is missing, refuses the sign-in with 403', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send(t.account('analyst')).expect(403)
    expect(res.body.error.code).toBe('CSRF_INVALID')
  })

  it('when failed sign-ins exceed the limit, answers 429 even for the right password', async () => {
    const limited = await addAccount('limited.person@example.org', true)
    const a = await csrfAgent(t.app)
    for (let i = 0; i < 3; i++) {
      await a.post('/api/auth/sign-in', { email: limited.email, password: `wrong-${i}` }).expect(401)
    }
    const res = await a.post('/api/auth/sign-in', { email: limited.email, password: TEST_PASSWORD }).expect(429)
    expect(res.body.error.code).toBe('TOO_MANY_ATTEMPTS')
    // Another user from the same address is not locked out.
    await a.post('/api/auth/sign-in', t.account('admin')).expect(200)
  })

  it('when the account is disabled, refuses the sign-in', async () => {
    const disabled = await addAccount('disabled.person@example.org', false)
    const a = await csrfAgent(t.app)
    await a.post('/api/auth/sign-in', { email: disabled.email, password: TEST_PASSWORD }).expect(401)
  })
})

describe('session', () => {
  it('sets an httpOnly, SameSite=Lax session cookie', async () => {
    const a = await csrfAgent(t.app)
    const res = await a.post('/api/auth/sign-in', t.account('analyst')).expect(200)
    const cookie = String(res.headers['set-cookie'])
    expect(cookie).toMatch(/tauline\.sid=/)
    expect(cookie).toMatch(/HttpOnly/)
    expect(cookie).toMatch(/SameSite=Lax/)
  })

  it('stores the session in PostgreSQL', async () => {
    await signedInAgent(t, 'analyst')
    const [rows] = await t.sequelize.query('SELECT count(*)::int AS n FROM session')
    expect((rows as { n: number }[])[0].n).toBeGreaterThan(0)
  })

  it('when signing out, ends the session so "who am I" answers 401', async () => {
    const a = await signedInAgent(t, 'reviewer')
    await a.post('/api/auth/sign-out').expect(204)
    await a.get('/api/auth/me').expect(401)
  })

  it('when signed out, "who am I" answers 401 in the error shape', async () => {
    const res = await request(t.app).get('/api/auth/me').expect(401)
    expect(res.body).toEqual({ error: { code: 'UNAUTHENTICATED', message: expect.any(String) } })
  })
})
