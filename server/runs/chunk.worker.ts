// Worker-thread entry (piscina): computes one spectral chunk of a run, or one chunk of every
// member of a sweep. Pure computation; the only database access is a plain pg read of an
// imported catalogue's lines, once per catalogue.
import { computeChunk, type ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { computeSweepChunk, prepareSweep, type PreparedSweep } from '../../shared/physics/engine/compute-sweep'
import { prepareComputation, type PreparedComputation } from '../../shared/physics/engine/prepare'
import type { ComputeSettings } from '../../shared/physics/engine/settings'
import { PhysicsError } from '../../shared/physics/errors'
import type { AtmosphereProfile, GasId } from '../../shared/physics/types'
import type { RunInputs } from '../../shared/schemas/runs'
import { CatalogueUnavailableError, loadRunCatalogueTable } from '../catalogue/catalogue-lines-loader'
import type { WorkerDatabase } from '../catalogue/worker-database'

export interface ChunkTask {
  inputHash: string
  inputs: RunInputs
  chunkIndex: number
  /** Where an imported catalogue's lines are read from (unused for the built-in catalogue). */
  database?: WorkerDatabase
}

/** One chunk of every member of a sweep (runs that differ only in `sweptGas`). */
export interface SweepChunkTask {
  kind: 'sweep'
  /** Identifies the sweep's inputs, so a thread prepares them once. */
  key: string
  profiles: AtmosphereProfile[]
  settings: Partial<ComputeSettings>
  sweptGas: GasId
  catalogue: RunInputs['catalogue']
  chunkIndex: number
}

/** A computed chunk, or a deterministic physics failure (retrying would fail the same way). */
export type ChunkTaskResult =
  | { ok: true; result: ChunkResult; computeMs: number }
  | { ok: false; code: string; message: string }

/** The chunk of every member of a sweep, in member order, or a physics failure. */
export type SweepChunkTaskResult =
  | { ok: true; results: ChunkResult[]; computeMs: number }
  | { ok: false; code: string; message: string }

// Prepared inputs of the last few runs, so consecutive chunks of one run share the layer work.
const preparedByHash = new Map<string, PreparedComputation>()
const MAX_PREPARED = 4

async function prepared(task: ChunkTask): Promise<PreparedComputation> {
  let p = preparedByHash.get(task.inputHash)
  if (!p) {
    const table = await loadRunCatalogueTable(task.inputs.catalogue, task.database)
    p = prepareComputation(task.inputs.profile.snapshot, table, task.inputs.settings)
    preparedByHash.set(task.inputHash, p)
    if (preparedByHash.size > MAX_PREPARED) preparedByHash.delete(preparedByHash.keys().next().value!)
  }
  return p
}

const sweepsByKey = new Map<string, PreparedSweep>()

async function preparedSweep(task: SweepChunkTask): Promise<PreparedSweep> {
  let sweep = sweepsByKey.get(task.key)
  if (!sweep) {
    const table = await loadRunCatalogueTable(task.catalogue, undefined)
    sweep = prepareSweep(task.profiles, table, task.settings, task.sweptGas)
    sweepsByKey.set(task.key, sweep)
    if (sweepsByKey.size > MAX_PREPARED) sweepsByKey.delete(sweepsByKey.keys().next().value!)
  }
  return sweep
}

async function computeSweepTask(task: SweepChunkTask): Promise<SweepChunkTaskResult> {
  try {
    const sweep = await preparedSweep(task)
    const chunk = sweep.chunks[task.chunkIndex]
    if (!chunk) throw new Error(`chunk ${task.chunkIndex} does not exist (the sweep has ${sweep.chunks.length})`)
    const t0 = performance.now()
    const results = computeSweepChunk(sweep, chunk)
    return { ok: true, results, computeMs: performance.now() - t0 }
  } catch (err) {
    if (err instanceof PhysicsError || err instanceof CatalogueUnavailableError) return { ok: false, code: err.code, message: err.message }
    throw err
  }
}

export default async function computeRunChunk(task: ChunkTask | SweepChunkTask): Promise<ChunkTaskResult | SweepChunkTaskResult> {
  if ('kind' in task && task.kind === 'sweep') return computeSweepTask(task)
  return computeRunTask(task as ChunkTask)
}

async function computeRunTask(task: ChunkTask): Promise<ChunkTaskResult> {
  try {
    const p = await prepared(task)
    const chunk = p.chunks[task.chunkIndex]
    if (!chunk) throw new Error(`chunk ${task.chunkIndex} does not exist (the run has ${p.chunks.length})`)
    const t0 = performance.now()
    const result = computeChunk(p, chunk)
    return { ok: true, result, computeMs: performance.now() - t0 }
  } catch (err) {
    if (err instanceof PhysicsError || err instanceof CatalogueUnavailableError) return { ok: false, code: err.code, message: err.message }
    throw err
  }
}
