import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { listQuerySchema } from '../../shared/schemas/paging'
import { createReviewSchema } from '../../shared/schemas/reviews'
import { createReviewsController } from '../controllers/reviews.controller'
import { requireAuth, requireRole } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'

const reviewers = requireRole('reviewer', 'admin')

/** /api/reviews: the queue of finished runs waiting for a sign-off (reviewers and admins). */
export function reviewsRoutes(sequelize: Sequelize): Router {
  const c = createReviewsController(sequelize)
  const r = Router()
  r.use(requireAuth)
  r.get('/queue', reviewers, validate('query', listQuerySchema), c.queue)
  return r
}

/** /api/runs/:id/reviews: everyone signed in reads and verifies; reviewers and admins review. */
export function runReviewsRoutes(sequelize: Sequelize): Router {
  const c = createReviewsController(sequelize)
  const r = Router({ mergeParams: true })
  r.use(requireAuth)
  r.get('/', c.list)
  r.get('/verify', c.verify)
  r.post('/', reviewers, validate('body', createReviewSchema), c.create)
  return r
}
