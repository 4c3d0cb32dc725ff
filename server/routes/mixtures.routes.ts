import { Router } from 'express'
import { mixtureInputSchema } from '../../shared/schemas/mixtures'
import { listQuerySchema } from '../../shared/schemas/paging'
import * as c from '../controllers/mixtures.controller'
import { requireAuth, requireRole } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'

/** Gas mixtures: everyone signed in reads; analysts and administrators write. */
export function mixturesRoutes(): Router {
  const r = Router()
  const write = requireRole('analyst', 'admin')
  r.use(requireAuth)
  r.get('/', validate('query', listQuerySchema), c.list)
  r.get('/presets', c.presets)
  r.get('/:id', c.get)
  r.post('/', write, validate('body', mixtureInputSchema), c.create)
  r.put('/:id', write, validate('body', mixtureInputSchema), c.update)
  r.delete('/:id', write, c.remove)
  r.post('/:id/duplicate', write, c.duplicate)
  return r
}
