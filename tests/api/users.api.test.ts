import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { User } from '../../server/models/index'
import { signedInAgent } from '../support/http-agent'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp

beforeAll(async () => {
  t = await createTestApp()
})
afterAll(async () => {
  await t.close()
})

describe('people administration API', () => {
  it('when signed out, answers 401', async () => {
    await request(t.app).get('/api/admin/users').expect(401)
  })

  it.each(['analyst', 'reviewer'] as const)('when a %s asks, answers 403', async (role) => {
    const a = await signedInAgent(t, role)
    const res = await a.get('/api/admin/users').expect(403)
    expect(res.body.error.code).toBe('FORBIDDEN')
    await a.post('/api/admin/users', { email: 'x@example.org', displayName: 'X Y', role: 'admin', password: 'long-enough-pw' }).expect(403)
  })

  it('when the admin asks, lists every account without password hashes', async () => {
    const a = await signedInAgent(t, 'admin')
    const res = await a.get('/api/admin/users').expect(200)
    expect(res.body.users).toHaveLength(3)
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|passwordHash/)
  })

  it('when the admin creates an account, the new person can sign in', async () => {
    const a = await signedInAgent(t, 'admin')
    const res = await a
      .post('/api/admin/users', { email: 'New.Analyst@Example.org', displayName: 'New Analyst', role: 'analyst', password: 'a-good-password' })
      .expect(201)
    expect(res.body.user.email).toBe('new.analyst@example.org')
    const b = await import('../support/http-agent').then((m) => m.csrfAgent(t.app))
    await b.post('/api/auth/sign-in', { email: 'new.analyst@example.org', password: 'a-good-password' }).expect(200)
  })

  it('when the e-mail is taken, answers 409 and stores nothing', async () => {
    const a = await signedInAgent(t, 'admin')
    const before = await User.count()
    const res = await a
      .post('/api/admin/users', { email: t.account('analyst').email, displayName: 'Copy Cat', role: 'analyst', password: 'another-password' })
      .expect(409)
    expect(res.body.error.details).toEqual({ field: 'email' })
    expect(await User.count()).toBe(before)
  })

  it('when the password is short, answers 400 naming the field', async () => {
    const a = await signedInAgent(t, 'admin')
    const res = await a.post('/api/admin/users', { email: 'short@example.org', displayName: 'Short Pw', role: 'analyst', password: 'short' }).expect(400)
    expect(res.body.error.details.fields.map((f: { field: string }) => f.field)).toContain('password')
  })

  it('when the admin changes a role, the change is stored', async () => {
    const a = await signedInAgent(t, 'admin')
    const target = await User.findOne({ where: { email: t.account('reviewer').email } })
    const res = await a.patch(`/api/admin/users/${target!.id}`, { role: 'analyst' }).expect(200)
    expect(res.body.user.role).toBe('analyst')
    await a.patch(`/api/admin/users/${target!.id}`, { role: 'reviewer' }).expect(200)
  })

  it('when the admin tries to demote themself, answers 400', async () => {
    const a = await signedInAgent(t, 'admin')
    const me = (await a.get('/api/auth/me').expect(200)).body.user
    await a.patch(`/api/admin/users/${me.id}`, { role: 'analyst' }).expect(400)
  })

  it('when a deactivated user still has a session, the next request is treated as signed out', async () => {
    const analyst = await signedInAgent(t, 'analyst')
    const admin = await signedInAgent(t, 'admin')
    const target = await User.findOne({ where: { email: t.account('analyst').email } })
    await admin.patch(`/api/admin/users/${target!.id}`, { active: false }).expect(200)
    await analyst.get('/api/auth/me').expect(401)
    await admin.patch(`/api/admin/users/${target!.id}`, { active: true }).expect(200)
  })
})
