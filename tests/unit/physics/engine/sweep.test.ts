import { describe, expect, it } from 'vitest'
import { loadBuiltInCatalogue } from '../../../../server/catalogue/builtin-catalogue'
import { buildClimatologyProfile } from '../../../../shared/physics/atmosphere/climatology'
import { levelsToLayers } from '../../../../shared/physics/atmosphere/layers'
import { computeRadiation } from '../../../../shared/physics/engine/compute'
import { adaptiveOpticsOptionsOf } from '../../../../shared/physics/engine/compute-chunk'
import { computeSweep, prepareSweep } from '../../../../shared/physics/engine/compute-sweep'
import { PhysicsError } from '../../../../shared/physics/errors'
import { computeAdaptiveChunkOpticalDepth } from '../../../../shared/physics/optics/adaptive-optical-depth'
import {
  computeAdaptiveSweepOpticalDepth,
  sweepLayersDifference,
} from '../../../../shared/physics/optics/adaptive-sweep-optical-depth'
import type { AtmosphereProfile, GasId } from '../../../../shared/physics/types'

const { table } = loadBuiltInCatalogue()
// 21 levels to 1 hPa and one 20 cm⁻¹ chunk on the CO₂ ν₂ Q branch keep these tests quick.
const base = buildClimatologyProfile('mid-latitude-summer', { levelCount: 21, topPressurePa: 100 })
const settings = { startCm: 660, endCm: 680, chunkWidthCm: 20, outputResolutionCm: 1 }

function withGasScaled(profile: AtmosphereProfile, gas: GasId, factor: number): AtmosphereProfile {
  return {
    ...profile,
    levels: profile.levels.map((level) => ({
      ...level,
      vmr: { ...level.vmr, [gas]: (level.vmr[gas] ?? 0) * factor },
    })),
  }
}

function largestDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let d = 0
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]))
  return d
}

/** Copies of every member's optical depths from a sweep chunk. */
function sweepOpticalDepths(profiles: AtmosphereProfile[], maxPieceWidthSpread?: number) {
  const prepared = prepareSweep(profiles, table, settings, 'CO2')
  const members: Float64Array[][] = []
  const result = computeAdaptiveSweepOpticalDepth(
    {
      lines: table,
      memberLayers: prepared.members.map((m) => m.layers),
      sweptGas: 'CO2',
      startCm: 660,
      endCm: 680,
      options: adaptiveOpticsOptionsOf(prepared.members[0]),
      maxPieceWidthSpread,
    },
    (m, tau) => {
      members[m] = tau.map((row) => row.slice())
    },
  )
  return { ...result, members }
}

describe('computeSweep', () => {
  it('gives every member of a CO₂ sweep the fluxes and heating rates of its own run, within the adaptive tolerances (2e-3 W m⁻², 3e-4 K/day)', () => {
    // The tolerances are those the adaptive method keeps against the uniform fast path over
    // 10–3000 cm⁻¹ (docs/PERFORMANCE.md); sharing the grid may only make a member finer.
    const factors = [0, 0.5, 1, 2, 4, 16]
    const profiles = factors.map((f) => withGasScaled(base, 'CO2', f))
    const sweep = computeSweep(profiles, table, settings, 'CO2')
    expect(sweep.independentReason).toBeNull()
    factors.forEach((factor, m) => {
      const own = computeRadiation(profiles[m], table, settings)
      const member = sweep.members[m]
      expect(
        largestDifference(member.fluxUpWPerM2, own.fluxUpWPerM2),
        `×${factor} up`,
      ).toBeLessThan(2e-3)
      expect(
        largestDifference(member.fluxDownWPerM2, own.fluxDownWPerM2),
        `×${factor} down`,
      ).toBeLessThan(2e-3)
      expect(
        largestDifference(member.heatingRateKPerDay, own.heatingRateKPerDay),
        `×${factor} heating`,
      ).toBeLessThan(3e-4)
      expect(member.wavenumberCm).toEqual(own.wavenumberCm)
    })
    // More CO₂, less OLR on the band's flank-dominated chunk (a sanity check on member order).
    expect(sweep.members[0].olrWPerM2).toBeGreaterThan(sweep.members[2].olrWPerM2)
  }, 60_000)

  it('when the swept gas is water vapour, computes members on their own (the air column changes) with the numbers of computeRadiation', () => {
    const profiles = [1, 1.2].map((f) => withGasScaled(base, 'H2O', f))
    const sweep = computeSweep(profiles, table, settings, 'H2O')
    expect(sweep.independentReason).toMatch(/layer 0 of member 1 differs in/)
    const own = computeRadiation(profiles[1], table, settings)
    expect(Array.from(sweep.members[1].fluxUpWPerM2)).toEqual(Array.from(own.fluxUpWPerM2))
  }, 30_000)

  it('when the method is not adaptive, computes members on their own', () => {
    const profiles = [1, 2].map((f) => withGasScaled(base, 'CO2', f))
    const narrow = {
      ...settings,
      startCm: 667,
      endCm: 668,
      chunkWidthCm: 1,
      spectralMethod: 'uniform' as const,
    }
    const prepared = prepareSweep(profiles, table, narrow, 'CO2')
    expect(prepared.independentReason).toMatch(/uniform/)
  })

  it('refuses members that differ in anything but the swept gas, naming the member and field', () => {
    const warmer = {
      ...base,
      levels: base.levels.map((l, i) => (i === 3 ? { ...l, temperatureK: l.temperatureK + 1 } : l)),
    }
    const methane = withGasScaled(base, 'CH4', 2)
    expect(() => prepareSweep([base, warmer], table, settings, 'CO2')).toThrow(
      /member 1 .*levels\[3\]\.temperatureK/,
    )
    expect(() => prepareSweep([base, methane], table, settings, 'CO2')).toThrow(
      /levels\[0\]\.vmr\.CH4/,
    )
    expect(() => prepareSweep([base], table, settings, 'XE' as GasId)).toThrow(PhysicsError)
  })
})

describe('computeAdaptiveSweepOpticalDepth', () => {
  it('with one member, gives the optical depths of computeAdaptiveChunkOpticalDepth to rounding (the gases are summed in two parts; 1e-13 of the largest τ of a layer)', () => {
    const single = sweepOpticalDepths([base])
    const prepared = prepareSweep([base], table, settings, 'CO2').members[0]
    const own = computeAdaptiveChunkOpticalDepth({
      lines: table,
      layers: prepared.layers,
      startCm: 660,
      endCm: 680,
      options: adaptiveOpticsOptionsOf(prepared),
    })
    expect(single.grid.wavenumberCm).toEqual(own.wavenumberCm)
    own.opticalDepth.forEach((row, k) => {
      const largest = Math.max(...row)
      expect(largestDifference(single.members[0][k], row)).toBeLessThanOrEqual(1e-13 * largest)
    })
  })

  it('interpolating the swept gas between reference amounts matches computing every amount: ∫τ dν within 1e-5, τ within 2e-4', () => {
    // CO₂ up to 40× makes self-broadening change the widths by ≈ 1 % (3 reference amounts). The
    // interpolation error of a line shape is ≤ s²/4 ≈ 1e-5 (module comment); pointwise the fast
    // Voigt function's region switches add up to its own accuracy, ≈ 1e-4 relative (Humlíček 1982,
    // JQSRT 27, 437, from memory), as a width moves a point across a region boundary.
    const profiles = [0.5, 1, 3, 7, 12, 20, 40].map((f) => withGasScaled(base, 'CO2', f))
    const interpolated = sweepOpticalDepths(profiles)
    const exact = sweepOpticalDepths(profiles, 0)
    expect(interpolated.stats.largestPieceWidthSpread).toBeGreaterThan(0)
    expect(interpolated.stats.largestPieceWidthSpread).toBeLessThanOrEqual(6e-3)
    expect(interpolated.stats.sweptGasLayerDeposits).toBeLessThan(exact.stats.sweptGasLayerDeposits)
    expect(exact.stats.largestPieceWidthSpread).toBe(0)
    expect(interpolated.grid.wavenumberCm).toEqual(exact.grid.wavenumberCm)
    let worstPoint = 0
    let worstIntegral = 0
    exact.members.forEach((layers, m) =>
      layers.forEach((row, k) => {
        let exactSum = 0
        let interpolatedSum = 0
        row.forEach((tau, p) => {
          const value = interpolated.members[m][k][p]
          exactSum += tau
          interpolatedSum += value
          if (tau > 1e-8) worstPoint = Math.max(worstPoint, Math.abs(value - tau) / tau)
        })
        worstIntegral = Math.max(worstIntegral, Math.abs(interpolatedSum - exactSum) / exactSum)
      }),
    )
    expect(worstIntegral).toBeLessThan(1e-5)
    expect(worstIntegral).toBeGreaterThan(0) // the interpolated path really ran
    expect(worstPoint).toBeLessThan(2e-4)
  }, 60_000)

  it('names the layer and field when members differ in more than the swept gas', () => {
    const layers = levelsToLayers(base)
    const changed = layers.map((l, k) =>
      k === 2 ? { ...l, meanTemperatureK: l.meanTemperatureK + 0.5 } : l,
    )
    expect(sweepLayersDifference([layers, changed], 'CO2')).toBe(
      'layer 2 of member 1 differs in meanTemperatureK',
    )
    expect(sweepLayersDifference([layers, layers], 'CO2')).toBeNull()
  })
})
