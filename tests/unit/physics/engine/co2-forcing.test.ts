import { describe, expect, it } from 'vitest'
import { loadBuiltInCatalogue } from '../../../../server/catalogue/builtin-catalogue'
import { applyMixture } from '../../../../shared/mixtures/apply-mixture'
import { buildClimatologyProfile } from '../../../../shared/physics/atmosphere/climatology'
import { fitLogarithmicForcing } from '../../../../shared/physics/diagnostics/log-fit'
import { compareRuns, computeRadiation } from '../../../../shared/physics/engine/compute'
import type { RadiationResult } from '../../../../shared/physics/engine/merge'

// CO₂ forcing with the built-in catalogue, the whole chain from lines to fluxes. 500–1100 cm⁻¹
// holds the 15 µm band and the 10 µm bands, where nearly all of CO₂'s longwave forcing is;
// 31 levels keep the test quick. Tolerances are plausibility bands: the published line-by-line
// numbers are from memory (low confidence) and the catalogue has stated errors.
const base = buildClimatologyProfile('mid-latitude-summer', { levelCount: 31, topPressurePa: 10 })
const { table } = loadBuiltInCatalogue()
const settings = { startCm: 500, endCm: 1100, chunkWidthCm: 20, outputResolutionCm: 1 }
const at = (ppmv: number): RadiationResult =>
  computeRadiation(applyMixture(base, { CO2: { mode: 'uniform', vmr: ppmv * 1e-6 } }).profile, table, settings)

describe('CO₂ forcing through the whole engine (mid-latitude summer, clear sky)', () => {
  const concentrations = [100, 280, 560, 1120, 2000]
  const runs = new Map<number, RadiationResult>()
  const run = (c: number) => {
    if (!runs.has(c)) runs.set(c, at(c))
    return runs.get(c)!
  }

  it('doubling 280 → 560 ppmv gives forcing in the published line-by-line range at the top, tropopause and surface', () => {
    const f = compareRuns(run(280), run(560))
    // Line-by-line, mid-latitude summer, instantaneous: TOA ≈ 2.8, 200 hPa ≈ 5.0–5.5, surface ≈ 1.6–2.0 W m⁻²
    // (Collins et al. 2006, JGR 111, D14317, RTMIP; from memory, low confidence). An independent
    // column model with a comparable synthesised catalogue gave 2.4–2.6 / 4.5–4.7 / 0.9–1.3
    // (unpublished; from memory).
    expect(f.toaWPerM2).toBeGreaterThan(2.0)
    expect(f.toaWPerM2).toBeLessThan(3.4)
    expect(f.tropopauseWPerM2).toBeGreaterThan(4.0)
    expect(f.tropopauseWPerM2).toBeLessThan(6.0)
    expect(f.surfaceWPerM2).toBeGreaterThan(0.8)
    expect(f.surfaceWPerM2).toBeLessThan(2.6)
  }, 180_000)

  it('forcing grows close to logarithmically with concentration over 100–2000 ppmv (Myhre et al. 1998 form, GRL 25, 2715)', () => {
    const reference = run(280)
    const forcing = concentrations.map((c) => compareRuns(reference, run(c)).toaWPerM2)
    const fit = fitLogarithmicForcing(concentrations, forcing, 280, true)
    expect(fit.rSquared).toBeGreaterThan(0.99)
    // Successive doublings add nearly the same forcing (common practice: within ~20 % over this range).
    const first = forcing[2] - forcing[1]
    const second = forcing[3] - forcing[2]
    expect(Math.abs(second / first - 1)).toBeLessThan(0.2)
  }, 240_000)

  it('the band centre gives negative forcing at the top and the wings positive (the band is not "saturated" for forcing)', () => {
    const f = compareRuns(run(280), run(560))
    const wn = run(280).wavenumberCm
    const sum = (lo: number, hi: number) => f.toaSpectral.reduce((s, v, i) => (wn[i] >= lo && wn[i] < hi ? s + v : s), 0)
    expect(sum(664, 671)).toBeLessThan(0) // emitted from the warm stratosphere: more CO₂, more emission to space
    expect(sum(550, 640) + sum(690, 800)).toBeGreaterThan(f.toaWPerM2 * 0.8) // the wings carry the forcing
  }, 120_000)
})
