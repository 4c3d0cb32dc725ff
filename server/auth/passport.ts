import { Passport } from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import { authenticate, findActiveUser } from '../services/user.service'
import type { User } from '../models/index'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // The signed-in user on req.user is our Sequelize model.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends InstanceType<typeof import('../models/user.model').User> {}
  }
}

/** A passport instance of our own (not the global singleton), so several apps can live in one process. */
/** The type of a passport instance made with `new Passport()`. */
export type PassportInstance = InstanceType<typeof Passport>

export function createPassport(): PassportInstance {
  const passport = new Passport()
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      authenticate(email, password)
        .then((user) => done(null, user ?? false))
        .catch(done)
    }),
  )
  passport.serializeUser((user, done) => done(null, (user as User).id))
  passport.deserializeUser((id: number, done) => {
    findActiveUser(id)
      .then((user) => done(null, user ?? false))
      .catch(done)
  })
  return passport
}
