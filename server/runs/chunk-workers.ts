import { hostname } from 'node:os'
import type { Sequelize } from 'sequelize'
import type { Logger } from '../logger'
import type { ChunkPool } from './chunk-pool'
import { processChunkJob } from './chunk-processor'
import { CHUNK_QUEUE, type ChunkJobData, type RunQueue } from './run-queue'

/**
 * Subscribes this process to the chunk queue with one polling loop per pool thread plus
 * `chunksAhead` more, so a machine takes as many chunks at a time as it has threads and holds
 * the next one ready: the database work of a chunk (taking the job, marking it, storing the last
 * result) then overlaps another chunk's compute instead of leaving the thread idle. Any number of
 * processes, on any machines reaching the same database, can do this.
 */
export async function startChunkWorkers(
  queue: RunQueue,
  deps: { sequelize: Sequelize; pool: ChunkPool; logger: Logger },
  chunksAhead = 1,
  workerName = `${hostname()}:${process.pid}`,
): Promise<void> {
  for (let i = 0; i < deps.pool.size + chunksAhead; i++) {
    const loop: { id?: string } = {}
    loop.id = await queue.boss.work<ChunkJobData>(
      CHUNK_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
      async ([job]) => {
        await processChunkJob({ ...deps, workerId: `${workerName}#${i}` }, job.data, {
          id: job.id,
          retryCount: job.retryCount,
          retryLimit: job.retryLimit,
        })
        // pg-boss waits out the rest of the polling interval after every job; with chunks often
        // shorter than that, ask for the next one at once (the queue is likely not empty).
        if (loop.id) queue.boss.notifyWorker(loop.id)
      },
    )
  }
  deps.logger.info(`chunk workers ready: ${deps.pool.size} thread(s), ${chunksAhead} chunk(s) ahead, on ${workerName}`)
}
