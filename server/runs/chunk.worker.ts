// Worker-thread entry (piscina): computes one spectral chunk of a run. Pure computation, no DB.
import { computeChunk, type ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { prepareComputation, type PreparedComputation } from '../../shared/physics/engine/prepare'
import { PhysicsError } from '../../shared/physics/errors'
import type { RunInputs } from '../../shared/schemas/runs'
import { loadBuiltInCatalogue } from '../catalogue/builtin-catalogue'

export interface ChunkTask {
  inputHash: string
  inputs: RunInputs
  chunkIndex: number
}

/** A computed chunk, or a deterministic physics failure (retrying would fail the same way). */
export type ChunkTaskResult =
  | { ok: true; result: ChunkResult; computeMs: number }
  | { ok: false; code: string; message: string }

// Prepared inputs of the last few runs, so consecutive chunks of one run share the layer work.
const preparedByHash = new Map<string, PreparedComputation>()
const MAX_PREPARED = 4

function prepared(task: ChunkTask): PreparedComputation {
  let p = preparedByHash.get(task.inputHash)
  if (!p) {
    if (task.inputs.catalogue.id !== 'builtin') throw new Error(`unknown catalogue ${task.inputs.catalogue.id}`)
    const catalogue = loadBuiltInCatalogue()
    if (catalogue.checksum !== task.inputs.catalogue.checksum) {
      throw new Error('the built-in catalogue on this worker differs from the one the run was submitted with')
    }
    p = prepareComputation(task.inputs.profile.snapshot, catalogue.table, task.inputs.settings)
    preparedByHash.set(task.inputHash, p)
    if (preparedByHash.size > MAX_PREPARED) preparedByHash.delete(preparedByHash.keys().next().value!)
  }
  return p
}

export default function computeRunChunk(task: ChunkTask): ChunkTaskResult {
  try {
    const p = prepared(task)
    const chunk = p.chunks[task.chunkIndex]
    if (!chunk) throw new Error(`chunk ${task.chunkIndex} does not exist (the run has ${p.chunks.length})`)
    const t0 = performance.now()
    const result = computeChunk(p, chunk)
    return { ok: true, result, computeMs: performance.now() - t0 }
  } catch (err) {
    if (err instanceof PhysicsError) return { ok: false, code: err.code, message: err.message }
    throw err
  }
}
