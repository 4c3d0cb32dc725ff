import { Router } from 'express'
import { comparisonCsvQuerySchema, comparisonQuerySchema } from '../../shared/schemas/comparisons'
import { createComparisonsController } from '../controllers/comparisons.controller'
import { requireAuth } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'

/** Comparisons of two succeeded runs: everyone signed in may compare (runs are team-visible). */
export function comparisonsRoutes(): Router {
  const c = createComparisonsController()
  const r = Router()
  r.use(requireAuth)
  r.get('/', validate('query', comparisonQuerySchema), c.get)
  r.get('/csv', validate('query', comparisonCsvQuerySchema), c.csv)
  return r
}
