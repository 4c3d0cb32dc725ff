import type { Sequelize } from 'sequelize'
import type { ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { workerDatabaseOf } from '../catalogue/worker-database'
import type { Logger } from '../logger'
import { Run, RunChunk } from '../models/index'
import { encodeChunkResult } from './chunk-codec'
import type { ChunkPool } from './chunk-pool'
import { finalizeRun } from './finalize-run'
import { runInputHash } from './run-inputs'
import type { ChunkJobData, SweepChunkJobData } from './run-queue'
import { sweepMemberProfiles } from './sweep.service'

export interface ChunkProcessorDeps {
  sequelize: Sequelize
  pool: ChunkPool
  logger: Logger
  workerId: string
}

export interface ChunkJobMeta {
  id: string
  retryCount: number
  retryLimit: number
}

/** Marks a run failed with a reason and cancels nothing else: other chunks see the status and stop. */
export async function failRun(sequelize: Sequelize, runId: number, reason: string): Promise<void> {
  await sequelize.transaction(async (tx) => {
    const run = await Run.findByPk(runId, { transaction: tx, lock: tx.LOCK.UPDATE })
    if (!run || run.status === 'succeeded' || run.status === 'cancelled' || run.status === 'failed') return
    run.status = 'failed'
    run.error = reason
    run.finishedAt = new Date()
    await run.save({ transaction: tx })
  })
}

/** Columns of a run a chunk job reads on every chunk; the frozen inputs are read once per run. */
const RUN_STATE_COLUMNS = ['id', 'status', 'inputHash', 'chunksDone', 'chunkCount', 'computeMs', 'startedAt', 'finishedAt', 'error'] as const

// A run's inputs never change after submission (the hash covers them), so a worker keeps the last
// few instead of reading and parsing the profile snapshot again for every chunk.
const inputsByRunId = new Map<number, Run['inputs']>()
// (a sweep's members, up to 12, are read together)
const MAX_CACHED_INPUTS = 16

async function runInputsOf(runId: number): Promise<Run['inputs'] | null> {
  let inputs = inputsByRunId.get(runId)
  if (!inputs) {
    const row = await Run.findByPk(runId, { attributes: ['id', 'inputs'] })
    if (!row) return null
    inputs = row.inputs
    inputsByRunId.set(runId, inputs)
    if (inputsByRunId.size > MAX_CACHED_INPUTS) inputsByRunId.delete(inputsByRunId.keys().next().value!)
  }
  return inputs
}

type MemberRun = Pick<Run, 'id' | 'status' | 'inputHash'>

const isOver = (run: MemberRun | null | undefined) =>
  !run || run.status === 'cancelled' || run.status === 'failed' || run.status === 'succeeded'

/** Marks the run running (if queued) and the chunk taken; null when the chunk is gone or done. */
async function claimChunk(run: MemberRun, chunkIndex: number, workerId: string): Promise<RunChunk | null> {
  const chunk = await RunChunk.findOne({ where: { runId: run.id, chunkIndex } })
  if (!chunk || chunk.status === 'done') return null
  if (run.status === 'queued') {
    await Run.update({ status: 'running', startedAt: new Date() }, { where: { id: run.id, status: 'queued' } })
  }
  await RunChunk.update(
    { status: 'running', attempts: chunk.attempts + 1, workerId, startedAt: new Date() },
    { where: { id: chunk.id } },
  )
  return chunk
}

/** Stores a computed chunk and counts it once; the last chunk of a run merges its results. */
async function storeChunk(
  sequelize: Sequelize,
  runId: number,
  chunk: RunChunk,
  result: ChunkResult,
  computeMs: number,
  inputs: Run['inputs'],
): Promise<void> {
  const stored = encodeChunkResult(result)
  await sequelize.transaction(async (tx) => {
    const locked = await Run.findByPk(runId, { attributes: [...RUN_STATE_COLUMNS], transaction: tx, lock: tx.LOCK.UPDATE })
    if (!locked || locked.status !== 'running') return
    const [updated] = await RunChunk.update(
      { status: 'done', result: stored, computeMs, finishedAt: new Date(), error: null },
      { where: { id: chunk.id, status: ['pending', 'running', 'failed'] }, transaction: tx },
    )
    if (updated === 0) return // another worker finished this chunk first
    locked.chunksDone += 1
    locked.computeMs += computeMs
    await locked.save({ transaction: tx })
    if (locked.chunksDone === locked.chunkCount) await finalizeRun(locked, inputs, tx)
  })
}

/**
 * Records a chunk that could not be computed on each of its runs: a failure that may pass (a
 * crash, a lost connection) is retried by the queue (this throws) until the retries are used up;
 * a deterministic one (`retry` null) fails the runs at once.
 */
async function chunkFailed(
  sequelize: Sequelize,
  taken: { runId: number; chunk: RunChunk }[],
  reason: string,
  retry: { err: unknown; job: ChunkJobMeta; logger: Logger } | null,
): Promise<void> {
  for (const { chunk } of taken) await RunChunk.update({ status: 'failed', error: reason }, { where: { id: chunk.id } })
  if (retry && retry.job.retryCount < retry.job.retryLimit) {
    retry.logger.warn(`${reason}; will retry`)
    throw retry.err
  }
  const suffix = retry ? ` (after ${retry.job.retryCount + 1} attempts)` : ''
  for (const { runId } of taken) await failRun(sequelize, runId, `${reason}${suffix}`)
}

/**
 * Handles one chunk job. Idempotent: a chunk already done is never counted twice, and a chunk of
 * a cancelled or failed run is skipped. Throws (so the queue retries) only for errors that may
 * pass — a lost connection, a crashed thread — and fails the run when retries are used up.
 */
export async function processChunkJob(deps: ChunkProcessorDeps, data: ChunkJobData, job: ChunkJobMeta): Promise<void> {
  if ('runIds' in data) return processSweepChunkJob(deps, data, job)
  const { sequelize, pool, logger, workerId } = deps
  const run = await Run.findByPk(data.runId, { attributes: [...RUN_STATE_COLUMNS] })
  if (!run || isOver(run)) return
  const inputs = await runInputsOf(run.id)
  if (!inputs) return
  const chunk = await claimChunk(run, data.chunkIndex, workerId)
  if (!chunk) return
  const where = `chunk ${data.chunkIndex} (${chunk.startCm}–${chunk.endCm} cm⁻¹)`
  let outcome
  try {
    outcome = await pool.run({ inputHash: run.inputHash, inputs, chunkIndex: data.chunkIndex, database: workerDatabaseOf(sequelize) })
  } catch (err) {
    return chunkFailed(sequelize, [{ runId: run.id, chunk }], `${where} failed on ${workerId}: ${(err as Error).message}`, { err, job, logger })
  }
  if (!outcome.ok) return chunkFailed(sequelize, [{ runId: run.id, chunk }], `${where} cannot be computed: ${outcome.message}`, null)
  await storeChunk(sequelize, run.id, chunk, outcome.result, outcome.computeMs, inputs)
}

/**
 * One chunk of every member of a sweep, computed together (engine/compute-sweep.ts) and stored
 * on each member still computing. The members' profiles are rebuilt from any member's inputs, so
 * the chunk is the same whichever members are left.
 */
async function processSweepChunkJob(deps: ChunkProcessorDeps, data: SweepChunkJobData, job: ChunkJobMeta): Promise<void> {
  const { sequelize, pool, logger, workerId } = deps
  const runs = await Run.findAll({ where: { id: data.runIds }, attributes: [...RUN_STATE_COLUMNS] })
  const active = data.runIds.flatMap((id, member) => {
    const run = runs.find((r) => r.id === id)
    return run && !isOver(run) ? [{ run, member }] : []
  })
  if (active.length === 0) return
  const inputs = await runInputsOf(active[0].run.id)
  if (!inputs?.sweep) return
  const taken: { runId: number; member: number; chunk: RunChunk }[] = []
  for (const { run, member } of active) {
    const chunk = await claimChunk(run, data.chunkIndex, workerId)
    if (chunk) taken.push({ runId: run.id, member, chunk })
  }
  if (taken.length === 0) return
  const { chunk } = taken[0]
  const where = `chunk ${data.chunkIndex} (${chunk.startCm}–${chunk.endCm} cm⁻¹) of sweep ${data.sweepId}`
  let profiles
  try {
    profiles = sweepMemberProfiles(inputs)
  } catch (err) {
    // The frozen inputs themselves are refused: retrying would fail the same way.
    return chunkFailed(sequelize, taken, `${where} cannot be computed: ${(err as Error).message}`, null)
  }
  let outcome
  try {
    outcome = await pool.runSweep({
      kind: 'sweep',
      key: `sweep-${data.sweepId}-${inputs.sweep.amounts.join(',')}-${inputs.catalogue.checksum}`,
      profiles,
      settings: inputs.settings,
      sweptGas: inputs.sweep.gas,
      catalogue: inputs.catalogue,
      chunkIndex: data.chunkIndex,
      database: workerDatabaseOf(sequelize),
    })
  } catch (err) {
    return chunkFailed(sequelize, taken, `${where} failed on ${workerId}: ${(err as Error).message}`, { err, job, logger })
  }
  if (!outcome.ok) return chunkFailed(sequelize, taken, `${where} cannot be computed: ${outcome.message}`, null)
  const perMemberMs = outcome.computeMs / data.runIds.length
  for (const { runId, member, chunk: memberChunk } of taken) {
    const memberInputs = await runInputsOf(runId)
    if (memberInputs) await storeChunk(sequelize, runId, memberChunk, outcome.results[member], perMemberMs, memberInputs)
  }
}

/** Sanity check used by tests and the worker: the stored hash still matches the stored inputs. */
export function inputsMatchHash(run: Run): boolean {
  return runInputHash(run.inputs) === run.inputHash
}
