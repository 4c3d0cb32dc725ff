import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createLogger } from '../../server/logger'
import { Run, RunChunk } from '../../server/models/index'
import { startChunkWorkers } from '../../server/runs/chunk-workers'
import { CHUNK_QUEUE } from '../../server/runs/run-queue'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp
let profileId: number

beforeAll(async () => {
  t = await createTestApp({ runs: { threads: 1 } })
  profileId = await createPresetProfile(await signedInAgent(t, 'analyst'))
})
afterAll(async () => {
  await t.close()
})

describe('runs API', () => {
  it('create → 202 → progress → succeeded, with results as JSON and CSV', async () => {
    const a = await signedInAgent(t, 'analyst')
    const created = await a.post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS }).expect(202)
    expect(created.body.run).toMatchObject({ status: 'queued', chunkCount: 4, chunksDone: 0 })
    expect(created.body.run.inputHash).toMatch(/^[0-9a-f]{64}$/)
    const run = await waitForRun(a, created.body.run.id)
    expect(run.status).toBe('succeeded')
    expect(run.chunksDone).toBe(4)

    const results = (await a.get(`/api/runs/${run.id}/results`).expect(200)).body
    expect(results.spectrum.wavenumberCm).toHaveLength(20)
    expect(results.levels.pressurePa).toHaveLength(11)
    expect(results.layers.heatingRateKPerDay).toHaveLength(10)
    expect(results.summary.olrWPerM2).toBeGreaterThan(0)

    const csv = await a.get(`/api/runs/${run.id}/results.csv?table=spectrum`).expect(200)
    expect(csv.headers['content-type']).toMatch(/text\/csv/)
    expect(csv.text.split('\n').filter((l: string) => l && !l.startsWith('#'))).toHaveLength(21)
    expect(csv.text).toMatch(/wavenumber_cm-1,olr_W_m-2_\(cm-1\)-1/)
  })

  it('stores results and chunk payloads compressed with lz4 when the database offers it, and reads them back', async () => {
    const [offered] = await t.sequelize.query(
      "SELECT 1 FROM pg_settings WHERE name = 'default_toast_compression' AND 'lz4' = ANY(enumvals)",
    )
    const [columns] = (await t.sequelize.query(
      `SELECT attrelid::regclass::text AS tbl, attname AS col, attcompression AS method FROM pg_attribute
        WHERE (attrelid = 'run_results'::regclass AND attname IN ('data', 'detail'))
           OR (attrelid = 'run_chunks'::regclass AND attname = 'result') ORDER BY 1, 2`,
    )) as [{ tbl: string; col: string; method: string }[], unknown]
    // attcompression: 'l' lz4, '' the server's default (pglz); see the PostgreSQL catalogue docs.
    const expected = offered.length > 0 ? 'l' : ''
    expect(columns).toEqual([
      { tbl: 'run_chunks', col: 'result', method: expected },
      { tbl: 'run_results', col: 'data', method: expected },
      { tbl: 'run_results', col: 'detail', method: expected },
    ])

    // A run large enough for its results to be compressed (over PostgreSQL's 2 kB threshold).
    const a = await signedInAgent(t, 'analyst')
    const created = await a.post('/api/runs', { profileId, settings: { ...QUICK_RUN_SETTINGS, outputResolutionCm: 0.1 } }).expect(202)
    const run = await waitForRun(a, created.body.run.id)
    expect(run.status).toBe('succeeded')
    const [stored] = (await t.sequelize.query(
      `SELECT pg_column_compression(data) AS method FROM run_results WHERE run_id = ${Number(run.id)}`,
    )) as [{ method: string | null }[], unknown]
    expect(stored[0].method).toBe(offered.length > 0 ? 'lz4' : 'pglz')
    const results = (await a.get(`/api/runs/${run.id}/results`).expect(200)).body
    expect(results.spectrum.wavenumberCm.length).toBeGreaterThan(20)
  })

  it('when the same inputs run twice, the hash and every number are the same', async () => {
    const a = await signedInAgent(t, 'analyst')
    const first = (await a.post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS }).expect(202)).body.run
    const second = (await a.post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS, name: 'again' }).expect(202)).body.run
    expect(second.inputHash).toBe(first.inputHash)
    await waitForRun(a, first.id)
    await waitForRun(a, second.id)
    const r1 = (await a.get(`/api/runs/${first.id}/results`)).body
    const r2 = (await a.get(`/api/runs/${second.id}/results`)).body
    expect(r2.spectralFluxes).toEqual(r1.spectralFluxes)
    expect(r2.levels).toEqual(r1.levels)
  })

  it('when cancelled while queued or running, stops and has no results', async () => {
    const a = await signedInAgent(t, 'analyst')
    const run = (await a.post('/api/runs', { profileId, settings: { ...QUICK_RUN_SETTINGS, chunkWidthCm: 1 } }).expect(202)).body.run
    const cancelled = await a.post(`/api/runs/${run.id}/cancel`).expect(200)
    expect(cancelled.body.run.status).toBe('cancelled')
    await new Promise((r) => setTimeout(r, 1500))
    const after = (await a.get(`/api/runs/${run.id}`)).body.run
    expect(after.status).toBe('cancelled')
    expect(after.chunksDone).toBeLessThan(20)
    await a.get(`/api/runs/${run.id}/results`).expect(409)
    await a.post(`/api/runs/${run.id}/cancel`).expect(409)
  })

  it('when a chunk cannot be computed, the run fails with the reason', async () => {
    const a = await signedInAgent(t, 'analyst')
    const system = t.runSystem!
    // Hold the workers, submit, break the frozen profile, then let the workers go.
    await system.queue.boss.offWork(CHUNK_QUEUE)
    const run = (await a.post('/api/runs', { profileId, settings: { ...QUICK_RUN_SETTINGS, startCm: 2000, endCm: 2010 } }).expect(202)).body.run
    const stored = await Run.findByPk(run.id)
    const inputs = structuredClone(stored!.inputs)
    inputs.profile.snapshot.levels[3].temperatureK = -40
    await Run.update({ inputs }, { where: { id: run.id } })
    await startChunkWorkers(system.queue, { sequelize: t.sequelize, pool: system.pool!, logger: createLogger('silent') })
    const finished = await waitForRun(a, run.id)
    expect(finished.status).toBe('failed')
    expect(finished.error).toMatch(/chunk \d+ .*cannot be computed: .*temperature/i)
    expect(await RunChunk.count({ where: { runId: run.id, status: 'failed' } })).toBeGreaterThan(0)
  })

  it('refuses wrong roles and wrong owners, and validates the request', async () => {
    const reviewer = await signedInAgent(t, 'reviewer')
    await reviewer.post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS }).expect(403)
    await request(t.app).get('/api/runs').expect(401)
    const admin = await signedInAgent(t, 'admin')
    const adminRun = (await admin.post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS }).expect(202)).body.run
    const analyst = await signedInAgent(t, 'analyst')
    await analyst.post(`/api/runs/${adminRun.id}/cancel`).expect(403)
    await analyst.delete(`/api/runs/${adminRun.id}`).expect(403)
    const bad = await analyst.post('/api/runs', { profileId, settings: { startCm: 700, endCm: 600 } }).expect(400)
    expect(bad.body.error.details.fields[0].field).toBe('settings.endCm')
    await analyst.post('/api/runs', { profileId: 999999 }).expect(400)
    await waitForRun(admin, adminRun.id)
    // Reviewers read everyone's runs.
    const list = await reviewer.get('/api/runs?status=succeeded').expect(200)
    expect(list.body.total).toBeGreaterThan(0)
  })
})
