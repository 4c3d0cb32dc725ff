import type { Request } from 'express'
import { AppError } from '../errors'
import type { Actor } from '../services/access'

/** The signed-in user as an Actor; routes guarantee someone is signed in. */
export function actorOf(req: Request): Actor {
  if (!req.user) throw AppError.unauthorized()
  return { id: req.user.id, role: req.user.role }
}

/** A positive integer route parameter, or 400 naming it. */
export function idParam(req: Request, name = 'id'): number {
  const value = Number(req.params[name])
  if (!Number.isInteger(value) || value <= 0) {
    throw AppError.badRequest(`${name} must be a positive integer.`, { field: name })
  }
  return value
}
