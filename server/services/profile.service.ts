import { Op, type WhereOptions } from 'sequelize'
import { summariseColumn } from '../../shared/physics/atmosphere/column-summary'
import { checkLevels } from '../../shared/profiles/level-checks'
import type { Page, ListQuery } from '../../shared/schemas/paging'
import type { ProfileDetail, ProfileInput, ProfileSummary } from '../../shared/schemas/profiles'
import { AppError } from '../errors'
import { Profile, User } from '../models/index'
import { assertCanModify, type Actor } from './access'
import { pageTotal } from './page-total'

function toSummary(p: Profile): ProfileSummary {
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    source: p.source,
    surfaceTemperatureK: p.surfaceTemperatureK,
    derived: p.derived,
    ownerId: p.ownerId,
    ownerName: p.owner?.displayName ?? '',
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  }
}

function toDetail(p: Profile): ProfileDetail {
  return { ...toSummary(p), surfaceEmissivity: p.surfaceEmissivity, sourceDetails: p.sourceDetails, levels: p.levels }
}

/** Checks the physics of the levels; 400 naming every bad level and field when anything is wrong. */
function validatedFields(input: ProfileInput) {
  const { errors, warnings } = checkLevels(input.levels)
  if (errors.length > 0) {
    throw new AppError(400, 'INVALID_LEVELS', `${errors.length} problem(s) in the levels: ${errors[0].message}`, {
      issues: errors,
      warnings,
    })
  }
  const derived = summariseColumn({
    name: input.name,
    surfaceTemperatureK: input.surfaceTemperatureK,
    surfaceEmissivity: input.surfaceEmissivity,
    levels: input.levels,
  })
  return { ...input, derived, warnings }
}

export async function listProfiles(query: ListQuery): Promise<Page<ProfileSummary>> {
  const where: WhereOptions = query.search
    ? { [Op.or]: [{ name: { [Op.iLike]: `%${query.search}%` } }, { description: { [Op.iLike]: `%${query.search}%` } }] }
    : {}
  const rows = await Profile.findAll({
    where,
    attributes: { exclude: ['levels'] },
    include: [{ model: User, as: 'owner', attributes: ['displayName'] }],
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  })
  const total = await pageTotal(query, rows.length, () => Profile.count({ where }))
  return { items: rows.map(toSummary), total, page: query.page, pageSize: query.pageSize }
}

async function findOrFail(id: number): Promise<Profile> {
  const profile = await Profile.findByPk(id, { include: [{ model: User, as: 'owner', attributes: ['displayName'] }] })
  if (!profile) throw AppError.notFound('Profile')
  return profile
}

export async function getProfile(id: number): Promise<ProfileDetail> {
  return toDetail(await findOrFail(id))
}

export async function createProfile(actor: Actor, input: ProfileInput): Promise<ProfileDetail & { warnings: unknown[] }> {
  const { warnings, ...fields } = validatedFields(input)
  const created = await Profile.create({ ...fields, ownerId: actor.id })
  return { ...(await getProfile(created.id)), warnings }
}

export async function updateProfile(actor: Actor, id: number, input: ProfileInput): Promise<ProfileDetail & { warnings: unknown[] }> {
  const profile = await findOrFail(id)
  assertCanModify(actor, profile.ownerId, 'profile')
  const { warnings, ...fields } = validatedFields(input)
  await profile.update(fields)
  return { ...(await getProfile(id)), warnings }
}

export async function deleteProfile(actor: Actor, id: number): Promise<void> {
  const profile = await findOrFail(id)
  assertCanModify(actor, profile.ownerId, 'profile')
  await profile.destroy()
}

export async function duplicateProfile(actor: Actor, id: number): Promise<ProfileDetail> {
  const source = await findOrFail(id)
  const copy = await Profile.create({
    name: `${source.name} (copy)`.slice(0, 120),
    description: source.description,
    source: source.source,
    sourceDetails: { ...source.sourceDetails, duplicatedFrom: source.id },
    surfaceTemperatureK: source.surfaceTemperatureK,
    surfaceEmissivity: source.surfaceEmissivity,
    levels: source.levels,
    derived: source.derived,
    ownerId: actor.id,
  })
  return getProfile(copy.id)
}
