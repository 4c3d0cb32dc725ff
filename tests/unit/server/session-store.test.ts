import type pg from 'pg'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { ThrottledPgSessionStore } from '../../../server/auth/session-store'

// The session store thins out touches (rolling sessions would write the session row on every
// request); a fake pool counts the statements that reach the database.
function storeWithCountingPool() {
  const query = vi.fn(async (_sql: string, _params?: unknown[]) => ({ rows: [] }))
  const store = new ThrottledPgSessionStore({ query } as unknown as pg.Pool)
  const touches = () => query.mock.calls.filter(([sql]) => String(sql).startsWith('UPDATE')).length
  return { store, touches }
}

const session = { cookie: { originalMaxAge: 3_600_000, expires: new Date(Date.now() + 3_600_000) } }
const touch = (store: ThrottledPgSessionStore, sid: string) =>
  new Promise<void>((resolve) => store.touch(sid, session as never, () => resolve()))

let stores: ThrottledPgSessionStore[] = []
afterEach(async () => {
  for (const s of stores) await s.close()
  stores = []
  vi.useRealTimers()
})

describe('ThrottledPgSessionStore', () => {
  it('when a session is touched twice within a minute, writes its expiry once', async () => {
    const { store, touches } = storeWithCountingPool()
    stores.push(store)
    await touch(store, 'a')
    await touch(store, 'a')
    expect(touches()).toBe(1)
  })

  it('when a minute has passed, or another session is touched, writes again', async () => {
    vi.useFakeTimers({ toFake: ['Date'] })
    const { store, touches } = storeWithCountingPool()
    stores.push(store)
    await touch(store, 'a')
    await touch(store, 'b')
    expect(touches()).toBe(2)
    vi.setSystemTime(Date.now() + 61_000)
    await touch(store, 'a')
    expect(touches()).toBe(3)
  })

  it('when a session is destroyed, forgets its last touch', async () => {
    const { store, touches } = storeWithCountingPool()
    stores.push(store)
    await touch(store, 'a')
    await new Promise<void>((resolve) => store.destroy('a', () => resolve()))
    await touch(store, 'a')
    expect(touches()).toBe(2)
  })
})
