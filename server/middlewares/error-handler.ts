import type { ErrorRequestHandler, RequestHandler } from 'express'
import { AppError } from '../errors'
import type { Logger } from '../logger'

/** Unknown /api paths answer 404 in the API error shape, not with the SPA page. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'NOT_FOUND', `No API route for ${req.method} ${req.originalUrl}.`))
}

/** The one place where errors become `{ error: { code, message, details } }` responses. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let appError: AppError
    if (err instanceof AppError) {
      appError = err
    } else if (err?.code === 'EBADCSRFTOKEN' || err?.message === 'invalid csrf token') {
      appError = new AppError(403, 'CSRF_INVALID', 'The page is out of date or the request was forged. Reload and try again.')
    } else if (err?.type === 'entity.parse.failed') {
      appError = AppError.badRequest('The request body is not valid JSON.')
    } else if (err?.type === 'entity.too.large') {
      appError = new AppError(413, 'PAYLOAD_TOO_LARGE', 'The request body is too large.')
    } else {
      appError = new AppError(500, 'INTERNAL', 'Something went wrong on the server.', undefined, false)
    }
    if (!appError.isOperational) logger.error(`${req.method} ${req.originalUrl} failed`, err)
    res.status(appError.status).json({
      error: { code: appError.code, message: appError.message, details: appError.details },
    })
  }
}
