import multer from 'multer'
import type { RequestHandler } from 'express'
import { AppError } from '../errors'

/** Upload limit of a sounding file (the parser's own limit is the same 2 MiB). */
export const SOUNDING_UPLOAD_MAX_BYTES = 2 * 1024 * 1024

const soundingUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: SOUNDING_UPLOAD_MAX_BYTES, files: 1, fields: 10, fieldSize: 64 * 1024 },
}).single('file')

/** Accepts one file in the "file" field; clear 400/413 errors otherwise. */
export const acceptSoundingFile: RequestHandler = (req, res, next) => {
  soundingUpload(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(new AppError(413, 'FILE_TOO_LARGE', `The file is larger than the ${SOUNDING_UPLOAD_MAX_BYTES / 1024 / 1024} MiB limit.`, { field: 'file' }))
      }
      return next(AppError.badRequest(`Upload refused: ${err.message}.`, { field: err.field ?? 'file' }))
    }
    if (err) return next(err)
    if (!req.file) return next(AppError.badRequest('Attach the sounding file in the "file" field.', { field: 'file' }))
    next()
  })
}

/** The "options" form field of a multipart request, parsed from JSON into req.body. */
export const jsonOptionsField: RequestHandler = (req, _res, next) => {
  const raw = (req.body as Record<string, unknown> | undefined)?.options
  if (typeof raw !== 'string') return next(AppError.badRequest('Send the settings as JSON in the "options" field.', { field: 'options' }))
  try {
    req.body = JSON.parse(raw)
    next()
  } catch {
    next(AppError.badRequest('The "options" field is not valid JSON.', { field: 'options' }))
  }
}
