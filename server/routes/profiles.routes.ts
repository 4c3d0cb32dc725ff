import { Router } from 'express'
import { listQuerySchema } from '../../shared/schemas/paging'
import { presetRequestSchema, profileInputSchema } from '../../shared/schemas/profiles'
import * as c from '../controllers/profiles.controller'
import { requireAuth, requireRole } from '../middlewares/require-auth'
import { acceptSoundingFile, jsonOptionsField } from '../middlewares/upload'
import { validate } from '../middlewares/validate'
import { soundingOptionsSchema } from '../../shared/schemas/soundings'

/** Atmosphere profiles: everyone signed in reads; analysts and administrators write. */
export function profilesRoutes(): Router {
  const r = Router()
  const write = requireRole('analyst', 'admin')
  r.use(requireAuth)
  r.get('/', validate('query', listQuerySchema), c.list)
  r.get('/presets', c.presets)
  r.post('/presets/preview', validate('body', presetRequestSchema), c.previewPreset)
  r.post('/soundings/preview', write, acceptSoundingFile, c.previewSounding)
  r.post('/soundings/convert', write, acceptSoundingFile, jsonOptionsField, validate('body', soundingOptionsSchema), c.convertSounding)
  r.post('/soundings', write, acceptSoundingFile, jsonOptionsField, validate('body', soundingOptionsSchema), c.createFromSounding)
  r.get('/:id', c.get)
  r.post('/', write, validate('body', profileInputSchema), c.create)
  r.put('/:id', write, validate('body', profileInputSchema), c.update)
  r.delete('/:id', write, c.remove)
  r.post('/:id/duplicate', write, c.duplicate)
  return r
}
