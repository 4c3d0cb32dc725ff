// Runs the command line's calculations on worker threads: the chunks of a run (or of every member
// of a sweep) are spread over the run pool's threads and merged here in chunk order, so the numbers
// are bit-identical to a single-thread calculation (chunks are independent and deterministic).
import { createHash } from 'node:crypto'
import { computeSweep, prepareSweep, type SweepResult } from '../../shared/physics/engine/compute-sweep'
import type { ComputeProgress } from '../../shared/physics/engine/compute'
import type { ChunkResult } from '../../shared/physics/engine/compute-chunk'
import { mergeChunkResults } from '../../shared/physics/engine/merge'
import type { ComputeSettings } from '../../shared/physics/engine/settings'
import { PhysicsError } from '../../shared/physics/errors'
import type { AtmosphereProfile, GasId } from '../../shared/physics/types'
import type { LoadedCatalogue } from '../../server/catalogue/builtin-catalogue'
import { createChunkPool } from '../../server/runs/chunk-pool'

/**
 * Computes runs that differ only in `sweptGas` (one profile: an ordinary run) on `threads`
 * threads, the members of each chunk together (engine/compute-sweep.ts).
 */
export async function computeOnThreads(
  profiles: AtmosphereProfile[],
  catalogue: LoadedCatalogue,
  settings: Partial<ComputeSettings>,
  sweptGas: GasId,
  threads: number,
  onProgress?: (p: ComputeProgress) => void,
): Promise<SweepResult> {
  // Preparing here too checks the inputs before any thread starts and gives the chunk plan.
  const sweep = prepareSweep(profiles, catalogue.table, settings, sweptGas)
  const chunkCount = sweep.chunks.length
  if (threads <= 1 || chunkCount === 1) {
    return computeSweep(profiles, catalogue.table, settings, sweptGas, onProgress)
  }
  const key = createHash('sha256')
    .update(JSON.stringify({ profiles, settings, sweptGas, checksum: catalogue.checksum }))
    .digest('hex')
  const catalogueRef = {
    id: catalogue.id,
    checksum: catalogue.checksum,
    generatorVersion: catalogue.generatorVersion,
    lineCount: catalogue.lineCount,
  }
  const pool = createChunkPool(Math.min(threads, chunkCount))
  const perMember: ChunkResult[][] = sweep.members.map(() => new Array<ChunkResult>(chunkCount))
  let done = 0
  try {
    await Promise.all(
      sweep.chunks.map(async (chunk) => {
        const outcome = await pool.runSweep({
          kind: 'sweep',
          key,
          profiles,
          settings,
          sweptGas,
          catalogue: catalogueRef,
          chunkIndex: chunk.index,
        })
        if (!outcome.ok) throw new PhysicsError(outcome.code as PhysicsError['code'], outcome.message)
        outcome.results.forEach((result, m) => (perMember[m][chunk.index] = result))
        onProgress?.({ chunksDone: ++done, chunkCount })
      }),
    )
  } finally {
    await pool.destroy()
  }
  return {
    members: sweep.members.map((prepared, m) => mergeChunkResults(prepared, perMember[m])),
    independentReason: sweep.independentReason,
  }
}
