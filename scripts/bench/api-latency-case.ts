// Case F: API latency under load. A throwaway database (a fresh database on DATABASE_URL's
// cluster when set, else a temporary cluster from scripts/pg-temp.sh) is migrated and filled with
// the demo team and workspace plus ~200 runs whose stored results have realistic sizes (a
// 10–3000 cm⁻¹ run holds ~7 MB of spectral fluxes). The real app (run system off) serves it from a
// child process on an ephemeral loopback port, so the load generator never shares its event loop.
// 50 clients, each signed in with its own session, hit one endpoint at a time with autocannon;
// latency percentiles come from every response's own time, since autocannon reports no p95.
import { fork, type ChildProcess } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { Agent, get as httpGet, type Server, type ServerResponse } from 'node:http'
import type { AddressInfo } from 'node:net'
import { loadavg } from 'node:os'
import { fileURLToPath } from 'node:url'
import autocannon from 'autocannon'
import type { Sequelize } from 'sequelize'
import type { RadiationResult } from '../../shared/physics/engine/merge'
import { planChunks, prepareComputation } from '../../shared/physics/engine/prepare'
import { resolveComputeSettings } from '../../shared/physics/engine/settings'
import { toLineTable } from '../../shared/physics/spectroscopy/line'
import type { RunInputs, RunStatus } from '../../shared/schemas/runs'
import { ENGINE_VERSION } from '../../shared/version'
import { runCatalogueOf } from '../../server/catalogue/run-catalogue'
import { createPgPool, createSequelize } from '../../server/db'
import { DEMO_TEAM } from '../../server/demo/demo-team'
import { seedDemoTeam, seedDemoWorkspace } from '../../server/demo/seed'
import { migrateUp } from '../../server/migrator'
import { GasMixture, initModels, Profile, Run, RunResult, User } from '../../server/models/index'
import { serialiseResult } from '../../server/runs/finalize-run'
import { runInputHash } from '../../server/runs/run-inputs'
import { createBenchDatabase } from './bench-database'
import type { BenchRow, CaseOptions } from './cases'
import { postgresCpuS } from './process-cpu'

const SERVE_FLAG = '--serve-api-for-bench'
const BENCH_PASSWORD = 'bench-password-2026'
const CONNECTIONS = 50
const RUN_COUNT = 200
const P95_TARGET_MS = 50
// Mean think time of a paced client between two requests.
const THINK_MS = 1000

// ---- the server side (child process) ----

type ParentMessage = { type: 'usage'; whenIdle: boolean } | { type: 'stop' }
type ChildMessage =
  { type: 'listening'; port: number } | { type: 'usage'; cpuUs: number; rssMiB: number }

/** Runs in the child: the real app on 127.0.0.1:0, answering usage requests until told to stop. */
async function serveForBench(databaseUrl: string): Promise<void> {
  const { createApp } = await import('../../server/app')
  const { loadConfig } = await import('../../server/config')
  const { createLogger } = await import('../../server/logger')
  const config = loadConfig({
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: randomBytes(24).toString('hex'),
    COOKIE_SECURE: 'false',
    LOG_LEVEL: 'warn',
  })
  const sequelize = createSequelize(config.databaseUrl)
  initModels(sequelize)
  const sessionPool = createPgPool(config.databaseUrl)
  const logger = createLogger(config.logLevel)
  const app = createApp({ config, sequelize, sessionPool, logger })
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s))
  })
  // Clients hang up with requests still queued; those must be answered before the pools close.
  // An abandoned answer never emits 'finish', but writableEnded turns true once it is written.
  const open = new Set<ServerResponse>()
  server.on('request', (_req, res: ServerResponse) => {
    open.add(res)
    res.once('finish', () => open.delete(res))
  })
  const answering = () => [...open].some((res) => !res.writableEnded)
  const settle = async () => {
    for (let waitedMs = 0; answering() && waitedMs < 10_000; waitedMs += 50) {
      await new Promise((resolve) => setTimeout(resolve, 50))
    }
  }
  const send = (m: ChildMessage) => process.send!(m)
  const stop = async () => {
    server.close()
    server.closeIdleConnections()
    await settle()
    server.closeAllConnections()
    await Promise.all([sequelize.close(), sessionPool.end()])
    process.exit(0)
  }
  process.on('message', async (m: ParentMessage) => {
    if (m.type === 'usage') {
      if (m.whenIdle) await settle()
      const cpu = process.cpuUsage()
      send({
        type: 'usage',
        cpuUs: cpu.user + cpu.system,
        rssMiB: process.memoryUsage().rss / 2 ** 20,
      })
    } else if (m.type === 'stop') void stop()
  })
  // An orphaned server must not outlive the benchmark.
  process.on('disconnect', () => void stop())
  send({ type: 'listening', port: (server.address() as AddressInfo).port })
}

if (process.argv[1] === fileURLToPath(import.meta.url) && process.argv[2] === SERVE_FLAG) {
  await serveForBench(process.argv[3])
}

interface ServerHandle {
  baseUrl: string
  /** The server's CPU time and memory; with whenIdle, once the last answer has been written. */
  usage(whenIdle?: boolean): Promise<{ cpuUs: number; rssMiB: number }>
  stop(): Promise<void>
}

function startServer(databaseUrl: string): Promise<ServerHandle> {
  const child: ChildProcess = fork(fileURLToPath(import.meta.url), [SERVE_FLAG, databaseUrl], {
    // TAULINE_BENCH_CPU_PROF=<folder> writes a V8 CPU profile of the server, to find hot spots.
    execArgv: [
      '--import',
      'tsx',
      ...(process.env.TAULINE_BENCH_CPU_PROF
        ? ['--cpu-prof', `--cpu-prof-dir=${process.env.TAULINE_BENCH_CPU_PROF}`]
        : []),
    ],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  })
  const next = <T extends ChildMessage['type']>(type: T) =>
    new Promise<Extract<ChildMessage, { type: T }>>((resolve, reject) => {
      const onMessage = (m: ChildMessage) => {
        if (m.type !== type) return
        child.off('message', onMessage)
        child.off('exit', onExit)
        resolve(m as Extract<ChildMessage, { type: T }>)
      }
      const onExit = (code: number | null) => {
        child.off('message', onMessage)
        reject(new Error(`the API server exited (code ${code})`))
      }
      child.on('message', onMessage)
      child.once('exit', onExit)
    })
  return next('listening').then(({ port }) => ({
    baseUrl: `http://127.0.0.1:${port}`,
    usage: async (whenIdle = false) => {
      const reply = next('usage')
      child.send({ type: 'usage', whenIdle } satisfies ParentMessage)
      return reply
    },
    stop: async () => {
      if (child.exitCode !== null || child.signalCode !== null) return
      const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()))
      child.send({ type: 'stop' } satisfies ParentMessage)
      const timer = setTimeout(() => child.kill('SIGKILL'), 10_000)
      await exited
      clearTimeout(timer)
    },
  }))
}

/** Deterministic pseudo-random numbers, so every bench stores the same rows. */
function seededRandom(seed: number): () => number {
  let s = seed >>> 0
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0
    return s / 2 ** 32
  }
}

/** Result arrays of full precision and the real shape for a profile and range (values invented). */
function syntheticResult(
  inputs: RunInputs,
  random: () => number,
): ReturnType<typeof serialiseResult> {
  const prepared = prepareComputation(inputs.profile.snapshot, toLineTable([]), inputs.settings)
  const nLevels = prepared.levelPressurePa.length
  const nBins = prepared.binCount
  const noisy = (n: number, scale: number) =>
    Float64Array.from({ length: n }, () => scale * (0.5 + random()))
  const up = noisy(nLevels, 300)
  const down = noisy(nLevels, 200)
  const result: RadiationResult = {
    engineVersion: ENGINE_VERSION,
    settings: inputs.settings,
    levelPressurePa: prepared.levelPressurePa,
    levelHeightM: prepared.levelHeightM,
    levelTemperatureK: prepared.levelTemperatureK,
    fluxUpWPerM2: up,
    fluxDownWPerM2: down,
    fluxNetUpWPerM2: up.map((u, i) => u - down[i]),
    heatingRateKPerDay: noisy(nLevels - 1, 2),
    olrWPerM2: up[nLevels - 1],
    surfaceDownWPerM2: down[0],
    tropopause: prepared.tropopause,
    wavenumberCm: Float64Array.from(
      { length: nBins },
      (_, b) => inputs.settings.startCm + (b + 0.5) * inputs.settings.outputResolutionCm,
    ),
    olrSpectral: noisy(nBins, 0.3),
    surfaceDownSpectral: noisy(nBins, 0.3),
    toaNadirRadiance: noisy(nBins, 0.1),
    toaBrightnessTemperatureK: noisy(nBins, 250),
    surfaceZenithRadiance: noisy(nBins, 0.1),
    columnTransmittance: noisy(nBins, 0.5),
    emissionPressurePa: noisy(nBins, 40_000),
    emissionHeightM: noisy(nBins, 8000),
    fluxUpBinned: noisy(nBins * nLevels, 0.3),
    fluxDownBinned: noisy(nBins * nLevels, 0.3),
    lteRatio: noisy(nLevels, 1e3),
    lteRisk: new Uint8Array(nLevels),
    gridPointCount: nBins * 170,
    detail: null,
  }
  return serialiseResult(result)
}

// Spectral ranges of the stored runs: full range, the CO₂ band, the window, far infrared.
const RANGES = [
  { startCm: 10, endCm: 3000 },
  { startCm: 500, endCm: 850 },
  { startCm: 800, endCm: 1250 },
  { startCm: 10, endCm: 500 },
]

/**
 * Stores RUN_COUNT runs, newest first in id order like real use: most succeeded with a result,
 * some failed or cancelled, two still running. One result per (profile, range) is serialised and
 * stored through the model; other runs of that pair copy its data inside PostgreSQL, which stores
 * the same bytes without sending megabytes again.
 */
async function seedRuns(
  sequelize: Sequelize,
  log: (line: string) => void,
): Promise<{ runId: number; profileId: number }> {
  const analyst = await User.findOne({
    where: { email: DEMO_TEAM.find((m) => m.role === 'analyst')!.email },
  })
  const admin = await User.findOne({
    where: { email: DEMO_TEAM.find((m) => m.role === 'admin')!.email },
  })
  const profiles = await Profile.findAll({ order: [['id', 'ASC']] })
  const mixtures = await GasMixture.findAll({ order: [['id', 'ASC']] })
  if (!analyst || !admin || profiles.length === 0)
    throw new Error('the demo workspace was not seeded')
  const catalogue = await runCatalogueOf('builtin')
  const random = seededRandom(20261202)
  const now = Date.now()
  const plans = Array.from({ length: RUN_COUNT }, (_, i) => {
    const profile = profiles[i % profiles.length]
    const mixture = i % 3 === 0 ? null : mixtures[i % mixtures.length]
    const range = RANGES[i % RANGES.length]
    const settings = resolveComputeSettings({ ...range, chunkWidthCm: 20 })
    const inputs: RunInputs = {
      profile: {
        id: profile.id,
        name: profile.name,
        snapshot: {
          name: profile.name,
          surfaceTemperatureK: profile.surfaceTemperatureK,
          surfaceEmissivity: profile.surfaceEmissivity,
          levels: profile.levels,
        },
      },
      mixture: mixture ? { id: mixture.id, name: mixture.name, gases: mixture.gases } : null,
      catalogue,
      settings,
      engineVersion: ENGINE_VERSION,
    }
    const status: RunStatus =
      i >= RUN_COUNT - 2
        ? 'running'
        : i % 20 === 7
          ? 'failed'
          : i % 25 === 11
            ? 'cancelled'
            : 'succeeded'
    const chunkCount = planChunks(settings).length
    const queuedAt = new Date(now - (RUN_COUNT - i) * 3.5 * 3600_000)
    const startedAt = new Date(queuedAt.getTime() + 2000)
    const computeMs = chunkCount * 400 * (0.8 + 0.4 * random())
    return {
      key: `${profile.id}|${range.startCm}`,
      inputs,
      status,
      row: {
        name: `${profile.name}${mixture ? ` · ${mixture.name}` : ''} · ${range.startCm}–${range.endCm} cm⁻¹`.slice(
          0,
          160,
        ),
        status,
        inputs,
        inputHash: runInputHash(inputs),
        engineVersion: ENGINE_VERSION,
        chunkCount,
        chunksDone:
          status === 'running'
            ? Math.floor(chunkCount / 3)
            : status === 'succeeded'
              ? chunkCount
              : Math.floor(chunkCount / 2),
        error:
          status === 'failed'
            ? 'A chunk failed three times: the worker stopped answering.'
            : status === 'cancelled'
              ? 'Cancelled by its owner'
              : null,
        queuedAt,
        startedAt,
        finishedAt: status === 'running' ? null : new Date(startedAt.getTime() + computeMs / 2),
        computeMs: status === 'succeeded' ? computeMs : 0,
        ownerId: i % 5 === 4 ? admin.id : analyst.id,
      },
    }
  })
  const runs = await Run.bulkCreate(plans.map((p) => p.row))
  const firstOfKey = new Map<string, { runId: number; summary: Record<string, unknown> }>()
  let bytes = 0
  for (const [i, plan] of plans.entries()) {
    if (plan.status !== 'succeeded') continue
    const runId = runs[i].id
    const source = firstOfKey.get(plan.key)
    if (source === undefined) {
      const serialised = syntheticResult(plan.inputs, random)
      const { summary } = serialised
      bytes += JSON.stringify(serialised.data).length
      await RunResult.create({ runId, ...serialised })
      firstOfKey.set(plan.key, { runId, summary })
    } else {
      const summary = {
        ...source.summary,
        olrWPerM2: (source.summary.olrWPerM2 as number) * (0.98 + 0.04 * random()),
      }
      await sequelize.query(
        'INSERT INTO run_results (run_id, summary, data, created_at) SELECT $1, $2::jsonb, data, now() FROM run_results WHERE run_id = $3',
        { bind: [runId, JSON.stringify(summary), source.runId] },
      )
    }
  }
  const [[size]] = (await sequelize.query(
    "SELECT pg_total_relation_size('run_results') AS bytes",
  )) as [{ bytes: string }[], unknown]
  log(
    `    ${runs.length} runs, ${firstOfKey.size} distinct results serialised (${(bytes / 2 ** 20).toFixed(0)} MiB of JSON), run_results ${(Number(size.bytes) / 2 ** 20).toFixed(0)} MiB on disk`,
  )
  // The detail endpoint reads the newest full-range run with a result.
  const fullRange = (p: (typeof plans)[number]) =>
    p.status === 'succeeded' && p.inputs.settings.startCm === 10 && p.inputs.settings.endCm === 3000
  const detail = plans.length - 1 - [...plans].reverse().findIndex(fullRange)
  const sounding = profiles.find((p) => p.source === 'sounding') ?? profiles[0]
  return { runId: runs[detail].id, profileId: sounding.id }
}

/** Migrates an empty database and stores the demo team and workspace and the runs. */
export async function fillBenchDatabase(
  sequelize: Sequelize,
  log: (line: string) => void,
): Promise<{ runId: number; profileId: number }> {
  initModels(sequelize)
  await migrateUp(sequelize)
  await seedDemoTeam(BENCH_PASSWORD)
  await seedDemoWorkspace()
  const ids = await seedRuns(sequelize, log)
  await sequelize.query('VACUUM ANALYZE')
  return ids
}

// ---- the clients ----

function sessionCookie(res: Response): string {
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('tauline.sid='))
  if (!cookie) throw new Error('no session cookie in the answer')
  return cookie.split(';')[0]
}

/** Signs the demo analyst in once per client, the way the browser does (CSRF token, then POST). */
async function signIn(baseUrl: string): Promise<string> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`)
  const anonymous = sessionCookie(csrf)
  const { csrfToken } = (await csrf.json()) as { csrfToken: string }
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: anonymous },
    body: JSON.stringify({
      email: DEMO_TEAM.find((m) => m.role === 'analyst')!.email,
      password: BENCH_PASSWORD,
    }),
  })
  if (res.status !== 200) throw new Error(`sign-in answered ${res.status}: ${await res.text()}`)
  return sessionCookie(res)
}

/** What one load pattern against one endpoint gave: every response time and the counts. */
interface LoadResult {
  latenciesMs: Float64Array
  durationS: number
  responses: number
  non2xx: number
  errors: number
  bytes2xx: number
}

/**
 * Back to back: autocannon with one connection per client, each sending its next request as soon
 * as the answer arrives (the server is saturated; latency is then about clients ÷ throughput).
 */
function backToBack(url: string, cookies: string[], durationS: number): Promise<LoadResult> {
  const latencies: number[] = []
  let nextClient = 0
  return new Promise((resolve, reject) => {
    const instance = autocannon(
      {
        url,
        connections: cookies.length,
        duration: durationS,
        timeout: 10,
        setupClient: (client) =>
          client.setHeaders({ cookie: cookies[nextClient++ % cookies.length] }),
      },
      (err, result) => {
        if (err) return reject(err)
        resolve({
          latenciesMs: Float64Array.from(latencies).sort(),
          durationS: result.duration,
          responses: latencies.length,
          non2xx: result.non2xx,
          errors: result.errors,
          bytes2xx: result.throughput.total,
        })
      },
    )
    instance.on('response', (_client, _status, _bytes, ms) => {
      latencies.push(ms)
    })
  })
}

/**
 * Paced: each client waits a random think time (exponential, mean thinkMs) before every request,
 * like people working in the app, so requests arrive at random rather than in lockstep.
 */
async function paced(
  url: string,
  cookies: string[],
  durationS: number,
  thinkMs: number,
): Promise<LoadResult> {
  const agent = new Agent({ keepAlive: true, maxSockets: cookies.length })
  const random = seededRandom(4242)
  const latencies: number[] = []
  const totals = { non2xx: 0, errors: 0, bytes2xx: 0 }
  const endAt = performance.now() + durationS * 1000
  const get = (cookie: string) =>
    new Promise<void>((resolve) => {
      const t0 = performance.now()
      const req = httpGet(url, { agent, headers: { cookie }, timeout: 10_000 }, (res) => {
        let bytes = 0
        res.on('data', (chunk: Buffer) => (bytes += chunk.length))
        res.on('end', () => {
          latencies.push(performance.now() - t0)
          if (res.statusCode !== undefined && res.statusCode >= 200 && res.statusCode < 300) {
            totals.bytes2xx += bytes
          } else totals.non2xx++
          resolve()
        })
      })
      req.on('timeout', () => req.destroy(new Error('timeout')))
      req.on('error', () => {
        totals.errors++
        resolve()
      })
    })
  const client = async (cookie: string) => {
    for (;;) {
      const waitMs = Math.min(-Math.log(1 - random()) * thinkMs, endAt - performance.now())
      if (waitMs > 0) await new Promise((r) => setTimeout(r, waitMs))
      if (performance.now() >= endAt) return
      await get(cookie)
    }
  }
  await Promise.all(cookies.map(client))
  agent.destroy()
  return {
    latenciesMs: Float64Array.from(latencies).sort(),
    durationS,
    responses: latencies.length,
    ...totals,
  }
}

function percentile(sorted: Float64Array, p: number): number {
  if (sorted.length === 0) return Number.NaN
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]
}

const round = (v: number, digits = 1) => Number(v.toFixed(digits))

export async function caseF(options: CaseOptions): Promise<BenchRow[]> {
  const log = options.log
  const durationS = options.quick ? 3 : 10
  const warmUpS = options.quick ? 1 : 2
  const t0 = performance.now()
  const db = await createBenchDatabase(log)
  let sequelize: Sequelize | undefined
  let server: ServerHandle | undefined
  try {
    sequelize = createSequelize(db.url)
    const ids = await fillBenchDatabase(sequelize, log)
    log(`    database ready in ${((performance.now() - t0) / 1000).toFixed(1)} s`)

    server = await startServer(db.url)
    const cookies: string[] = []
    for (let i = 0; i < CONNECTIONS; i++) cookies.push(await signIn(server.baseUrl))
    const endpoints = [
      { label: 'GET /api/runs?page=1&pageSize=25', path: '/api/runs?page=1&pageSize=25' },
      { label: 'GET /api/runs/:id (10–3000 cm⁻¹ result)', path: `/api/runs/${ids.runId}` },
      { label: 'GET /api/profiles', path: '/api/profiles' },
      { label: 'GET /api/profiles/:id (sounding)', path: `/api/profiles/${ids.profileId}` },
      { label: 'GET /api/mixtures', path: '/api/mixtures' },
      { label: 'GET /api/catalogues', path: '/api/catalogues' },
    ]
    const modes = [
      {
        name: 'back to back',
        run: (url: string) => backToBack(url, cookies, durationS),
      },
      {
        name: `paced ${1000 / THINK_MS} req/s each`,
        run: (url: string) => paced(url, cookies, durationS, THINK_MS),
      },
    ]
    // Warm the JIT, the pools and PostgreSQL's caches on every endpoint before timing.
    for (const e of endpoints) await backToBack(server.baseUrl + e.path, cookies, warmUpS)

    const rows: BenchRow[] = []
    for (const e of endpoints) {
      for (const mode of modes) {
        log(`  F: ${e.label}, ${CONNECTIONS} clients ${mode.name}, ${durationS} s …`)
        const before = await server.usage(true)
        const dbBefore = postgresCpuS(db.clusterDir)
        const loadBefore = loadavg()[0]
        const r = await mode.run(server.baseUrl + e.path)
        const after = await server.usage()
        const dbAfter = postgresCpuS(db.clusterDir)
        const n = Math.max(1, r.responses)
        const notes: Record<string, number | string> = {
          p50Ms: round(percentile(r.latenciesMs, 50)),
          p95Ms: round(percentile(r.latenciesMs, 95)),
          p99Ms: round(percentile(r.latenciesMs, 99)),
          reqPerS: round(r.responses / r.durationS, 0),
          serverCpuMsPerReq: round((after.cpuUs - before.cpuUs) / 1000 / n, 2),
          ...(dbBefore !== undefined && dbAfter !== undefined
            ? { dbCpuMsPerReq: round(((dbAfter - dbBefore) * 1000) / n, 2) }
            : {}),
          kiBPerResponse: round(r.bytes2xx / Math.max(1, r.responses - r.non2xx) / 1024),
          non2xx: r.non2xx,
          errors: r.errors,
          target: percentile(r.latenciesMs, 95) < P95_TARGET_MS ? 'met' : 'missed',
          loadAvg1m: `${round(loadBefore, 2)}→${round(loadavg()[0], 2)}`,
        }
        log(
          `    ${Object.entries(notes)
            .map(([k, v]) => `${k}=${v}`)
            .join(' ')}`,
        )
        rows.push({
          case: 'F',
          label: `${e.label}, ${mode.name}`,
          measurement: {
            wallS: r.durationS,
            // The server process's CPU over the run (not the load generator's or the database's).
            cpuS: (after.cpuUs - before.cpuUs) / 1e6,
            peakRssMiB: after.rssMiB,
            chunkCount: 0,
            gridPointCount: 0,
            lineLayerPairs: 0,
            voigtEvaluations: 0,
            lineLayerPairsPerS: 0,
            gridPointsPerS: 0,
            slowestChunk: { startCm: 0, cpuS: 0 },
          },
          notes,
        })
      }
    }
    return rows
  } finally {
    await server?.stop()
    await sequelize?.close()
    await db.drop()
  }
}
