import type { Request, Response } from 'express'
import {
  catalogueIdSchema,
  type CatalogueId,
  type CommitImportInput,
  type SticksQuery,
} from '../../shared/schemas/catalogues'
import type { ListQuery } from '../../shared/schemas/paging'
import * as catalogues from '../catalogue/catalogue.service'
import { AppError } from '../errors'
import { actorOf } from './request-helpers'

/** The :id parameter: 'builtin' or a positive integer, or 400 naming it. */
function catalogueIdParam(req: Request): CatalogueId {
  const parsed = catalogueIdSchema.safeParse(req.params.id)
  if (!parsed.success)
    throw AppError.badRequest("id must be 'builtin' or a positive integer.", { field: 'id' })
  return parsed.data
}

export async function list(req: Request, res: Response) {
  res.json(await catalogues.listCatalogues(req.query as unknown as ListQuery))
}

export async function get(req: Request, res: Response) {
  res.json({ catalogue: await catalogues.getCatalogue(catalogueIdParam(req)) })
}

export async function sticks(req: Request, res: Response) {
  res.json(
    await catalogues.stickSpectrum(catalogueIdParam(req), req.query as unknown as SticksQuery),
  )
}

export async function previewImport(req: Request, res: Response) {
  res.json(
    await catalogues.previewImport(actorOf(req), {
      path: req.file!.path,
      originalName: req.file!.originalname,
    }),
  )
}

export async function commitImport(req: Request, res: Response) {
  const owner = { ...actorOf(req), name: req.user!.displayName }
  res
    .status(201)
    .json({
      catalogue: await catalogues.commitImport(
        owner,
        String(req.params.token),
        req.body as CommitImportInput,
      ),
    })
}

export async function remove(req: Request, res: Response) {
  await catalogues.deleteCatalogue(actorOf(req), catalogueIdParam(req))
  res.status(204).end()
}
