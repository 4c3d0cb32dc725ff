import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { Run, Sweep } from '../../server/models/index'
import { createLogger } from '../../server/logger'
import { startChunkWorkers } from '../../server/runs/chunk-workers'
import { CHUNK_QUEUE } from '../../server/runs/run-queue'
import type { SweepDetail } from '../../shared/schemas/sweeps'
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

type Agent = Awaited<ReturnType<typeof signedInAgent>>

async function waitForSweep(a: Agent, id: number, timeoutMs = 120_000): Promise<SweepDetail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const sweep = (await a.get(`/api/sweeps/${id}`).expect(200)).body.sweep as SweepDetail
    if (['succeeded', 'failed', 'cancelled'].includes(sweep.status)) return sweep
    if (Date.now() > until) expect.fail(`sweep ${id} still ${sweep.status} after ${timeoutMs} ms`)
    await new Promise((r) => setTimeout(r, 300))
  }
}

describe('sweeps API', () => {
  it('create → 202 → every member computed together → forcing against the reference and a logarithmic fit', async () => {
    const a = await signedInAgent(t, 'analyst')
    const created = await a
      .post('/api/sweeps', {
        profileId,
        settings: QUICK_RUN_SETTINGS,
        gas: 'CO2',
        amounts: [280, 560, 1120],
        referenceAmount: 280,
      })
      .expect(202)
    const sweep = created.body.sweep as SweepDetail
    expect(sweep).toMatchObject({
      gas: 'CO2',
      unit: 'ppmv',
      referenceAmount: 280,
      status: 'queued',
    })
    expect(sweep.members.map((m) => m.amount)).toEqual([280, 560, 1120])
    // One job per chunk computes every member: 4 chunks, not 12.
    const jobs = await t.sequelize.query(
      `SELECT count(*)::int AS n FROM pgboss.job WHERE name = '${CHUNK_QUEUE}' AND data->>'sweepId' = '${sweep.id}'`,
      { plain: true },
    )
    expect((jobs as { n: number }).n).toBe(4)

    const done = await waitForSweep(a, sweep.id)
    expect(done.status).toBe('succeeded')
    expect(done.members.every((m) => m.status === 'succeeded' && m.chunksDone === 4)).toBe(true)
    expect(done.members[0].forcingWPerM2).toEqual({ top: 0, tropopause: 0, surface: 0 })
    // More CO₂ traps more: forcing at the tropopause grows with the amount.
    const tropopause = done.members.map((m) => m.forcingWPerM2!.tropopause)
    expect(tropopause[1]).toBeGreaterThan(0)
    expect(tropopause[2]).toBeGreaterThan(tropopause[1])
    expect(done.logarithmicFit!.tropopause.points).toBe(3)

    // Each member is an ordinary run: its own inputs (the gas at its amount), results and CSV.
    const member = (await a.get(`/api/runs/${done.members[1].runId}`).expect(200)).body.run
    expect(member.sweepId).toBe(sweep.id)
    expect(member.inputs.sweep).toEqual({
      gas: 'CO2',
      unit: 'ppmv',
      amounts: [280, 560, 1120],
      amount: 560,
    })
    expect(member.inputs.profile.snapshot.levels[0].vmr.CO2).toBeCloseTo(
      560e-6 * (1 - member.inputs.profile.snapshot.levels[0].vmr.H2O),
      12,
    )
    await a.get(`/api/runs/${done.members[1].runId}/results.csv?table=levels`).expect(200)

    const csv = await a.get(`/api/sweeps/${sweep.id}/forcing.csv`).expect(200)
    expect(csv.headers['content-type']).toMatch(/text\/csv/)
    expect(csv.text.split('\n')[0]).toBe(
      'CO2_ppmv,run_id,status,olr_W_m-2,forcing_top_W_m-2,forcing_tropopause_W_m-2,forcing_surface_W_m-2',
    )
    expect(csv.text.trim().split('\n')).toHaveLength(4)
  })

  it('gives a member the numbers of the same run computed alone, within the adaptive tolerances (2e-3 W m⁻²)', async () => {
    const a = await signedInAgent(t, 'analyst')
    const sweep = (
      await a
        .post('/api/sweeps', {
          profileId,
          settings: QUICK_RUN_SETTINGS,
          gas: 'CO2',
          amounts: [400, 1600],
        })
        .expect(202)
    ).body.sweep as SweepDetail
    const mixture = (
      await a
        .post('/api/mixtures', {
          name: 'CO₂ at 1600 ppmv',
          gases: { CO2: { mode: 'uniform', vmr: 1600e-6 } },
        })
        .expect(201)
    ).body.mixture
    const alone = (
      await a
        .post('/api/runs', { profileId, mixtureId: mixture.id, settings: QUICK_RUN_SETTINGS })
        .expect(202)
    ).body.run
    const done = await waitForSweep(a, sweep.id)
    await waitForRun(a, alone.id)
    const member = (await a.get(`/api/runs/${done.members[1].runId}/results`).expect(200)).body
    const own = (await a.get(`/api/runs/${alone.id}/results`).expect(200)).body
    const memberRun = (await a.get(`/api/runs/${done.members[1].runId}`)).body.run
    // Same physics, but a member's hash also names its sweep (its grid is shared).
    expect(memberRun.inputHash).not.toBe(alone.inputHash)
    member.levels.fluxUpWPerM2.forEach((f: number, l: number) => {
      expect(Math.abs(f - own.levels.fluxUpWPerM2[l])).toBeLessThan(2e-3)
      expect(Math.abs(member.levels.fluxDownWPerM2[l] - own.levels.fluxDownWPerM2[l])).toBeLessThan(
        2e-3,
      )
    })
  })

  it('when one member is cancelled, the others still finish', async () => {
    const a = await signedInAgent(t, 'analyst')
    const system = t.runSystem!
    await system.queue.boss.offWork(CHUNK_QUEUE)
    // Methane's ν₄ band, so that its amount matters.
    const settings = { ...QUICK_RUN_SETTINGS, startCm: 1300, endCm: 1320 }
    const sweep = (
      await a
        .post('/api/sweeps', { profileId, settings, gas: 'CH4', amounts: [900, 1800, 3600] })
        .expect(202)
    ).body.sweep as SweepDetail
    expect(sweep.unit).toBe('ppbv')
    await a.post(`/api/runs/${sweep.members[1].runId}/cancel`).expect(200)
    await startChunkWorkers(system.queue, {
      sequelize: t.sequelize,
      pool: system.pool!,
      logger: createLogger('silent'),
    })
    const done = await waitForSweep(a, sweep.id)
    expect(done.members.map((m) => m.status)).toEqual(['succeeded', 'cancelled', 'succeeded'])
    expect(done.status).toBe('cancelled')
    expect(done.members[2].forcingWPerM2!.tropopause).toBeGreaterThan(0)
  })

  it('when a chunk cannot be computed, every member fails with the reason', async () => {
    const a = await signedInAgent(t, 'analyst')
    const system = t.runSystem!
    await system.queue.boss.offWork(CHUNK_QUEUE)
    const settings = { ...QUICK_RUN_SETTINGS, startCm: 2000, endCm: 2010 }
    const sweep = (
      await a
        .post('/api/sweeps', { profileId, settings, gas: 'CO2', amounts: [280, 560] })
        .expect(202)
    ).body.sweep as SweepDetail
    // Break the first member's frozen profile: the members' profiles are rebuilt from it.
    const stored = await Run.findByPk(sweep.members[0].runId)
    const inputs = structuredClone(stored!.inputs)
    inputs.profile.snapshot.levels[3].temperatureK = -40
    await Run.update({ inputs }, { where: { id: stored!.id } })
    await startChunkWorkers(system.queue, {
      sequelize: t.sequelize,
      pool: system.pool!,
      logger: createLogger('silent'),
    })
    const done = await waitForSweep(a, sweep.id)
    expect(done.status).toBe('failed')
    for (const member of done.members) {
      const run = (await a.get(`/api/runs/${member.runId}`)).body.run
      expect(run.error).toMatch(/chunk \d+ .* of sweep \d+ cannot be computed: .*temperature/i)
    }
  })

  it('validates the request, naming the field, and stores nothing', async () => {
    const a = await signedInAgent(t, 'analyst')
    const before = { sweeps: await Sweep.count(), runs: await Run.count() }
    const one = await a.post('/api/sweeps', { profileId, gas: 'CO2', amounts: [280] }).expect(400)
    expect(one.body.error.details.fields[0]).toMatchObject({
      field: 'amounts',
      message: 'A sweep needs at least two amounts.',
    })
    const twice = await a
      .post('/api/sweeps', { profileId, gas: 'CO2', amounts: [280, 280] })
      .expect(400)
    expect(twice.body.error.details.fields[0].field).toBe('amounts')
    const gas = await a.post('/api/sweeps', { profileId, gas: 'H2O', amounts: [1, 2] }).expect(400)
    expect(gas.body.error.details.fields[0].field).toBe('gas')
    const reference = await a
      .post('/api/sweeps', { profileId, gas: 'CO2', amounts: [280, 560], referenceAmount: 400 })
      .expect(400)
    expect(reference.body.error.details.fields[0].field).toBe('referenceAmount')
    const settings = await a
      .post('/api/sweeps', {
        profileId,
        gas: 'CO2',
        amounts: [280, 560],
        settings: { startCm: 700, endCm: 600 },
      })
      .expect(400)
    expect(settings.body.error.details.fields[0].field).toBe('settings.endCm')
    await a.post('/api/sweeps', { profileId: 999999, gas: 'CO2', amounts: [280, 560] }).expect(400)
    expect({ sweeps: await Sweep.count(), runs: await Run.count() }).toEqual(before)

    const reviewer = await signedInAgent(t, 'reviewer')
    await reviewer.post('/api/sweeps', { profileId, gas: 'CO2', amounts: [280, 560] }).expect(403)
    await request(t.app).get('/api/sweeps/1').expect(401)
    await a.get('/api/sweeps/999999').expect(404)
  })

  it('lists sweeps newest first with their status and progress, searchable, for every role', async () => {
    const reviewer = await signedInAgent(t, 'reviewer')
    const page = (await reviewer.get('/api/sweeps?page=1&pageSize=2').expect(200)).body
    // The four sweeps made above: succeeded, compared with runs alone, one member stopped, failed.
    expect(page).toMatchObject({ total: 4, page: 1, pageSize: 2 })
    expect(page.items).toHaveLength(2)
    const all = (await reviewer.get('/api/sweeps?pageSize=100').expect(200)).body.items
    expect(all.map((s: { id: number }) => s.id)).toEqual([...all.map((s: { id: number }) => s.id)].sort((x, y) => y - x))
    const first = all[all.length - 1]
    expect(first).toMatchObject({
      gas: 'CO2',
      unit: 'ppmv',
      amounts: [280, 560, 1120],
      referenceAmount: 280,
      status: 'succeeded',
      membersEnded: 3,
      memberCount: 3,
      ownerName: 'Ines Varga',
    })
    expect(all.map((s: { status: string }) => s.status)).toContain('failed')
    const found = (await reviewer.get(`/api/sweeps?search=${encodeURIComponent(first.name.slice(0, 12))}`).expect(200)).body
    expect(found.items.map((s: { id: number }) => s.id)).toContain(first.id)
    expect((await reviewer.get('/api/sweeps?search=no-such-sweep-name').expect(200)).body.total).toBe(0)
    const bad = await reviewer.get('/api/sweeps?pageSize=0').expect(400)
    expect(bad.body.error.details.fields[0].field).toBe('pageSize')
    await request(t.app).get('/api/sweeps').expect(401)
  })
})
