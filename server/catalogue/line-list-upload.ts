import multer from 'multer'
import type { RequestHandler } from 'express'
import { LINE_LIST_MAX_BYTES } from '../../shared/schemas/catalogues'
import { AppError } from '../errors'
import { ensureImportDir, uploadFileName } from './import/pending-imports'

/**
 * Line-list uploads go straight to a temporary file (never into memory), up to
 * LINE_LIST_MAX_BYTES = 512 MiB; multer removes the partial file when the limit is hit or the
 * client goes away.
 */
const lineListUpload = multer({
  storage: multer.diskStorage({
    destination: (_req, _file, cb) => {
      try {
        cb(null, ensureImportDir())
      } catch (err) {
        cb(err as Error, '')
      }
    },
    filename: (_req, _file, cb) => cb(null, uploadFileName()),
  }),
  limits: { fileSize: LINE_LIST_MAX_BYTES, files: 1, fields: 5, fieldSize: 4096 },
}).single('file')

/** Accepts one line-list file in the "file" field (req.file.path); clear 400/413 errors otherwise. */
export const acceptLineListFile: RequestHandler = (req, res, next) => {
  lineListUpload(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(
          new AppError(
            413,
            'FILE_TOO_LARGE',
            `The file is larger than the ${LINE_LIST_MAX_BYTES / 1024 / 1024} MiB limit.`,
            { field: 'file' },
          ),
        )
      }
      return next(
        AppError.badRequest(`Upload refused: ${err.message}.`, { field: err.field ?? 'file' }),
      )
    }
    if (err) return next(err)
    if (!req.file)
      return next(
        AppError.badRequest('Attach the line list in the "file" field.', { field: 'file' }),
      )
    next()
  })
}
