import { Op, type WhereOptions } from 'sequelize'
import type { MixtureInput, MixtureSummary } from '../../shared/schemas/mixtures'
import type { ListQuery, Page } from '../../shared/schemas/paging'
import { AppError } from '../errors'
import { GasMixture, User } from '../models/index'
import { assertCanModify, type Actor } from './access'
import { pageTotal } from './page-total'

function toSummary(m: GasMixture): MixtureSummary {
  return {
    id: m.id,
    name: m.name,
    description: m.description,
    gases: m.gases,
    ownerId: m.ownerId,
    ownerName: m.owner?.displayName ?? '',
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
  }
}

export async function listMixtures(query: ListQuery): Promise<Page<MixtureSummary>> {
  const where: WhereOptions = query.search ? { name: { [Op.iLike]: `%${query.search}%` } } : {}
  const rows = await GasMixture.findAll({
    where,
    include: [{ model: User, as: 'owner', attributes: ['displayName'] }],
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  })
  const total = await pageTotal(query, rows.length, () => GasMixture.count({ where }))
  return { items: rows.map(toSummary), total, page: query.page, pageSize: query.pageSize }
}

async function findOrFail(id: number): Promise<GasMixture> {
  const m = await GasMixture.findByPk(id, { include: [{ model: User, as: 'owner', attributes: ['displayName'] }] })
  if (!m) throw AppError.notFound('Gas mixture')
  return m
}

export async function getMixture(id: number): Promise<MixtureSummary> {
  return toSummary(await findOrFail(id))
}

export async function createMixture(actor: Actor, input: MixtureInput): Promise<MixtureSummary> {
  const created = await GasMixture.create({ ...input, ownerId: actor.id })
  return getMixture(created.id)
}

export async function updateMixture(actor: Actor, id: number, input: MixtureInput): Promise<MixtureSummary> {
  const m = await findOrFail(id)
  assertCanModify(actor, m.ownerId, 'gas mixture')
  await m.update(input)
  return getMixture(id)
}

export async function deleteMixture(actor: Actor, id: number): Promise<void> {
  const m = await findOrFail(id)
  assertCanModify(actor, m.ownerId, 'gas mixture')
  await m.destroy()
}

export async function duplicateMixture(actor: Actor, id: number): Promise<MixtureSummary> {
  const source = await findOrFail(id)
  const copy = await GasMixture.create({
    name: `${source.name} (copy)`.slice(0, 120),
    description: source.description,
    gases: source.gases,
    ownerId: actor.id,
  })
  return getMixture(copy.id)
}
