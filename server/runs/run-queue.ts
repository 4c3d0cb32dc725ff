import PgBoss from 'pg-boss'
import type { Logger } from '../logger'

/** Name of the pg-boss queue of chunk jobs. */
export const CHUNK_QUEUE = 'run-chunk'

/** One chunk of one run, or one chunk of every member of a sweep (computed together). */
export type ChunkJobData = { runId: number; chunkIndex: number } | SweepChunkJobData

export interface SweepChunkJobData {
  sweepId: number
  /** The member runs, in the sweep's order. */
  runIds: number[]
  chunkIndex: number
}

export interface RunQueueOptions {
  databaseUrl: string
  logger: Logger
  /** A chunk job not finished within this time is taken to be lost (worker died) and retried. */
  chunkTimeoutSeconds?: number
  /** Retries of a chunk after a crash or timeout before the run fails. */
  retryLimit?: number
  /** How often pg-boss looks for expired jobs, s. */
  maintenanceIntervalSeconds?: number
  schema?: string
}

export interface RunQueue {
  boss: PgBoss
  /** Queues the chunk jobs of a run in one insert, under the given job ids. */
  enqueueChunks(jobs: { jobId: string; data: ChunkJobData }[]): Promise<void>
  cancelJobs(jobIds: string[]): Promise<void>
  stop(): Promise<void>
}

/** Connects pg-boss (tables in their own schema) and makes sure the chunk queue exists. */
export async function createRunQueue(options: RunQueueOptions): Promise<RunQueue> {
  const retryLimit = options.retryLimit ?? 2
  const expireInSeconds = options.chunkTimeoutSeconds ?? 900
  const boss = new PgBoss({
    connectionString: options.databaseUrl,
    schema: options.schema ?? 'pgboss',
    max: 4,
    maintenanceIntervalSeconds: options.maintenanceIntervalSeconds ?? 30,
    monitorStateIntervalSeconds: 60,
  })
  boss.on('error', (err) => options.logger.error('job queue error', err))
  await boss.start()
  const queue = { name: CHUNK_QUEUE, retryLimit, retryDelay: 1, expireInSeconds }
  if (await boss.getQueue(CHUNK_QUEUE)) await boss.updateQueue(CHUNK_QUEUE, queue)
  else await boss.createQueue(CHUNK_QUEUE, queue)

  return {
    boss,
    async enqueueChunks(jobs) {
      if (jobs.length === 0) return
      await boss.insert(
        jobs.map((j) => ({ id: j.jobId, name: CHUNK_QUEUE, data: j.data, retryLimit, retryDelay: 1, expireInSeconds })),
      )
    },
    async cancelJobs(jobIds) {
      if (jobIds.length > 0) await boss.cancel(CHUNK_QUEUE, jobIds)
    },
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 10_000 }),
  }
}
