import { availableParallelism } from 'node:os'
import { Piscina } from 'piscina'
import type { ChunkTask, ChunkTaskResult, SweepChunkTask, SweepChunkTaskResult } from './chunk.worker'

export interface ChunkPool {
  run(task: ChunkTask): Promise<ChunkTaskResult>
  /** One chunk of every member of a sweep (engine/compute-sweep.ts). */
  runSweep(task: SweepChunkTask): Promise<SweepChunkTaskResult>
  size: number
  destroy(): Promise<void>
}

/** A worker-thread pool for chunk computations, sized to the machine unless told otherwise. */
export function createChunkPool(threads = availableParallelism()): ChunkPool {
  const pool = new Piscina({
    // The entry registers tsx's ES-module loader in the thread, then loads chunk.worker.ts.
    filename: new URL('./chunk-worker-entry.mjs', import.meta.url).href,
    minThreads: 1,
    maxThreads: Math.max(1, threads),
    idleTimeout: 60_000,
  })
  return {
    run: (task) => pool.run(task) as Promise<ChunkTaskResult>,
    runSweep: (task) => pool.run(task) as Promise<SweepChunkTaskResult>,
    size: Math.max(1, threads),
    destroy: () => pool.destroy(),
  }
}
