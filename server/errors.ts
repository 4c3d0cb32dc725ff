/** The one error class of the API: carries an HTTP status, a stable code and optional details. */
export class AppError extends Error {
  readonly status: number
  readonly code: string
  readonly details?: unknown
  /** Operational errors are expected (bad input, forbidden); others are bugs and get logged. */
  readonly isOperational: boolean

  constructor(status: number, code: string, message: string, details?: unknown, isOperational = true) {
    super(message)
    this.name = 'AppError'
    this.status = status
    this.code = code
    this.details = details
    this.isOperational = isOperational
  }

  static badRequest(message: string, details?: unknown) {
    return new AppError(400, 'BAD_REQUEST', message, details)
  }
  static unauthorized(message = 'Sign in to continue.') {
    return new AppError(401, 'UNAUTHENTICATED', message)
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError(403, 'FORBIDDEN', message)
  }
  static notFound(what = 'Resource') {
    return new AppError(404, 'NOT_FOUND', `${what} not found.`)
  }
  static conflict(message: string, details?: unknown) {
    return new AppError(409, 'CONFLICT', message, details)
  }
}
