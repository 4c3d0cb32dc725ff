// Worker-thread entry (piscina): computes one spectral chunk of a run. Pure computation; the only
// database access is a plain pg read of an imported catalogue's lines, once per catalogue.
import { computeChunk, type ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { prepareComputation, type PreparedComputation } from '../../shared/physics/engine/prepare'
import { PhysicsError } from '../../shared/physics/errors'
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

/** A computed chunk, or a deterministic physics failure (retrying would fail the same way). */
export type ChunkTaskResult =
  | { ok: true; result: ChunkResult; computeMs: number }
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

export default async function computeRunChunk(task: ChunkTask): Promise<ChunkTaskResult> {
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
