import type { Request, Response } from 'express'
import type { ListQuery } from '../../shared/schemas/paging'
import type { PresetRequest, ProfileInput } from '../../shared/schemas/profiles'
import { ATMOSPHERE_PRESETS, buildPresetProfile } from '../../shared/presets/atmosphere-presets'
import { summariseColumn } from '../../shared/physics/atmosphere/column-summary'
import type { SoundingOptions } from '../../shared/schemas/soundings'
import * as profiles from '../services/profile.service'
import * as soundings from '../services/sounding.service'
import { actorOf, idParam } from './request-helpers'

export async function list(req: Request, res: Response) {
  res.json(await profiles.listProfiles(req.query as unknown as ListQuery))
}

export async function get(req: Request, res: Response) {
  res.json({ profile: await profiles.getProfile(idParam(req)) })
}

export async function create(req: Request, res: Response) {
  res.status(201).json({ profile: await profiles.createProfile(actorOf(req), req.body as ProfileInput) })
}

export async function update(req: Request, res: Response) {
  res.json({ profile: await profiles.updateProfile(actorOf(req), idParam(req), req.body as ProfileInput) })
}

export async function remove(req: Request, res: Response) {
  await profiles.deleteProfile(actorOf(req), idParam(req))
  res.status(204).end()
}

export async function duplicate(req: Request, res: Response) {
  res.status(201).json({ profile: await profiles.duplicateProfile(actorOf(req), idParam(req)) })
}

export function presets(_req: Request, res: Response) {
  res.json({ presets: ATMOSPHERE_PRESETS })
}

/** Builds a preset's levels without storing anything, for the editor to show and adjust. */
export function previewPreset(req: Request, res: Response) {
  const { profile, details } = buildPresetProfile(req.body as PresetRequest)
  res.json({ profile: { ...profile, sourceDetails: details }, derived: summariseColumn(profile) })
}

export function previewSounding(req: Request, res: Response) {
  res.json(soundings.previewSounding(req.file!.originalname, req.file!.buffer))
}

/** Converts without storing: levels and the report of dropped and repaired rows, for the chart. */
export function convertSounding(req: Request, res: Response) {
  const { levels, report } = soundings.convertSounding(req.file!.buffer, req.body as SoundingOptions)
  res.json({ levels, report })
}

export async function createFromSounding(req: Request, res: Response) {
  const profile = await soundings.createProfileFromSounding(actorOf(req), req.file!.originalname, req.file!.buffer, req.body as SoundingOptions)
  res.status(201).json({ profile })
}
