import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { createRunSchema, runListQuerySchema } from '../../shared/schemas/runs'
import { createRunsController } from '../controllers/runs.controller'
import { requireAuth, requireRole } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'
import type { RunQueue } from '../runs/run-queue'

/** Runs: everyone signed in reads; analysts and administrators submit, cancel and delete. */
export function runsRoutes(sequelize: Sequelize, getQueue: () => RunQueue | undefined): Router {
  const c = createRunsController(sequelize, getQueue)
  const write = requireRole('analyst', 'admin')
  const r = Router()
  r.use(requireAuth)
  r.get('/', validate('query', runListQuerySchema), c.list)
  r.post('/', write, validate('body', createRunSchema), c.create)
  r.get('/:id', c.get)
  r.get('/:id/events', c.events)
  r.get('/:id/results', c.results)
  r.get('/:id/results.csv', c.resultsCsv)
  r.get('/:id/results/detail', c.detail)
  r.post('/:id/cancel', write, c.cancel)
  r.delete('/:id', write, c.remove)
  return r
}
