import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { ENGINE_VERSION } from '../../shared/version'

export function healthRoutes(sequelize: Sequelize): Router {
  const r = Router()
  r.get('/', async (_req, res) => {
    let database = 'ok'
    try {
      await sequelize.query('SELECT 1')
    } catch {
      database = 'unreachable'
    }
    res.status(database === 'ok' ? 200 : 503).json({ status: database === 'ok' ? 'ok' : 'degraded', database, engineVersion: ENGINE_VERSION })
  })
  return r
}
