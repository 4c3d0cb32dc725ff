import { randomUUID } from 'node:crypto'
import { literal, Op, QueryTypes, type Sequelize, type Transaction, type WhereOptions } from 'sequelize'
import { planChunks, type ChunkBounds } from '../../shared/physics/engine/prepare'
import type { Page } from '../../shared/schemas/paging'
import { TERMINAL_RUN_STATUSES, type CreateRunInput, type RunDetail, type RunInputs, type RunListQuery, type RunSummary } from '../../shared/schemas/runs'
import { AppError } from '../errors'
import { Run, RunChunk, RunResult, User } from '../models/index'
import { assertCanModify, type Actor } from '../services/access'
import { assertNotSignedOff, signOffsOf, type SignOffInfo } from '../services/review.service'
import { runInputHash, snapshotRunInputs } from './run-inputs'
import type { RunQueue } from './run-queue'

function toSummary(run: Run, olr: number | null = null, signOff?: SignOffInfo): RunSummary {
  const elapsedS = run.startedAt ? (Date.now() - run.startedAt.getTime()) / 1000 : null
  const etaSeconds =
    run.status === 'running' && elapsedS !== null && run.chunksDone > 0
      ? (elapsedS / run.chunksDone) * (run.chunkCount - run.chunksDone)
      : null
  return {
    id: run.id,
    name: run.name,
    sweepId: run.sweepId ?? null,
    status: run.status,
    profileName: run.inputs.profile.name,
    mixtureName: run.inputs.mixture?.name ?? null,
    startCm: run.inputs.settings.startCm,
    endCm: run.inputs.settings.endCm,
    chunkCount: run.chunkCount,
    chunksDone: run.chunksDone,
    error: run.error,
    inputHash: run.inputHash,
    engineVersion: run.engineVersion,
    ownerId: run.ownerId,
    ownerName: run.owner?.displayName ?? '',
    queuedAt: run.queuedAt.toISOString(),
    startedAt: run.startedAt?.toISOString() ?? null,
    finishedAt: run.finishedAt?.toISOString() ?? null,
    computeMs: run.computeMs,
    etaSeconds,
    olrWPerM2: olr,
    signedOff: signOff !== undefined,
    signedOffBy: signOff?.reviewerName ?? null,
    signedOffAt: signOff?.signedAt.toISOString() ?? null,
  }
}

/** The name a run gets when none is given: profile · mixture · what (when given) · range. */
export function defaultRunName(inputs: RunInputs, what?: string): string {
  const mixture = inputs.mixture ? ` · ${inputs.mixture.name}` : ''
  return `${inputs.profile.name}${mixture}${what ? ` · ${what}` : ''} · ${inputs.settings.startCm}–${inputs.settings.endCm} cm⁻¹`
}

/**
 * Stores a queued run and its pending chunks, each chunk with the id of the job that will compute
 * it (so every job can be queued in one insert once the transaction is committed).
 */
export async function insertQueuedRun(
  tx: Transaction,
  run: { name: string; inputs: RunInputs; ownerId: number; sweepId?: number; sweepAmount?: number },
  chunks: readonly ChunkBounds[],
  jobIds: readonly string[],
): Promise<Run> {
  const created = await Run.create(
    {
      name: run.name.slice(0, 160),
      status: 'queued',
      inputs: run.inputs,
      inputHash: runInputHash(run.inputs),
      engineVersion: run.inputs.engineVersion,
      chunkCount: chunks.length,
      error: null,
      queuedAt: new Date(),
      startedAt: null,
      finishedAt: null,
      ownerId: run.ownerId,
      sweepId: run.sweepId ?? null,
      sweepAmount: run.sweepAmount ?? null,
    },
    { transaction: tx },
  )
  await RunChunk.bulkCreate(
    chunks.map((c, i) => ({
      runId: created.id,
      chunkIndex: c.index,
      startCm: c.startCm,
      endCm: c.endCm,
      status: 'pending' as const,
      jobId: jobIds[i],
      workerId: null,
      result: null,
      error: null,
      computeMs: null,
      startedAt: null,
      finishedAt: null,
    })),
    { transaction: tx },
  )
  return created
}

/** Snapshots the inputs, stores the run and its chunks, and queues every chunk. */
export async function createRun(sequelize: Sequelize, queue: RunQueue, actor: Actor, input: CreateRunInput): Promise<RunDetail> {
  const { inputs, warnings } = await snapshotRunInputs(input)
  const chunks = planChunks(inputs.settings)
  const name = input.name?.trim() || defaultRunName(inputs)
  // Job ids are chosen here so the chunk rows carry them from the start and every job is queued
  // in one insert.
  const jobIds = chunks.map(() => randomUUID())
  const run = await sequelize.transaction((tx) => insertQueuedRun(tx, { name, inputs, ownerId: actor.id }, chunks, jobIds))
  // Queue after the rows are committed, so a fast worker always finds them.
  await queue.enqueueChunks(chunks.map((c, i) => ({ jobId: jobIds[i], data: { runId: run.id, chunkIndex: c.index } })))
  return { ...(await getRun(run.id)), mixtureWarnings: warnings }
}

/**
 * The frozen inputs without the profile snapshot (~15 kB of levels a run): all a summary shows.
 * Lists read this instead of the whole column, which would be sent and parsed for every row.
 */
const INPUTS_WITHOUT_SNAPSHOT = literal(`"Run"."inputs" #- '{profile,snapshot}'`)

export async function listRuns(actor: Actor, query: RunListQuery): Promise<Page<RunSummary>> {
  const where: WhereOptions<Run> = {}
  if (query.status) Object.assign(where, { status: query.status })
  if (query.mine === 'true') Object.assign(where, { ownerId: actor.id })
  if (query.search) Object.assign(where, { name: { [Op.iLike]: `%${query.search}%` } })
  // The count needs no joins; both queries run at once.
  const [count, rows] = await Promise.all([
    Run.count({ where }),
    Run.findAll({
      where,
      attributes: { exclude: ['inputs'], include: [[INPUTS_WITHOUT_SNAPSHOT, 'inputs']] },
      include: [
        { model: User, as: 'owner', attributes: ['displayName'] },
        { model: RunResult, as: 'result', attributes: ['summary'] },
      ],
      order: [['id', 'DESC']],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    }),
  ])
  const olr = (r: Run) => ((r as unknown as { result?: RunResult }).result?.summary?.olrWPerM2 as number | undefined) ?? null
  const signOffs = await signOffsOf(rows.map((r) => r.id))
  return { items: rows.map((r) => toSummary(r, olr(r), signOffs.get(r.id))), total: count, page: query.page, pageSize: query.pageSize }
}

async function findOrFail(id: number): Promise<Run> {
  const run = await Run.findByPk(id, { include: [{ model: User, as: 'owner', attributes: ['displayName'] }] })
  if (!run) throw AppError.notFound('Run')
  return run
}

export async function getRun(id: number): Promise<RunDetail> {
  // The run, its owner and its result summary in one query, the sign-off alongside.
  const [run, signOffs] = await Promise.all([
    Run.findByPk(id, {
      include: [
        { model: User, as: 'owner', attributes: ['displayName'] },
        { model: RunResult, as: 'result', attributes: ['summary'] },
      ],
    }),
    signOffsOf([id]),
  ])
  if (!run) throw AppError.notFound('Run')
  const result = (run as unknown as { result?: RunResult }).result
  return {
    ...toSummary(run, (result?.summary?.olrWPerM2 as number | undefined) ?? null, signOffs.get(id)),
    inputs: run.inputs,
  }
}

/** Progress only, cheap enough to poll every second. */
export async function getRunProgress(id: number) {
  const run = await Run.findByPk(id, { attributes: ['id', 'status', 'chunksDone', 'chunkCount', 'startedAt', 'finishedAt', 'error', 'queuedAt', 'inputs'] })
  if (!run) throw AppError.notFound('Run')
  const s = toSummary(run)
  return { id: s.id, status: s.status, chunksDone: s.chunksDone, chunkCount: s.chunkCount, startedAt: s.startedAt, finishedAt: s.finishedAt, etaSeconds: s.etaSeconds, error: s.error }
}

/** Stops a queued or running run: pending jobs are cancelled, running chunks are discarded. */
export async function cancelRun(sequelize: Sequelize, queue: RunQueue, actor: Actor, id: number): Promise<RunDetail> {
  const run = await findOrFail(id)
  assertCanModify(actor, run.ownerId, 'run')
  if (TERMINAL_RUN_STATUSES.includes(run.status)) {
    throw AppError.conflict(`The run has already ${run.status === 'succeeded' ? 'finished' : run.status}.`)
  }
  const jobIds = await sequelize.transaction(async (tx) => {
    const locked = await Run.findByPk(id, { transaction: tx, lock: tx.LOCK.UPDATE })
    if (!locked || TERMINAL_RUN_STATUSES.includes(locked.status)) return []
    locked.status = 'cancelled'
    locked.finishedAt = new Date()
    locked.error = 'Cancelled by ' + (actor.id === run.ownerId ? 'its owner' : 'an administrator')
    await locked.save({ transaction: tx })
    const pending = await RunChunk.findAll({ where: { runId: id, status: ['pending', 'running', 'failed'] }, transaction: tx })
    await RunChunk.update({ status: 'cancelled' }, { where: { runId: id, status: ['pending', 'running', 'failed'] }, transaction: tx })
    // A sweep member's jobs compute the other members too: they stay queued and skip this run.
    if (locked.sweepId !== null) return []
    return pending.map((c) => c.jobId).filter((j): j is string => j !== null)
  })
  await queue.cancelJobs(jobIds)
  return getRun(id)
}

export async function deleteRun(sequelize: Sequelize, queue: RunQueue, actor: Actor, id: number): Promise<void> {
  const run = await findOrFail(id)
  assertCanModify(actor, run.ownerId, 'run')
  // A run still computing cannot be signed off, so stopping it first is safe.
  if (!TERMINAL_RUN_STATUSES.includes(run.status)) await cancelRun(sequelize, queue, actor, id)
  await sequelize.transaction(async (tx) => {
    // The same row lock as a sign-off takes, so the two cannot interleave.
    await Run.findByPk(id, { transaction: tx, lock: tx.LOCK.UPDATE })
    await assertNotSignedOff(id, 'it cannot be deleted', tx)
    await Run.destroy({ where: { id }, transaction: tx })
  })
}

async function succeededRunOrFail(id: number): Promise<Run> {
  const run = await findOrFail(id)
  if (run.status !== 'succeeded') throw AppError.conflict(`The run has no results yet (status: ${run.status}).`)
  return run
}

/** One stored JSON column of a run's results as the text PostgreSQL holds (null when unset). */
async function storedJsonText(id: number, column: 'data' | 'detail'): Promise<{ summary: string; body: string | null } | null> {
  const rows = await RunResult.sequelize!.query<{ summary: string; body: string | null }>(
    `SELECT summary::text AS summary, ${column}::text AS body FROM run_results WHERE run_id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  )
  return rows[0] ?? null
}

/**
 * The run's results as JSON text, the same document as getRunResults: the stored text is passed
 * through instead of parsed and serialised again (a 10–3000 cm⁻¹ run holds ≈ 7.5 MB).
 */
export async function getRunResultsJsonText(id: number): Promise<string> {
  const run = await succeededRunOrFail(id)
  const stored = await storedJsonText(id, 'data')
  if (!stored?.body) throw AppError.notFound('Run results')
  const head = JSON.stringify({ runId: id, inputHash: run.inputHash, engineVersion: run.engineVersion })
  return spliceJsonObjects(head, `{"summary":${stored.summary}}`, stored.body)
}

/** The full-resolution window as JSON text (the same document as getRunDetailSpectrum). */
export async function getRunDetailJsonText(id: number): Promise<string> {
  const run = await succeededRunOrFail(id)
  const stored = await storedJsonText(id, 'detail')
  if (!stored?.body || stored.body === 'null') throw noDetailWindow()
  const head = JSON.stringify({ runId: id, inputHash: run.inputHash, engineVersion: run.engineVersion })
  return spliceJsonObjects(head, stored.body)
}

/** Joins JSON object texts into one object (keys of later ones follow; none may be empty). */
function spliceJsonObjects(...objects: string[]): string {
  const inner = objects.map((o) => o.trim().slice(1, -1).trim()).filter((o) => o.length > 0)
  return `{${inner.join(',')}}`
}

const noDetailWindow = () =>
  new AppError(404, 'NOT_FOUND', 'This run has no full-resolution window: set one in the spectral settings of a new run.')

export async function getRunResults(id: number) {
  const run = await succeededRunOrFail(id)
  // The full-resolution window is served on its own (getRunDetailSpectrum).
  const result = await RunResult.findByPk(id, { attributes: ['runId', 'summary', 'data'] })
  if (!result) throw AppError.notFound('Run results')
  return { runId: id, inputHash: run.inputHash, engineVersion: run.engineVersion, summary: result.summary, ...result.data }
}

/** The run's full-resolution window; 404 when the run did not ask for one. */
export async function getRunDetailSpectrum(id: number) {
  const run = await succeededRunOrFail(id)
  const result = await RunResult.findByPk(id, { attributes: ['runId', 'detail'] })
  if (!result?.detail) throw noDetailWindow()
  return { runId: id, inputHash: run.inputHash, engineVersion: run.engineVersion, ...result.detail }
}
