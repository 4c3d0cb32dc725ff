import { Router, type Request } from 'express'
import type { PassportInstance as Passport } from '../auth/passport'
import type { RateLimitRequestHandler } from 'express-rate-limit'
import { signInSchema } from '../../shared/schemas/auth'
import { createAuthController } from '../controllers/auth.controller'
import { validate } from '../middlewares/validate'

export function authRoutes(
  passport: Passport,
  generateCsrfToken: (req: Request, overwrite?: boolean) => string,
  signInLimiter: RateLimitRequestHandler,
): Router {
  const c = createAuthController(passport, generateCsrfToken)
  const r = Router()
  r.get('/csrf', c.csrfToken)
  r.post('/sign-in', signInLimiter, validate('body', signInSchema), c.signIn)
  r.post('/sign-out', c.signOut)
  r.get('/me', c.me)
  return r
}
