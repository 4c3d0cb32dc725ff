import { describe, expect, it } from 'vitest'
import { loadBuiltInCatalogue } from '../../../server/catalogue/builtin-catalogue'
import { applyMixture } from '../../../shared/mixtures/apply-mixture'
import { buildClimatologyProfile } from '../../../shared/physics/atmosphere/climatology'
import { compareRuns, computeRadiation } from '../../../shared/physics/engine/compute'
import type { RadiationResult } from '../../../shared/physics/engine/merge'
import {
  compareResults,
  inputDifferences,
  ResultsNotComparableError,
  type ComparableResults,
} from '../../../shared/results/compare-results'

// Two engine runs that differ only in CO₂, converted to the stored form (plain arrays, null for
// non-finite values, as finalize-run.ts stores them), then compared.
const { table } = loadBuiltInCatalogue()
const base = buildClimatologyProfile('mid-latitude-summer', { levelCount: 21, topPressurePa: 100 })
const settings = { startCm: 660, endCm: 700, chunkWidthCm: 20, outputResolutionCm: 1 }
const at = (ppmv: number, s = settings): RadiationResult =>
  computeRadiation(applyMixture(base, { CO2: { mode: 'uniform', vmr: ppmv * 1e-6 } }).profile, table, s)

const stored = (a: ArrayLike<number>) => Array.from(a, (v) => (Number.isFinite(v) ? v : null))
function toStored(r: RadiationResult): ComparableResults {
  return {
    summary: { tropopause: { levelIndex: r.tropopause.levelIndex, pressurePa: r.tropopause.pressurePa } },
    levels: {
      pressurePa: stored(r.levelPressurePa),
      fluxUpWPerM2: stored(r.fluxUpWPerM2),
      fluxDownWPerM2: stored(r.fluxDownWPerM2),
      fluxNetUpWPerM2: stored(r.fluxNetUpWPerM2),
    },
    layers: { heatingRateKPerDay: stored(r.heatingRateKPerDay) },
    spectrum: {
      wavenumberCm: stored(r.wavenumberCm),
      olrSpectral: stored(r.olrSpectral),
      surfaceDownSpectral: stored(r.surfaceDownSpectral),
    },
    spectralFluxes: { fluxUpBinned: stored(r.fluxUpBinned), fluxDownBinned: stored(r.fluxDownBinned) },
  }
}

const before = at(400)
const after = at(800)

describe('comparing two stored results', () => {
  it('gives the forcing of the engine’s own comparison at the top, the tropopause and the surface', () => {
    const c = compareResults(toStored(before), toStored(after))
    const engine = compareRuns(before, after)
    const byLevel = Object.fromEntries(c.forcing.map((f) => [f.level, f]))
    // The same definition (reduction of net upward flux, tropopause of `before`), so the same bits.
    expect(byLevel.top.forcingWPerM2).toBe(engine.toaWPerM2)
    expect(byLevel.tropopause.forcingWPerM2).toBe(engine.tropopauseWPerM2)
    expect(byLevel.surface.forcingWPerM2).toBe(engine.surfaceWPerM2)
    expect(byLevel.tropopause.levelIndex).toBe(before.tropopause.levelIndex)
    // In the band centre doubling CO₂ lifts the emission into the warmer stratosphere, so more
    // escapes (negative forcing at the top), while the tropopause gets more from above (positive).
    // The known band-centre behaviour of CO₂ (common practice); here −0.45 and +0.24 W m⁻².
    expect(byLevel.top.forcingWPerM2).toBeLessThan(0)
    expect(byLevel.tropopause.forcingWPerM2).toBeGreaterThan(0)
    expect(c.samePressures).toBe(true)
  })

  it('has spectral forcing that integrates to the level forcing (1 cm⁻¹ bins)', () => {
    const c = compareResults(toStored(before), toStored(after))
    const integral = (values: (number | null)[]) => values.reduce<number>((s, v) => s + (v ?? 0) * settings.outputResolutionCm, 0)
    const f = Object.fromEntries(c.forcing.map((x) => [x.level, x.forcingWPerM2]))
    expect(integral(c.spectrum.toaForcing)).toBeCloseTo(f.top, 9)
    expect(integral(c.spectrum.tropopauseForcing)).toBeCloseTo(f.tropopause, 9)
    expect(integral(c.spectrum.surfaceForcing)).toBeCloseTo(f.surface, 9)
    expect(c.spectrum.wavenumberCm).toHaveLength(40)
    expect(c.column.forcingWPerM2).toHaveLength(21)
    expect(c.column.heatingRateChangeKPerDay).toHaveLength(20)
  })

  it('gives zero everywhere when a run is compared with itself', () => {
    const c = compareResults(toStored(before), toStored(before))
    for (const f of c.forcing) expect(f.forcingWPerM2).toBe(0)
    expect(c.spectrum.toaForcing.every((v) => v === 0)).toBe(true)
    expect(c.column.heatingRateChangeKPerDay.every((v) => v === 0)).toBe(true)
  })

  it('refuses runs with different bins or levels, naming what differs', () => {
    const other = toStored(at(400, { ...settings, endCm: 680 }))
    expect(() => compareResults(toStored(before), other)).toThrow(ResultsNotComparableError)
    expect(() => compareResults(toStored(before), other)).toThrow(/40 bins from 660\.5 to 699\.5 cm⁻¹ against 20 bins/)
    try {
      compareResults(toStored(before), other)
    } catch (err) {
      expect((err as ResultsNotComparableError).field).toBe('spectrum.wavenumberCm')
    }
    const fewer = toStored(before)
    fewer.levels.pressurePa = fewer.levels.pressurePa.slice(1)
    expect(() => compareResults(toStored(before), fewer)).toThrow(/different numbers of levels \(21 against 20\)/)
  })
})

describe('the inputs that differ between two runs', () => {
  it('lists changed leaves by path, an atmosphere snapshot as one entry, and stops at the limit', () => {
    const a = { profile: { id: 1, snapshot: { levels: [1, 2] } }, mixture: { gases: { CO2: 400, CH4: 1.9 } }, settings: { startCm: 10 } }
    const b = { profile: { id: 1, snapshot: { levels: [1, 3] } }, mixture: { gases: { CO2: 800, CH4: 1.9 } }, settings: { startCm: 10, endCm: 20 } }
    expect(inputDifferences(a, b)).toEqual([
      { path: 'mixture.gases.CO2', before: 400, after: 800 },
      { path: 'profile.snapshot', before: '(differs)', after: '(differs)' },
      { path: 'settings.endCm', before: null, after: 20 },
    ])
    expect(inputDifferences(a, b, 1)).toHaveLength(1)
    expect(inputDifferences(a, a)).toEqual([])
  })
})
