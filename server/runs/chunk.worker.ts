// Worker-thread entry (piscina): computes one spectral chunk of a run, or one chunk of every
// member of a sweep. Pure computation; the only database access is a plain pg read of an
// imported catalogue's lines, once per catalogue.
import { computeChunk, type ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { computeSweepChunk, prepareSweep, type PreparedSweep } from '../../shared/physics/engine/compute-sweep'
import { prepareComputation, type ChunkBounds, type PreparedComputation } from '../../shared/physics/engine/prepare'
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
  /** Where an imported catalogue's lines are read from (unused for the built-in catalogue). */
  database?: WorkerDatabase
}

/** A computed chunk, or a deterministic physics failure (retrying would fail the same way). */
export type ChunkTaskResult =
  | { ok: true; result: ChunkResult; computeMs: number }
  | { ok: false; code: string; message: string }

/** The chunk of every member of a sweep, in member order, or a physics failure. */
export type SweepChunkTaskResult =
  | { ok: true; results: ChunkResult[]; computeMs: number }
  | { ok: false; code: string; message: string }

// Prepared inputs of the last few runs and sweeps, so consecutive chunks share the layer work.
const MAX_PREPARED = 4
const preparedByHash = new Map<string, PreparedComputation>()
const sweepsByKey = new Map<string, PreparedSweep>()

/** The value remembered under `key`, else a new one (the oldest of more than MAX_PREPARED is forgotten). */
async function remembered<V>(cache: Map<string, V>, key: string, create: () => Promise<V>): Promise<V> {
  let value = cache.get(key)
  if (value === undefined) {
    value = await create()
    cache.set(key, value)
    if (cache.size > MAX_PREPARED) cache.delete(cache.keys().next().value!)
  }
  return value
}

type Computed<R> = { ok: true; computeMs: number; value: R } | { ok: false; code: string; message: string }

/**
 * Computes chunk `index` of prepared inputs; an input a physics check refuses, or a catalogue that
 * cannot be read, becomes a failed result (retrying would fail the same way), anything else throws.
 */
async function computeChunkOf<P extends { chunks: ChunkBounds[] }, R>(
  prepare: () => Promise<P>,
  index: number,
  compute: (prepared: P, chunk: ChunkBounds) => R,
): Promise<Computed<R>> {
  try {
    const prepared = await prepare()
    const chunk = prepared.chunks[index]
    if (!chunk) throw new Error(`chunk ${index} does not exist (there are ${prepared.chunks.length})`)
    const t0 = performance.now()
    const value = compute(prepared, chunk)
    return { ok: true, value, computeMs: performance.now() - t0 }
  } catch (err) {
    if (err instanceof PhysicsError || err instanceof CatalogueUnavailableError) return { ok: false, code: err.code, message: err.message }
    throw err
  }
}

async function computeRunTask(task: ChunkTask): Promise<ChunkTaskResult> {
  const outcome = await computeChunkOf(
    () =>
      remembered(preparedByHash, task.inputHash, async () => {
        const table = await loadRunCatalogueTable(task.inputs.catalogue, task.database)
        return prepareComputation(task.inputs.profile.snapshot, table, task.inputs.settings)
      }),
    task.chunkIndex,
    computeChunk,
  )
  return outcome.ok ? { ok: true, result: outcome.value, computeMs: outcome.computeMs } : outcome
}

async function computeSweepTask(task: SweepChunkTask): Promise<SweepChunkTaskResult> {
  const outcome = await computeChunkOf(
    () =>
      remembered(sweepsByKey, task.key, async () => {
        const table = await loadRunCatalogueTable(task.catalogue, task.database)
        return prepareSweep(task.profiles, table, task.settings, task.sweptGas)
      }),
    task.chunkIndex,
    computeSweepChunk,
  )
  return outcome.ok ? { ok: true, results: outcome.value, computeMs: outcome.computeMs } : outcome
}

export default async function computeTask(task: ChunkTask | SweepChunkTask): Promise<ChunkTaskResult | SweepChunkTaskResult> {
  return 'kind' in task && task.kind === 'sweep' ? computeSweepTask(task) : computeRunTask(task as ChunkTask)
}
