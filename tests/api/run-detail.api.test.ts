import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { computeRadiation } from '../../shared/physics/engine/compute'
import { loadBuiltInCatalogue } from '../../server/catalogue/builtin-catalogue'
import { getRunDetailSpectrum, getRunResults } from '../../server/runs/run.service'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

// The full-resolution window of a run: computed by the workers in chunks, joined, stored beside
// the binned results and served as JSON and CSV.
let t: TestApp
let profileId: number

beforeAll(async () => {
  t = await createTestApp({ runs: { threads: 1 } })
  profileId = await createPresetProfile(await signedInAgent(t, 'analyst'))
})
afterAll(async () => {
  await t.close()
})

const detailWindow = { startCm: 664, endCm: 671.5 }

describe('full-resolution window of a run', () => {
  it('when a window spanning chunks is asked for, returns the same points as a single-thread computation, as JSON and CSV', async () => {
    const a = await signedInAgent(t, 'analyst')
    const created = await a
      .post('/api/runs', { profileId, settings: { ...QUICK_RUN_SETTINGS, detailWindow } })
      .expect(202)
    const run = await waitForRun(a, created.body.run.id)
    expect(run.status).toBe('succeeded')

    const detail = (await a.get(`/api/runs/${run.id}/results/detail`).expect(200)).body
    expect(detail).toMatchObject({
      runId: run.id,
      startCm: 664,
      endCm: 671.5,
      inputHash: run.inputHash,
    })
    expect(detail.wavenumberCm[0]).toBe(664)
    expect(detail.wavenumberCm.at(-1)).toBe(671.5)
    expect(detail.pointCount).toBe(detail.wavenumberCm.length)

    // The same inputs computed in one process give the same numbers bit for bit.
    const local = computeRadiation(
      run.inputs.profile.snapshot,
      loadBuiltInCatalogue().table,
      run.inputs.settings,
    )
    expect(detail.wavenumberCm).toEqual(Array.from(local.detail!.wavenumberCm))
    expect(detail.olrSpectral).toEqual(Array.from(local.detail!.olrSpectral))

    // The binned results do not carry the window.
    const results = (await a.get(`/api/runs/${run.id}/results`).expect(200)).body
    expect(results.detail).toBeUndefined()
    // Both documents are the stored text passed through: the same as read and re-serialised.
    expect(results).toEqual(JSON.parse(JSON.stringify(await getRunResults(run.id))))
    expect(detail).toEqual(JSON.parse(JSON.stringify(await getRunDetailSpectrum(run.id))))

    const csv = await a.get(`/api/runs/${run.id}/results.csv?table=detail`).expect(200)
    const rows = csv.text.split('\n').filter((l: string) => l && !l.startsWith('#'))
    expect(rows[0]).toMatch(/^wavenumber_cm-1,olr_W_m-2_\(cm-1\)-1,/)
    expect(rows).toHaveLength(detail.pointCount + 1)
    expect(csv.text).toMatch(/# Full-resolution window 664–671.5 cm-1/)
  })

  it('when the run asked for no window, answers 404 with a hint', async () => {
    const a = await signedInAgent(t, 'analyst')
    const created = await a
      .post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS })
      .expect(202)
    await waitForRun(a, created.body.run.id)
    const res = await a.get(`/api/runs/${created.body.run.id}/results/detail`).expect(404)
    expect(res.body.error.message).toMatch(/no full-resolution window/)
  })

  it('when the window leaves the range, is inverted or too wide, refuses with 400 naming settings.detailWindow and stores nothing', async () => {
    const a = await signedInAgent(t, 'analyst')
    const before = (await a.get('/api/runs').expect(200)).body.total
    const bad = [
      { ...QUICK_RUN_SETTINGS, detailWindow: { startCm: 650, endCm: 670 } },
      { ...QUICK_RUN_SETTINGS, detailWindow: { startCm: 670, endCm: 665 } },
      {
        ...QUICK_RUN_SETTINGS,
        startCm: 500,
        endCm: 800,
        detailWindow: { startCm: 600, endCm: 750 },
      },
    ]
    for (const settings of bad) {
      const res = await a.post('/api/runs', { profileId, settings }).expect(400)
      expect(JSON.stringify(res.body.error.details)).toMatch(/settings\.detailWindow/)
    }
    expect((await a.get('/api/runs').expect(200)).body.total).toBe(before)
  })
})
