import type { Sequelize } from 'sequelize'
import type { AppConfig } from '../config'
import type { Logger } from '../logger'
import { createChunkPool, type ChunkPool } from './chunk-pool'
import { startChunkWorkers } from './chunk-workers'
import { createRunQueue, type RunQueue } from './run-queue'

export interface RunSystem {
  queue: RunQueue
  pool?: ChunkPool
  stop(): Promise<void>
}

/**
 * Connects the job queue and, unless threads = 0, starts chunk workers in this process. The app
 * server and the standalone worker (`npm run worker`) both use this.
 */
export async function startRunSystem(
  config: AppConfig,
  sequelize: Sequelize,
  logger: Logger,
  threads = config.runs.workerThreads,
): Promise<RunSystem> {
  const queue = await createRunQueue({
    databaseUrl: config.databaseUrl,
    logger,
    chunkTimeoutSeconds: config.runs.chunkTimeoutSeconds,
    retryLimit: config.runs.retryLimit,
    maintenanceIntervalSeconds: config.runs.maintenanceIntervalSeconds,
  })
  const pool = threads === 0 ? undefined : createChunkPool(threads)
  if (pool) await startChunkWorkers(queue, { sequelize, pool, logger }, config.runs.chunksAhead)
  return {
    queue,
    pool,
    async stop() {
      await queue.stop()
      await pool?.destroy()
    },
  }
}
