import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp
let reference: number
let doubled: number
let narrower: number

// Two runs that differ only in CO₂ (400 → 800 ppmv), and one on fewer bins.
beforeAll(async () => {
  t = await createTestApp({ runs: { threads: 1 } })
  const a = await signedInAgent(t, 'analyst')
  const profileId = await createPresetProfile(a)
  const mixture = async (ppmv: number) =>
    (await a.post('/api/mixtures', { name: `CO₂ ${ppmv}`, gases: { CO2: { mode: 'uniform', vmr: ppmv * 1e-6 } } }).expect(201)).body.mixture.id
  const submit = async (mixtureId: number, settings = QUICK_RUN_SETTINGS) =>
    (await a.post('/api/runs', { profileId, mixtureId, settings }).expect(202)).body.run.id as number
  ;[reference, doubled, narrower] = await Promise.all([
    submit(await mixture(400)),
    submit(await mixture(800)),
    submit(await mixture(400), { ...QUICK_RUN_SETTINGS, endCm: 670 }),
  ])
  for (const id of [reference, doubled, narrower]) expect((await waitForRun(a, id)).status).toBe('succeeded')
})
afterAll(async () => {
  await t.close()
})

describe('comparisons API', () => {
  it('gives forcing at the top, tropopause and surface, the spectral forcing and the changed inputs', async () => {
    const reviewer = await signedInAgent(t, 'reviewer')
    const res = await reviewer.get(`/api/comparisons?before=${reference}&after=${doubled}`).expect(200)
    const c = res.body.comparison
    expect(c.before.id).toBe(reference)
    expect(c.after.id).toBe(doubled)
    expect(c.before.inputs).toBeUndefined()
    expect(c.comparison.forcing.map((f: { level: string }) => f.level)).toEqual(['top', 'tropopause', 'surface'])
    const [top, tropopause] = c.comparison.forcing
    // 660–680 cm⁻¹ is the CO₂ band centre: doubling lifts the emission into the warmer
    // stratosphere, so the top loses more (negative) and the tropopause gets more from above
    // (positive); the known band-centre behaviour (common practice).
    expect(top.forcingWPerM2).toBeLessThan(0)
    expect(tropopause.forcingWPerM2).toBeGreaterThan(0)
    expect(top.forcingWPerM2).toBeCloseTo(top.beforeNetUpWPerM2 - top.afterNetUpWPerM2, 12)
    // 1 cm⁻¹ bins: the spectral forcing sums to the forcing at the top.
    const sum = c.comparison.spectrum.toaForcing.reduce((s: number, v: number | null) => s + (v ?? 0), 0)
    expect(sum).toBeCloseTo(top.forcingWPerM2, 9)
    expect(c.comparison.spectrum.wavenumberCm).toHaveLength(20)
    const co2 = c.inputDifferences.find((d: { path: string }) => d.path === 'mixture.gases.CO2.vmr')
    expect(co2.before).toBeCloseTo(400e-6, 15)
    expect(co2.after).toBeCloseTo(800e-6, 15)
    expect(c.inputDifferences.map((d: { path: string }) => d.path)).toEqual([
      'mixture.gases.CO2.vmr',
      'mixture.id',
      'mixture.name',
      'profile.snapshot', // the frozen atmosphere carries the mixture's amounts
    ])
    expect(c.cataloguesDiffer).toBe(false)
    expect(c.engineVersionsDiffer).toBe(false)
  })

  it('serves the spectrum and the column as CSV, with the cautions in its header', async () => {
    const a = await signedInAgent(t, 'analyst')
    const spectrum = await a.get(`/api/comparisons/csv?before=${reference}&after=${doubled}&table=spectrum`).expect(200)
    expect(spectrum.headers['content-type']).toMatch(/text\/csv/)
    const lines = spectrum.text.trim().split('\n')
    expect(lines[0]).toMatch(/^# Tauline comparison: run \d+ \(reference\) → run \d+; forcing = reduction of net upward flux/)
    expect(lines[1]).toMatch(/Clear sky/)
    expect(lines[2]).toBe(
      `wavenumber_cm-1,olr_run${reference}_W_m-2_(cm-1)-1,olr_run${doubled}_W_m-2_(cm-1)-1,forcing_top_W_m-2_(cm-1)-1,forcing_tropopause_W_m-2_(cm-1)-1,forcing_surface_W_m-2_(cm-1)-1,surface_down_run${reference}_W_m-2_(cm-1)-1,surface_down_run${doubled}_W_m-2_(cm-1)-1`,
    )
    expect(lines).toHaveLength(3 + 20)
    const column = await a.get(`/api/comparisons/csv?before=${reference}&after=${doubled}&table=column`).expect(200)
    const columnLines = column.text.trim().split('\n')
    expect(columnLines[2]).toBe('level,pressure_Pa,forcing_W_m-2,heating_rate_change_layer_above_K_day-1')
    expect(columnLines).toHaveLength(3 + 11)
  })

  it('refuses runs on different bins with 422 naming the field, and bad or unfinished requests clearly', async () => {
    const a = await signedInAgent(t, 'analyst')
    const mismatch = await a.get(`/api/comparisons?before=${reference}&after=${narrower}`).expect(422)
    expect(mismatch.body.error.code).toBe('NOT_COMPARABLE')
    expect(mismatch.body.error.details.field).toBe('spectrum.wavenumberCm')
    expect(mismatch.body.error.message).toMatch(/20 bins from 660\.5 to 679\.5 cm⁻¹ against 10 bins/)

    const same = await a.get(`/api/comparisons?before=${reference}&after=${reference}`).expect(400)
    expect(same.body.error.details.fields[0]).toMatchObject({ field: 'after', message: 'Choose two different runs.' })
    const bad = await a.get('/api/comparisons?before=abc&after=2').expect(400)
    expect(bad.body.error.details.fields[0].field).toBe('before')
    await a.get(`/api/comparisons?before=${reference}&after=999999`).expect(404)
    await a.get(`/api/comparisons/csv?before=${reference}&after=${doubled}&table=nope`).expect(400)

    // A run still queued has no results: 409 names it.
    const queued = (
      await a.post('/api/runs', { profileId: (await a.get(`/api/runs/${reference}`)).body.run.inputs.profile.id, settings: { ...QUICK_RUN_SETTINGS, chunkWidthCm: 1 } })
    ).body.run.id
    await a.post(`/api/runs/${queued}/cancel`).expect(200)
    const unfinished = await a.get(`/api/comparisons?before=${reference}&after=${queued}`).expect(409)
    expect(unfinished.body.error.message).toMatch(new RegExp(`Run ${queued} .* has no results to compare \\(status: cancelled\\)`))

    await request(t.app).get(`/api/comparisons?before=${reference}&after=${doubled}`).expect(401)
  })
})
