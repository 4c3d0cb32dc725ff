import { randomUUID } from 'node:crypto'
import { Op, type Sequelize } from 'sequelize'
import { withSweptAmount } from '../../shared/mixtures/swept-amount'
import { fitLogarithmicForcing } from '../../shared/physics/diagnostics/log-fit'
import { planChunks } from '../../shared/physics/engine/prepare'
import type { AtmosphereProfile } from '../../shared/physics/types'
import { TERMINAL_RUN_STATUSES, type RunInputs, type RunStatus } from '../../shared/schemas/runs'
import {
  SWEPT_GASES,
  type CreateSweepInput,
  type SweepDetail,
  type SweepForcing,
  type SweepListItem,
  type SweepMember,
} from '../../shared/schemas/sweeps'
import type { ListQuery, Page } from '../../shared/schemas/paging'
import { AppError } from '../errors'
import { Run, RunResult, Sweep, User } from '../models/index'
import type { Actor } from '../services/access'
import { snapshotRunInputs } from './run-inputs'
import { defaultRunName, insertQueuedRun } from './run.service'
import type { RunQueue } from './run-queue'

/**
 * The profiles of every member of a sweep, rebuilt from any member's frozen inputs: the same
 * profiles whichever member they come from, so a chunk is computed the same way even when a
 * member has been deleted.
 */
export function sweepMemberProfiles(inputs: RunInputs): AtmosphereProfile[] {
  const sweep = inputs.sweep
  if (!sweep) throw new Error('the run is not a member of a sweep')
  return sweep.amounts.map((amount) => withSweptAmount(inputs.profile.snapshot, sweep.gas, amount))
}

/**
 * Creates a sweep: one member run per amount, each an ordinary run with its own frozen inputs
 * (the profile with the mixture applied and the gas at its amount), and one queued job per chunk
 * that computes that chunk of every member together.
 */
export async function createSweep(
  sequelize: Sequelize,
  queue: RunQueue,
  actor: Actor,
  input: CreateSweepInput,
): Promise<SweepDetail> {
  const spec = SWEPT_GASES[input.gas]
  const referenceAmount = input.referenceAmount ?? input.amounts[0]
  const { inputs: base } = await snapshotRunInputs(input)
  const sweepOf = (amount: number) => ({
    gas: input.gas,
    unit: spec.unit,
    amounts: input.amounts,
    amount,
  })
  const memberInputs: RunInputs[] = input.amounts.map((amount, i) => {
    let snapshot: AtmosphereProfile
    try {
      snapshot = withSweptAmount(base.profile.snapshot, input.gas, amount)
    } catch (err) {
      throw new AppError(400, 'VALIDATION_FAILED', (err as Error).message, {
        fields: [{ field: `amounts.${i}`, message: (err as Error).message }],
      })
    }
    return { ...base, profile: { ...base.profile, snapshot }, sweep: sweepOf(amount) }
  })
  const chunks = planChunks(base.settings)
  const jobIds = chunks.map(() => randomUUID())
  const name = input.name?.trim() || defaultRunName(base, `${spec.label} sweep`)
  const { sweep, runIds } = await sequelize.transaction(async (tx) => {
    const created = await Sweep.create(
      {
        name: name.slice(0, 160),
        gas: input.gas,
        unit: spec.unit,
        amounts: input.amounts,
        referenceAmount,
        ownerId: actor.id,
      },
      { transaction: tx },
    )
    const ids: number[] = []
    for (const [i, inputs] of memberInputs.entries()) {
      const amount = input.amounts[i]
      // Every member's chunk k carries the id of the one job that computes chunk k of all members.
      const member = await insertQueuedRun(
        tx,
        {
          name: `${name.slice(0, 120)} · ${spec.label} ${amount} ${spec.unit}`,
          inputs,
          ownerId: actor.id,
          sweepId: created.id,
          sweepAmount: amount,
        },
        chunks,
        jobIds,
      )
      ids.push(member.id)
    }
    return { sweep: created, runIds: ids }
  })
  await queue.enqueueChunks(
    chunks.map((c, k) => ({
      jobId: jobIds[k],
      data: { sweepId: sweep.id, runIds, chunkIndex: c.index },
    })),
  )
  return getSweep(sweep.id)
}

/** Net upward flux at the top, the tropopause and the surface from a run's result summary. */
function netFluxes(summary: Record<string, unknown>): SweepForcing {
  const s = summary as {
    toaNetUpWPerM2: number
    tropopause: { netUpWPerM2: number }
    surfaceUpWPerM2: number
    surfaceDownWPerM2: number
  }
  return {
    top: s.toaNetUpWPerM2,
    tropopause: s.tropopause.netUpWPerM2,
    surface: s.surfaceUpWPerM2 - s.surfaceDownWPerM2,
  }
}

/** The sweep's status from its members': running until every member has ended; cancelled with none left. */
function sweepStatus(statuses: RunStatus[]): RunStatus {
  if (statuses.length === 0) return 'cancelled'
  if (statuses.some((s) => !TERMINAL_RUN_STATUSES.includes(s))) {
    return statuses.some((s) => s !== 'queued' && s !== 'cancelled') ? 'running' : 'queued'
  }
  if (statuses.every((s) => s === 'succeeded')) return 'succeeded'
  return statuses.includes('failed') ? 'failed' : 'cancelled'
}

/** A page of sweeps, newest first, each with its status from its members' statuses. */
export async function listSweeps(query: ListQuery): Promise<Page<SweepListItem>> {
  const where = query.search ? { name: { [Op.iLike]: `%${query.search}%` } } : {}
  const [total, sweeps] = await Promise.all([
    Sweep.count({ where }),
    Sweep.findAll({
      where,
      include: [{ model: User, as: 'owner', attributes: ['displayName'] }],
      order: [['id', 'DESC']],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    }),
  ])
  const members = await Run.findAll({ where: { sweepId: sweeps.map((s) => s.id) }, attributes: ['sweepId', 'status'] })
  const statusesOf = (id: number) => members.filter((m) => m.sweepId === id).map((m) => m.status)
  return {
    items: sweeps.map((sweep) => {
      const statuses = statusesOf(sweep.id)
      return {
        id: sweep.id,
        name: sweep.name,
        gas: sweep.gas,
        unit: sweep.unit,
        amounts: sweep.amounts,
        referenceAmount: sweep.referenceAmount,
        ownerName: sweep.owner?.displayName ?? '',
        createdAt: sweep.createdAt.toISOString(),
        status: sweepStatus(statuses),
        membersEnded: statuses.filter((st) => TERMINAL_RUN_STATUSES.includes(st)).length,
        memberCount: statuses.length,
      }
    }),
    total,
    page: query.page,
    pageSize: query.pageSize,
  }
}

/**
 * A sweep with its members, their forcing against the reference member (the reduction of net
 * upward flux at the top, the tropopause and the surface, from the stored summaries) and a
 * logarithmic fit through the origin at each level.
 */
export async function getSweep(id: number): Promise<SweepDetail> {
  const sweep = await Sweep.findByPk(id, {
    include: [{ model: User, as: 'owner', attributes: ['displayName'] }],
  })
  if (!sweep) throw AppError.notFound('Sweep')
  const runs = await Run.findAll({
    where: { sweepId: id },
    attributes: ['id', 'status', 'chunksDone', 'chunkCount', 'sweepAmount'],
    include: [{ model: RunResult, as: 'result', attributes: ['summary'] }],
  })
  const summaryOf = (run: Run) => (run as unknown as { result?: RunResult }).result?.summary ?? null
  // Members in the order of the sweep's amounts (a deleted member is left out).
  const byAmount = new Map(runs.map((r) => [r.sweepAmount, r]))
  const present = sweep.amounts.flatMap((amount) => {
    const run = byAmount.get(amount)
    return run ? [{ amount, run }] : []
  })
  const referenceRun = byAmount.get(sweep.referenceAmount)
  const referenceSummary = referenceRun?.status === 'succeeded' ? summaryOf(referenceRun) : null
  const reference = referenceSummary ? netFluxes(referenceSummary) : null
  const members: SweepMember[] = present.map(({ amount, run }) => {
    const summary = run.status === 'succeeded' ? summaryOf(run) : null
    const net = summary ? netFluxes(summary) : null
    return {
      runId: run.id,
      amount,
      status: run.status,
      chunksDone: run.chunksDone,
      chunkCount: run.chunkCount,
      olrWPerM2: (summary?.olrWPerM2 as number | undefined) ?? null,
      forcingWPerM2:
        net && reference
          ? {
              top: reference.top - net.top,
              tropopause: reference.tropopause - net.tropopause,
              surface: reference.surface - net.surface,
            }
          : null,
    }
  })
  const done = members.filter((m) => m.forcingWPerM2 !== null)
  const fittable = done.length >= 2 && sweep.referenceAmount > 0 && done.every((m) => m.amount > 0)
  const fitAt = (level: keyof SweepForcing) =>
    fitLogarithmicForcing(
      done.map((m) => m.amount),
      done.map((m) => m.forcingWPerM2![level]),
      sweep.referenceAmount,
      true,
    )
  return {
    id: sweep.id,
    name: sweep.name,
    gas: sweep.gas,
    unit: sweep.unit,
    referenceAmount: sweep.referenceAmount,
    ownerId: sweep.ownerId,
    ownerName: sweep.owner?.displayName ?? '',
    createdAt: sweep.createdAt.toISOString(),
    status: sweepStatus(members.map((m) => m.status)),
    members,
    logarithmicFit: fittable
      ? { top: fitAt('top'), tropopause: fitAt('tropopause'), surface: fitAt('surface') }
      : null,
  }
}

/** The forcing table of a sweep as CSV rows (one per member). */
export function sweepForcingCsvRows(sweep: SweepDetail) {
  return sweep.members.map((m) => ({
    [`${sweep.gas}_${sweep.unit}`]: m.amount,
    run_id: m.runId,
    status: m.status,
    'olr_W_m-2': m.olrWPerM2 ?? '',
    'forcing_top_W_m-2': m.forcingWPerM2?.top ?? '',
    'forcing_tropopause_W_m-2': m.forcingWPerM2?.tropopause ?? '',
    'forcing_surface_W_m-2': m.forcingWPerM2?.surface ?? '',
  }))
}
