import type { NextFunction, Request, Response } from 'express'
import type { PassportInstance as Passport } from '../auth/passport'
import { AppError } from '../errors'
import type { User } from '../models/index'

/** Controllers for sign-in, sign-out, "who am I" and the CSRF token. */
export function createAuthController(passport: Passport, generateCsrfToken: (req: Request, overwrite?: boolean) => string) {
  return {
    csrfToken(req: Request, res: Response) {
      res.json({ csrfToken: generateCsrfToken(req) })
    },

    signIn(req: Request, res: Response, next: NextFunction) {
      passport.authenticate('local', (err: unknown, user: User | false) => {
        if (err) return next(err)
        if (!user) {
          return next(new AppError(401, 'BAD_CREDENTIALS', 'E-mail or password is not right, or the account is disabled.'))
        }
        // req.login regenerates the session (no fixation); a fresh CSRF token goes with it.
        req.login(user, (loginErr) => {
          if (loginErr) return next(loginErr)
          res.json({ user: user.toPublic(), csrfToken: generateCsrfToken(req, true) })
        })
      })(req, res, next)
    },

    signOut(req: Request, res: Response, next: NextFunction) {
      req.logout((err) => {
        if (err) return next(err)
        req.session.destroy((destroyErr) => {
          if (destroyErr) return next(destroyErr)
          res.clearCookie('tauline.sid')
          res.status(204).end()
        })
      })
    },

    me(req: Request, res: Response) {
      if (!req.user) throw AppError.unauthorized()
      res.json({ user: req.user.toPublic() })
    },
  }
}
