import { expect } from 'vitest'
import type { RunDetail } from '../../shared/schemas/runs'
import type { csrfAgent } from './http-agent'

type Agent = Awaited<ReturnType<typeof csrfAgent>>

/** A small, quick run: 11-level column up to 1 hPa, 20 cm⁻¹ around the CO₂ band centre in 4 chunks. */
export const QUICK_RUN_SETTINGS = {
  startCm: 660,
  endCm: 680,
  chunkWidthCm: 5,
  outputResolutionCm: 1,
  quadrature: { kind: 'gauss-legendre', nodes: 2 },
}

/** Creates a preset profile through the API and returns its id. */
export async function createPresetProfile(a: Agent, preset = 'mid-latitude-summer', levelCount = 11): Promise<number> {
  const preview = await a.post('/api/profiles/presets/preview', { preset, levelCount, topPressurePa: 100 }).expect(200)
  const p = preview.body.profile
  const res = await a
    .post('/api/profiles', { name: `${preset} ${levelCount}`, source: preset === 'us-standard-1976' ? 'us-standard-1976' : 'climatology', sourceDetails: p.sourceDetails, surfaceTemperatureK: p.surfaceTemperatureK, surfaceEmissivity: p.surfaceEmissivity, levels: p.levels })
    .expect(201)
  return res.body.profile.id
}

/** Polls a run until it reaches a terminal status (or the time runs out). */
export async function waitForRun(a: Agent, id: number, timeoutMs = 120_000): Promise<RunDetail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const run = (await a.get(`/api/runs/${id}`).expect(200)).body.run as RunDetail
    if (['succeeded', 'failed', 'cancelled'].includes(run.status)) return run
    if (Date.now() > until) expect.fail(`run ${id} still ${run.status} (${run.chunksDone}/${run.chunkCount}) after ${timeoutMs} ms`)
    await new Promise((r) => setTimeout(r, 300))
  }
}
