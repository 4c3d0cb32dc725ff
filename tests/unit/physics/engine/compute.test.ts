import { describe, expect, it } from 'vitest'
import { buildClimatologyProfile } from '../../../../shared/physics/atmosphere/climatology'
import { PhysicsError } from '../../../../shared/physics/errors'
import { planckBandIntegral } from '../../../../shared/physics/planck'
import { toLineTable } from '../../../../shared/physics/spectroscopy/line'
import { compareRuns, computeRadiation } from '../../../../shared/physics/engine/compute'
import { planChunks } from '../../../../shared/physics/engine/prepare'
import { resolveComputeSettings } from '../../../../shared/physics/engine/settings'
import { syntheticBandLines } from '../optics/synthetic-band'

// A small column (11 levels up to 1 hPa) and a 40 cm⁻¹ window keep these tests quick.
const profile = buildClimatologyProfile('mid-latitude-summer', { levelCount: 11, topPressurePa: 100 })
const band = toLineTable(syntheticBandLines(40))
const settings = { startCm: 660, endCm: 700, chunkWidthCm: 20, outputResolutionCm: 1 }

describe('computeRadiation', () => {
  it('when there are no lines, OLR is the surface Planck band integral and the sky is dark (Kirchhoff, ε = 1)', () => {
    const result = computeRadiation(profile, toLineTable([]), { ...settings, waterVapourContinuum: false })
    const expected = Math.PI * planckBandIntegral(660, 700, profile.surfaceTemperatureK) // W m⁻², Planck (Widger & Woodall 1976)
    expect(result.olrWPerM2 / expected - 1).toBeLessThan(1e-6)
    expect(result.surfaceDownWPerM2).toBe(0)
    expect(Array.from(result.heatingRateKPerDay).every((h) => Math.abs(h) < 1e-9)).toBe(true)
    expect(result.columnTransmittance.every((t) => t === 1)).toBe(true)
    expect(Number.isNaN(result.emissionPressurePa[0])).toBe(true)
  })

  it('when the water-vapour continuum is on, an empty line list still absorbs in its range (Roberts et al. 1976 form)', () => {
    const window = { startCm: 900, endCm: 940, chunkWidthCm: 20, outputResolutionCm: 1 }
    const off = computeRadiation(profile, toLineTable([]), { ...window, waterVapourContinuum: false })
    const on = computeRadiation(profile, toLineTable([]), { ...window, waterVapourContinuum: true })
    expect(on.olrWPerM2).toBeLessThan(off.olrWPerM2)
    expect(on.surfaceDownWPerM2).toBeGreaterThan(0)
  })

  it('when the band absorbs, OLR drops, the sky emits downward, and the band centre is seen from higher up than its flanks', () => {
    const clear = computeRadiation(profile, toLineTable([]), settings)
    const result = computeRadiation(profile, band, settings)
    expect(result.olrWPerM2).toBeLessThan(clear.olrWPerM2)
    expect(result.surfaceDownWPerM2).toBeGreaterThan(0)
    const centre = result.wavenumberCm.findIndex((w) => w > 667 && w < 668)
    const flank = result.wavenumberCm.findIndex((w) => w > 698 && w < 699)
    expect(result.emissionPressurePa[centre]).toBeLessThan(result.emissionPressurePa[flank])
    // The centre is emitted from the stratosphere, which is warmer than the tropopause (climatology
    // built with a warming stratosphere), so its brightness temperature exceeds the tropopause temperature.
    const tropopauseT = result.levelTemperatureK[result.tropopause.levelIndex]
    expect(result.toaBrightnessTemperatureK[centre]).toBeGreaterThan(tropopauseT)
  })

  it('when run twice, gives bit-identical numbers (deterministic chunks)', () => {
    const a = computeRadiation(profile, band, settings)
    const b = computeRadiation(profile, band, settings)
    expect(Array.from(b.fluxNetUpWPerM2)).toEqual(Array.from(a.fluxNetUpWPerM2))
    expect(Array.from(b.olrSpectral)).toEqual(Array.from(a.olrSpectral))
  })

  it('the binned OLR spectrum integrates to the band OLR', () => {
    const r = computeRadiation(profile, band, settings)
    const integral = r.olrSpectral.reduce((s, v) => s + v * settings.outputResolutionCm, 0)
    expect(Math.abs(integral / r.olrWPerM2 - 1)).toBeLessThan(1e-9)
  })

  it('when the gas amount doubles: positive forcing at the tropopause, negative at the top over the band centre, positive in the flanks', () => {
    const doubled = {
      ...profile,
      levels: profile.levels.map((l) => ({ ...l, vmr: { ...l.vmr, CO2: (l.vmr.CO2 ?? 0) * 2 } })),
    }
    const before = computeRadiation(profile, band, settings)
    const after = computeRadiation(doubled, band, settings)
    const f = compareRuns(before, after)
    expect(f.tropopauseWPerM2).toBeGreaterThan(0)
    // At the top, the saturated band centre emits from the warm stratosphere; more gas lifts that
    // level higher and warmer, so OLR there rises (negative forcing), while the flanks, emitted
    // from the cooling troposphere, give positive forcing (common practice).
    const centre = before.wavenumberCm.findIndex((w) => w > 667 && w < 668)
    const flank = before.wavenumberCm.findIndex((w) => w > 698 && w < 699)
    expect(f.toaSpectral[centre]).toBeLessThan(0)
    expect(f.toaSpectral[flank]).toBeGreaterThan(0)
    const integral = f.toaSpectral.reduce((s, v) => s + v, 0) * settings.outputResolutionCm
    expect(Math.abs(integral - f.toaWPerM2)).toBeLessThan(1e-9 * Math.max(1, Math.abs(f.toaWPerM2)))
  })
})

describe('planChunks and settings', () => {
  it('splits the range into chunks aligned to output bins, the last one shorter', () => {
    const chunks = planChunks(resolveComputeSettings({ startCm: 10, endCm: 35, chunkWidthCm: 10, outputResolutionCm: 0.5 }))
    expect(chunks.map((c) => [c.startCm, c.endCm, c.firstBin, c.binCount])).toEqual([
      [10, 20, 0, 20],
      [20, 30, 20, 20],
      [30, 35, 40, 10],
    ])
  })

  it.each([
    [{ startCm: 100, endCm: 50 }, 'startCm'],
    [{ chunkWidthCm: 2.5, outputResolutionCm: 1 }, 'chunkWidthCm'],
    [{ startCm: 10, endCm: 10.5, outputResolutionCm: 1, chunkWidthCm: 1 }, 'endCm'],
    [{ wingCutoffCm: 0 }, 'wingCutoffCm'],
  ])('when settings are inconsistent (%o), throws naming %s', (partial, field) => {
    expect(() => resolveComputeSettings(partial)).toThrow(PhysicsError)
    try {
      resolveComputeSettings(partial)
    } catch (err) {
      expect((err as PhysicsError).details?.field).toBe(field)
    }
  })
})
