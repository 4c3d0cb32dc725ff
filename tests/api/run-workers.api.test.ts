import { spawn, type ChildProcess } from 'node:child_process'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { RunChunk } from '../../server/models/index'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, waitForRun } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

// Standalone worker processes (`npm run worker`) against the same database as the API.
let t: TestApp
let profileId: number
const workers: ChildProcess[] = []
const SETTINGS = { startCm: 660, endCm: 700, chunkWidthCm: 5, outputResolutionCm: 1, quadrature: { kind: 'gauss-legendre', nodes: 2 } }

function startWorker(): ChildProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
    env: {
      ...process.env,
      DATABASE_URL: t.config.databaseUrl,
      SESSION_SECRET: 'worker-test-secret-0123456789',
      RUN_WORKER_THREADS: '1',
      RUN_CHUNK_TIMEOUT_S: '20',
      QUEUE_MAINTENANCE_S: '1',
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  })
  workers.push(child)
  return child
}

async function resultsOf(id: number) {
  const a = await signedInAgent(t, 'analyst')
  return (await a.get(`/api/runs/${id}/results`).expect(200)).body
}

beforeAll(async () => {
  // Queue only in the API process: all computing happens in the worker processes.
  t = await createTestApp({ runs: { threads: 0 }, env: { QUEUE_MAINTENANCE_S: '1', RUN_CHUNK_TIMEOUT_S: '20' } })
  profileId = await createPresetProfile(await signedInAgent(t, 'analyst'))
})

afterAll(async () => {
  for (const w of workers) if (w.exitCode === null) w.kill('SIGKILL')
  await t.close()
})

describe('runs on separate worker processes', () => {
  let reference: { id: number; inputHash: string }

  it('one worker process and then two give the same hash and bit-identical numbers', async () => {
    const a = await signedInAgent(t, 'analyst')
    const first = startWorker()
    reference = (await a.post('/api/runs', { profileId, settings: SETTINGS }).expect(202)).body.run
    expect((await waitForRun(a, reference.id)).status).toBe('succeeded')

    const second = startWorker()
    const split = (await a.post('/api/runs', { profileId, settings: SETTINGS }).expect(202)).body.run
    expect(split.inputHash).toBe(reference.inputHash)
    expect((await waitForRun(a, split.id)).status).toBe('succeeded')

    const workersUsed = new Set((await RunChunk.findAll({ where: { runId: split.id } })).map((c) => c.workerId?.split('#')[0]))
    expect(workersUsed.size).toBeGreaterThanOrEqual(1)
    expect([...workersUsed].every((w) => w?.endsWith(`:${first.pid}`) || w?.endsWith(`:${second.pid}`))).toBe(true)
    const [r1, r2] = [await resultsOf(reference.id), await resultsOf(split.id)]
    expect(r2.spectralFluxes).toEqual(r1.spectralFluxes)
    expect(r2.levels).toEqual(r1.levels)
    expect(r2.layers).toEqual(r1.layers)
  }, 120_000)

  it('when a worker process is killed mid-chunk, its chunk is retried elsewhere and the run completes with the same numbers', async () => {
    const a = await signedInAgent(t, 'analyst')
    // Stop the earlier workers, so the victim is the only one computing when it dies.
    for (const w of workers.filter((w) => w.exitCode === null)) {
      w.kill('SIGTERM')
      await new Promise((r) => w.once('exit', r))
    }
    const victim = startWorker()
    const run = (await a.post('/api/runs', { profileId, settings: SETTINGS }).expect(202)).body.run
    let killedChunk: number | undefined
    const until = Date.now() + 60_000
    while (killedChunk === undefined && Date.now() < until) {
      const held = await RunChunk.findOne({ where: { runId: run.id, status: 'running' } })
      if (held?.workerId?.includes(`:${victim.pid}#`)) {
        victim.kill('SIGKILL')
        killedChunk = held.chunkIndex
      }
      await new Promise((r) => setTimeout(r, 20))
    }
    expect(killedChunk).toBeDefined()
    const survivor = startWorker()
    const finished = await waitForRun(a, run.id, 120_000)
    expect(finished.status).toBe('succeeded')
    expect(finished.chunksDone).toBe(finished.chunkCount)
    if (killedChunk !== undefined) {
      const retried = await RunChunk.findOne({ where: { runId: run.id, chunkIndex: killedChunk } })
      expect(retried!.attempts).toBeGreaterThanOrEqual(2)
      expect(retried!.workerId).toContain(`:${survivor.pid}#`)
    }
    const [r1, r3] = [await resultsOf(reference.id), await resultsOf(run.id)]
    expect(r3.spectralFluxes).toEqual(r1.spectralFluxes)
    expect(r3.levels).toEqual(r1.levels)
  }, 180_000)
})
