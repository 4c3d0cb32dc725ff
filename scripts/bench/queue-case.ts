// Case G: case A the way a team runs it. The run is submitted to the database queue and standalone
// worker processes (`npm run worker`, one chunk thread each) take its chunks; timed from
// submission until the merged results are stored. Once with one worker process and once with two,
// giving the scale-out speed-up. Workers are started and warmed on a small run first (catalogue
// loaded, code compiled), as long-running workers would be.
import { spawn, type ChildProcess } from 'node:child_process'
import { availableParallelism, loadavg } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { QueryTypes, type Sequelize } from 'sequelize'
import type { RunSettingsInput } from '../../shared/schemas/runs'
import { createSequelize } from '../../server/db'
import { seedDemoTeam, seedDemoWorkspace } from '../../server/demo/seed'
import { createLogger } from '../../server/logger'
import { migrateUp } from '../../server/migrator'
import { initModels, Profile, Run, RunChunk, User } from '../../server/models/index'
import { createRunQueue } from '../../server/runs/run-queue'
import { createRun } from '../../server/runs/run.service'
import { createBenchDatabase } from './bench-database'
import type { BenchRow, CaseOptions } from './cases'
import { postgresCpuS, processCpuS } from './process-cpu'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')

function startWorker(databaseUrl: string): ChildProcess {
  // TAULINE_BENCH_CPU_PROF=<dir> writes a CPU profile of every worker process (main thread and
  // chunk threads) there, to see where the time outside the chunk computes goes.
  const profileDir = process.env.TAULINE_BENCH_CPU_PROF
  const profile = profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : []
  return spawn(process.execPath, [...profile, '--import', 'tsx', join(ROOT, 'server/worker.ts')], {
    cwd: ROOT,
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'bench-worker-secret-0123456789',
      RUN_WORKER_THREADS: '1',
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
}

async function stopWorker(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return
  const exited = new Promise((resolve) => child.once('exit', resolve))
  child.kill('SIGTERM')
  await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 15_000))])
  if (child.exitCode === null) child.kill('SIGKILL')
}

/** Polls until the run is finished; throws if it did not succeed. A plain query: the poller's CPU counts against the run. */
async function waitForRun(sequelize: Sequelize, id: number): Promise<void> {
  for (;;) {
    const run = await sequelize.query<{ status: string; error: string | null }>('SELECT status, error FROM runs WHERE id = $1', {
      bind: [id],
      type: QueryTypes.SELECT,
      plain: true,
    })
    if (run?.status === 'succeeded') return
    if (run && ['failed', 'cancelled'].includes(run.status)) {
      throw new Error(`bench run ${id} ${run.status}: ${run.error}`)
    }
    await new Promise((resolve) => setTimeout(resolve, 100))
  }
}

export async function caseG(options: CaseOptions): Promise<BenchRow[]> {
  const db = await createBenchDatabase(options.log)
  const logger = createLogger('warn')
  const sequelize = createSequelize(db.url)
  initModels(sequelize)
  const rows: BenchRow[] = []
  try {
    await migrateUp(sequelize)
    await seedDemoTeam('bench-password-2026')
    await seedDemoWorkspace()
    const analyst = await User.findOne({ where: { role: 'analyst' } })
    // The demo workspace's mid-latitude summer column: 61 levels up to 10 Pa, as case A.
    const profile = await Profile.findOne({ where: { name: 'Mid-latitude summer' } })
    if (!analyst || !profile) throw new Error('the demo workspace is missing its analyst or profile')
    const queue = await createRunQueue({ databaseUrl: db.url, logger })
    const actor = { id: analyst.id, role: analyst.role }
    const submit = (settings: RunSettingsInput) =>
      createRun(sequelize, queue, actor, {
        profileId: profile.id,
        mixtureId: null,
        catalogueId: 'builtin',
        settings: settings as never,
      })
    const range = options.quick ? { startCm: 500, endCm: 1100 } : { startCm: 10, endCm: 3000 }
    const walls: number[] = []
    try {
      for (const processes of [1, 2]) {
        const workers = Array.from({ length: processes }, () => startWorker(db.url))
        try {
          options.log(`  G: warming ${processes} worker process(es) …`)
          const warm = await submit({ startCm: 600, endCm: 700, chunkWidthCm: 5 * processes })
          await waitForRun(sequelize, warm.id)
          options.log(`  G: case A through the queue on ${processes} worker process(es) …`)
          const load = loadavg()[0]
          // Where the machine's time goes: worker processes (compute threads and their main
          // threads), PostgreSQL, and this process (submission and polling).
          const cpuNow = () => ({
            workersS: workers.reduce((sum, w) => sum + (processCpuS(w.pid!) ?? 0), 0),
            postgresS: postgresCpuS(db.clusterDir) ?? 0,
            benchS: (process.cpuUsage().user + process.cpuUsage().system) / 1e6,
          })
          const cpuBefore = cpuNow()
          const t0 = performance.now()
          const run = await submit(range)
          await waitForRun(sequelize, run.id)
          const wallS = (performance.now() - t0) / 1000
          const cpuAfter = cpuNow()
          walls.push(wallS)
          const chunks = await RunChunk.findAll({ where: { runId: run.id } })
          const computeS = chunks.reduce((s, c) => s + (c.computeMs ?? 0), 0) / 1000
          const stored = await Run.findByPk(run.id)
          const finishedToStored =
            stored?.finishedAt && chunks.length > 0
              ? (stored.finishedAt.getTime() -
                  Math.max(...chunks.map((c) => c.finishedAt?.getTime() ?? 0))) /
                1000
              : 0
          options.log(`    ${wallS.toFixed(2)} s wall (chunk compute ${computeS.toFixed(1)} s)`)
          rows.push({
            case: 'G',
            label: `case A through the queue, ${processes} worker process(es) × 1 thread, ${range.startCm}–${range.endCm} cm⁻¹`,
            measurement: {
              wallS,
              cpuS: computeS,
              peakRssMiB: 0,
              chunkCount: chunks.length,
              gridPointCount: 0,
              lineLayerPairs: 0,
              voigtEvaluations: 0,
              lineLayerPairsPerS: 0,
              gridPointsPerS: 0,
              slowestChunk: { startCm: 0, cpuS: 0 },
            },
            notes: {
              chunkComputeS: Number(computeS.toFixed(2)),
              mergeAndStoreS: Number(finishedToStored.toFixed(2)),
              workerCpuS: Number((cpuAfter.workersS - cpuBefore.workersS).toFixed(2)),
              postgresCpuS: Number((cpuAfter.postgresS - cpuBefore.postgresS).toFixed(2)),
              benchProcessCpuS: Number((cpuAfter.benchS - cpuBefore.benchS).toFixed(2)),
              coreSecondsOfWall: Number((wallS * availableParallelism()).toFixed(2)),
              loadAverageAtStart: Number(load.toFixed(2)),
              ...(processes > 1 ? { speedupOverOneProcess: Number((walls[0] / wallS).toFixed(2)) } : {}),
            },
          })
        } finally {
          await Promise.all(workers.map(stopWorker))
        }
      }
    } finally {
      await queue.stop()
    }
  } finally {
    await sequelize.close()
    await db.drop()
  }
  return rows
}
