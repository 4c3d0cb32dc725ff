import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { listQuerySchema } from '../../shared/schemas/paging'
import { createSweepSchema } from '../../shared/schemas/sweeps'
import { createSweepsController } from '../controllers/sweeps.controller'
import { requireAuth, requireRole } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'
import type { RunQueue } from '../runs/run-queue'

/** Sweeps: everyone signed in reads; analysts and administrators submit. Members are runs. */
export function sweepsRoutes(sequelize: Sequelize, getQueue: () => RunQueue | undefined): Router {
  const c = createSweepsController(sequelize, getQueue)
  const r = Router()
  r.use(requireAuth)
  r.post('/', requireRole('analyst', 'admin'), validate('body', createSweepSchema), c.create)
  r.get('/', validate('query', listQuerySchema), c.list)
  r.get('/:id', c.get)
  r.get('/:id/forcing.csv', c.forcingCsv)
  return r
}
