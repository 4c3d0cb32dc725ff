import type { Express } from 'express'
import request from 'supertest'
import type { Role } from '../../shared/schemas/auth'
import type { TestApp } from './test-app'

/** A supertest agent that keeps cookies and sends the CSRF token on writes, like the browser client. */
export async function csrfAgent(app: Express) {
  const agent = request.agent(app)
  let token = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string
  return {
    agent,
    get: (path: string) => agent.get(path),
    post: (path: string, body: object = {}) => agent.post(path).set('x-csrf-token', token).send(body),
    patch: (path: string, body: object) => agent.patch(path).set('x-csrf-token', token).send(body),
    put: (path: string, body: object) => agent.put(path).set('x-csrf-token', token).send(body),
    delete: (path: string) => agent.delete(path).set('x-csrf-token', token),
    setToken: (t: string) => {
      token = t
    },
    /** A multipart POST with the CSRF header, for file uploads. */
    upload: (path: string, fields: Record<string, string>, file: { name: string; field: string; content: Buffer }) => {
      const req = agent.post(path).set('x-csrf-token', token)
      for (const [k, v] of Object.entries(fields)) req.field(k, v)
      return req.attach(file.field, file.content, file.name)
    },
  }
}

/** An agent signed in as the demo user of a role. */
export async function signedInAgent(t: TestApp, role: Role) {
  const a = await csrfAgent(t.app)
  const res = await a.post('/api/auth/sign-in', t.account(role)).expect(200)
  a.setToken(res.body.csrfToken)
  return a
}
