import { Router } from 'express'
import { commitImportSchema, sticksQuerySchema } from '../../shared/schemas/catalogues'
import { listQuerySchema } from '../../shared/schemas/paging'
import { acceptLineListFile } from '../catalogue/line-list-upload'
import * as c from '../controllers/catalogues.controller'
import { requireAuth, requireRole } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'

/**
 * Line catalogues: everyone signed in reads; analysts and administrators import and delete.
 * Import is two steps: POST /imports (multipart "file", up to 512 MiB, checked record by record)
 * answers a summary and a token; POST /imports/:token/commit stores it.
 */
export function cataloguesRoutes(): Router {
  const r = Router()
  const write = requireRole('analyst', 'admin')
  r.use(requireAuth)
  r.get('/', validate('query', listQuerySchema), c.list)
  r.post('/imports', write, acceptLineListFile, c.previewImport)
  r.post('/imports/:token/commit', write, validate('body', commitImportSchema), c.commitImport)
  r.get('/:id', c.get)
  r.get('/:id/sticks', validate('query', sticksQuerySchema), c.sticks)
  r.delete('/:id', write, c.remove)
  return r
}
