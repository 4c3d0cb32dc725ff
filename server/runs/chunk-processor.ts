import type { Sequelize } from 'sequelize'
import { workerDatabaseOf } from '../catalogue/worker-database'
import type { Logger } from '../logger'
import { Run, RunChunk } from '../models/index'
import { encodeChunkResult } from './chunk-codec'
import type { ChunkPool } from './chunk-pool'
import { finalizeRun } from './finalize-run'
import { runInputHash } from './run-inputs'
import type { ChunkJobData } from './run-queue'

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
const MAX_CACHED_INPUTS = 8

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

/**
 * Handles one chunk job. Idempotent: a chunk already done is never counted twice, and a chunk of
 * a cancelled or failed run is skipped. Throws (so the queue retries) only for errors that may
 * pass — a lost connection, a crashed thread — and fails the run when retries are used up.
 */
export async function processChunkJob(deps: ChunkProcessorDeps, data: ChunkJobData, job: ChunkJobMeta): Promise<void> {
  const { sequelize, pool, logger, workerId } = deps
  const run = await Run.findByPk(data.runId, { attributes: [...RUN_STATE_COLUMNS] })
  if (!run || run.status === 'cancelled' || run.status === 'failed' || run.status === 'succeeded') return
  const inputs = await runInputsOf(run.id)
  if (!inputs) return
  const chunk = await RunChunk.findOne({ where: { runId: run.id, chunkIndex: data.chunkIndex } })
  if (!chunk || chunk.status === 'done') return

  if (run.status === 'queued') {
    await Run.update({ status: 'running', startedAt: new Date() }, { where: { id: run.id, status: 'queued' } })
  }
  await RunChunk.update(
    { status: 'running', attempts: chunk.attempts + 1, workerId, startedAt: new Date() },
    { where: { id: chunk.id } },
  )

  let outcome
  try {
    outcome = await pool.run({ inputHash: run.inputHash, inputs, chunkIndex: data.chunkIndex, database: workerDatabaseOf(sequelize) })
  } catch (err) {
    const reason = `chunk ${data.chunkIndex} (${chunk.startCm}–${chunk.endCm} cm⁻¹) failed on ${workerId}: ${(err as Error).message}`
    await RunChunk.update({ status: 'failed', error: reason }, { where: { id: chunk.id } })
    if (job.retryCount >= job.retryLimit) {
      await failRun(sequelize, run.id, `${reason} (after ${job.retryCount + 1} attempts)`)
      return
    }
    logger.warn(`${reason}; will retry`)
    throw err
  }
  if (!outcome.ok) {
    const reason = `chunk ${data.chunkIndex} (${chunk.startCm}–${chunk.endCm} cm⁻¹) cannot be computed: ${outcome.message}`
    await RunChunk.update({ status: 'failed', error: reason }, { where: { id: chunk.id } })
    await failRun(sequelize, run.id, reason)
    return
  }

  const stored = encodeChunkResult(outcome.result)
  await sequelize.transaction(async (tx) => {
    const locked = await Run.findByPk(run.id, { attributes: [...RUN_STATE_COLUMNS], transaction: tx, lock: tx.LOCK.UPDATE })
    if (!locked || locked.status !== 'running') return
    const [updated] = await RunChunk.update(
      { status: 'done', result: stored, computeMs: outcome.computeMs, finishedAt: new Date(), error: null },
      { where: { id: chunk.id, status: ['pending', 'running', 'failed'] }, transaction: tx },
    )
    if (updated === 0) return // another worker finished this chunk first
    locked.chunksDone += 1
    locked.computeMs += outcome.computeMs
    await locked.save({ transaction: tx })
    if (locked.chunksDone === locked.chunkCount) await finalizeRun(locked, inputs, tx)
  })
}

/** Sanity check used by tests and the worker: the stored hash still matches the stored inputs. */
export function inputsMatchHash(run: Run): boolean {
  return runInputHash(run.inputs) === run.inputHash
}
