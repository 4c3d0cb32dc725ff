import type { Request, Response } from 'express'
import { MIXTURE_PRESETS } from '../../shared/mixtures/presets'
import type { MixtureInput } from '../../shared/schemas/mixtures'
import type { ListQuery } from '../../shared/schemas/paging'
import * as mixtures from '../services/mixture.service'
import { actorOf, idParam } from './request-helpers'

export async function list(req: Request, res: Response) {
  res.json(await mixtures.listMixtures(req.query as unknown as ListQuery))
}

export async function get(req: Request, res: Response) {
  res.json({ mixture: await mixtures.getMixture(idParam(req)) })
}

export async function create(req: Request, res: Response) {
  res.status(201).json({ mixture: await mixtures.createMixture(actorOf(req), req.body as MixtureInput) })
}

export async function update(req: Request, res: Response) {
  res.json({ mixture: await mixtures.updateMixture(actorOf(req), idParam(req), req.body as MixtureInput) })
}

export async function remove(req: Request, res: Response) {
  await mixtures.deleteMixture(actorOf(req), idParam(req))
  res.status(204).end()
}

export async function duplicate(req: Request, res: Response) {
  res.status(201).json({ mixture: await mixtures.duplicateMixture(actorOf(req), idParam(req)) })
}

export function presets(_req: Request, res: Response) {
  res.json({ presets: MIXTURE_PRESETS })
}
