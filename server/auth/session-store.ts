import connectPgSimple from 'connect-pg-simple'
import session from 'express-session'
import type pg from 'pg'

const PgStore = connectPgSimple(session)

/** A session is touched (its expiry pushed back in the database) at most this often, ms. */
const TOUCH_INTERVAL_MS = 60_000

/**
 * The Postgres session store, with touches thinned out: rolling sessions would otherwise write
 * the session row on every request. The stored expiry lags the cookie's by at most a minute of a
 * lifetime of hours.
 */
export class ThrottledPgSessionStore extends PgStore {
  private readonly touchedAtMs = new Map<string, number>()

  constructor(pool: pg.Pool) {
    super({ pool, tableName: 'session', pruneSessionInterval: 15 * 60 })
  }

  override touch(sid: string, sess: session.SessionData, callback?: () => void): void {
    const now = Date.now()
    const last = this.touchedAtMs.get(sid)
    if (last !== undefined && now - last < TOUCH_INTERVAL_MS) {
      callback?.()
      return
    }
    if (this.touchedAtMs.size > 50_000) this.touchedAtMs.clear()
    this.touchedAtMs.set(sid, now)
    super.touch(sid, sess, callback)
  }

  override destroy(sid: string, callback?: (err?: unknown) => void): void {
    this.touchedAtMs.delete(sid)
    super.destroy(sid, callback)
  }
}
