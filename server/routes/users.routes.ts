import { Router } from 'express'
import { createUserSchema, updateUserSchema } from '../../shared/schemas/auth'
import * as c from '../controllers/users.controller'
import { requireRole } from '../middlewares/require-auth'
import { validate } from '../middlewares/validate'

/** People management, administrators only. */
export function usersRoutes(): Router {
  const r = Router()
  r.use(requireRole('admin'))
  r.get('/', c.list)
  r.post('/', validate('body', createUserSchema), c.create)
  r.patch('/:id', validate('body', updateUserSchema), c.update)
  return r
}
