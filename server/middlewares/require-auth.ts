import type { RequestHandler } from 'express'
import type { Role } from '../../shared/schemas/auth'
import { AppError } from '../errors'

/** 401 unless someone is signed in. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(AppError.unauthorized())
  next()
}

/** 401 when signed out, 403 unless the user has one of the given roles. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(AppError.unauthorized())
    if (!roles.includes(req.user.role)) return next(AppError.forbidden())
    next()
  }
}
