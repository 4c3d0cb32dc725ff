import type { RequestHandler } from 'express'
import type { ZodType } from 'zod'
import { AppError } from '../errors'

type Part = 'body' | 'query' | 'params'

/** Parses one request part with a zod schema; on failure answers 400 naming each field. */
export function validate<T>(part: Part, schema: ZodType<T>): RequestHandler {
  return (req, _res, next) => {
    const result = schema.safeParse(req[part])
    if (!result.success) {
      const fields = result.error.issues.map((i) => ({ field: i.path.join('.') || part, message: i.message }))
      const summary = fields.map((f) => `${f.field}: ${f.message}`).join('; ')
      return next(new AppError(400, 'VALIDATION_FAILED', `Invalid ${part}: ${summary}`, { fields }))
    }
    if (part === 'query') {
      // Express 5 makes req.query a getter; keep the parsed copy where handlers look for it.
      Object.defineProperty(req, 'query', { value: result.data, writable: true })
    } else {
      ;(req as unknown as Record<Part, unknown>)[part] = result.data
    }
    next()
  }
}
