import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  computeAdaptiveChunkOpticalDepth,
  type AdaptiveOpticsOptions,
} from '../../../../shared/physics/optics/adaptive-optical-depth'
import type { AdaptiveSpectralGrid } from '../../../../shared/physics/optics/adaptive-grid'
import { voigtKFast } from '../../../../shared/physics/optics/masked-multigrid'
import { endCorrectedTrapezoidWeights } from '../../../../shared/physics/transfer/end-corrected-trapezoid'
import { computeReferenceOpticalDepth } from '../../../../shared/physics/optics/reference-optical-depth'
import { toLineTable, voigtKUnchecked } from '../../../../shared/physics/spectroscopy'
import { expectRelativeClose } from '../../../support/expect-close'
import { ATM_PA, co2Line } from './optics-test-helpers'
import { fiveLayers, singleLayer, syntheticBandTable } from './synthetic-band'

/** ∫ values dν with the engine's end-corrected trapezoid weights on an adaptive grid. */
function integrateOn(grid: AdaptiveSpectralGrid, values: ArrayLike<number>, unitCm = 1): number {
  const n = grid.wavenumberCm.length
  const weights = endCorrectedTrapezoidWeights(
    grid.nodeIndex,
    grid.wavenumberCm,
    Math.round(unitCm / grid.baseStepCm),
    { left: new Float64Array(n), right: new Float64Array(n) },
  )
  let sum = 0
  for (let i = 0; i < n; i++) sum += (weights.left[i] + weights.right[i]) * values[i]
  return sum
}

/** Band absorption ∫(1 − e^{−τ}) dν, cm⁻¹. */
function absorptionOn(grid: AdaptiveSpectralGrid, tau: ArrayLike<number>): number {
  return integrateOn(
    grid,
    Array.from(tau, (t) => -Math.expm1(-t)),
  )
}

/** Band absorption on a uniform grid (trapezoid rule). */
function uniformAbsorption(tau: ArrayLike<number>, stepCm: number): number {
  let sum = 0
  for (let i = 1; i < tau.length; i++)
    sum -= 0.5 * stepCm * (Math.expm1(-tau[i - 1]) + Math.expm1(-tau[i]))
  return sum
}

const band = syntheticBandTable()
const layers = fiveLayers()

describe('computeAdaptiveChunkOpticalDepth: analytic checks', () => {
  it('when one strong Lorentz-like line is integrated on the adaptive grid, returns S·u·(2/π)·atan(cutoff/γ) within 1e-4', () => {
    // Beer–Lambert: ∫τ dν = S·u (Goody & Yung 1989 §3, from memory) minus the wings beyond the
    // cutoff, ∫_{−c}^{c} f_L = (2/π) atan(c/γ) (elementary integral); γ/α_D ≈ 113, peak τ ≈ 4.5.
    const column = 1e19
    const result = computeAdaptiveChunkOpticalDepth({
      lines: toLineTable([co2Line()]),
      layers: [singleLayer(ATM_PA, 296, column)],
      startCm: 637,
      endCm: 698,
      options: { unitCm: 1 },
    })
    const expected = 1e-19 * column * (2 / Math.PI) * Math.atan(25 / 0.07)
    expectRelativeClose(integrateOn(result.grid, result.opticalDepth[0]), expected, 1e-4)
    expect(result.stats.significantLineLayerCount).toBe(1)
    expect(result.stats.pointCount).toBeLessThan(61 * 16 * 2)
  })

  it('when a weak Doppler line lies on the coarse grid, widens it and keeps its area S·u·(2/π)atan(c/γ) within 1e-4 (measured 1.4e-5)', () => {
    // At 1 hPa and 296 K (S(T) = S, E″ = 0): α_D ≈ 6.2e-4 cm⁻¹ (α_D = ν/c·√(2 ln2 kT/m), Goody &
    // Yung 1989 §3.3, from memory), γ = 7e-5 cm⁻¹; column 1e12 cm⁻² gives a peak τ ≈ 8e-5, below
    // 1e-3, so the grid stays at 1/16 cm⁻¹ and the profile is widened to a Doppler width ≈ 0.8 h.
    // Area as in the test above (the Doppler core lies well inside the cutoff).
    const column = 1e12
    const lines = toLineTable([co2Line({ wavenumberCm: 667.3 })])
    const layer = singleLayer(100, 296, column)
    const result = computeAdaptiveChunkOpticalDepth({
      lines,
      layers: [layer],
      startCm: 660,
      endCm: 675,
      options: { unitCm: 1, negligibleFluxWPerM2PerCm: 0 },
    })
    expect(result.stats.widenedLineLayerCount).toBe(1)
    expect(result.stats.refinementLevels).toBe(0)
    const gamma = 0.07 * (100 / ATM_PA)
    const expected = 1e-19 * column * (2 / Math.PI) * Math.atan(25 / gamma)
    // Tolerance: the widening targets a trapezoid area error of 1e-4 (adaptive-optical-depth.ts).
    expectRelativeClose(integrateOn(result.grid, result.opticalDepth[0]), expected, 1e-4)
    // Without the widening, point samples of the 5e-4 cm⁻¹ wide core on a 1/16 cm⁻¹ grid would
    // give the wrong area: the grid point nearest the centre is 0.0125 cm⁻¹ ≈ 23 α_D away.
    const nearest = result.wavenumberCm.reduce((best, nu) =>
      Math.abs(nu - 667.3) < Math.abs(best - 667.3) ? nu : best,
    )
    expect(Math.abs(nearest - 667.3)).toBeGreaterThan(0.01)
  })
})

describe('computeAdaptiveChunkOpticalDepth: against the brute-force reference', () => {
  // Synthetic CO2-like ν₂ band in five layers 1000–1 hPa (synthetic-band.ts). The reference sums
  // every line at every point of a uniform 2⁻¹³ cm⁻¹ grid with the Weideman K (≤ 1e-8).
  for (const [startCm, endCm] of [
    [666, 669],
    [719, 721],
  ] as const) {
    it(`when the window is [${startCm}, ${endCm}] cm⁻¹, returns each layer's band absorption within 2e-4 and τ at the grid points of significant lines within 1e-3`, () => {
      const adaptive = computeAdaptiveChunkOpticalDepth({
        lines: band,
        layers,
        startCm,
        endCm,
        options: { unitCm: 1 },
      })
      const step = 2 ** -13
      const reference = computeReferenceOpticalDepth({
        lines: band,
        layers,
        startCm,
        endCm,
        stepCm: step,
      })
      expect(adaptive.grid.baseStepCm).toBeGreaterThanOrEqual(step)
      for (let k = 0; k < layers.length; k++) {
        const a = absorptionOn(adaptive.grid, adaptive.opticalDepth[k])
        const r = uniformAbsorption(reference.opticalDepth[k], step)
        expectRelativeClose(a, r, 2e-4, `layer ${k}`)
      }
      // Point values where no weak line was widened: compare on the lowest (all lines significant).
      const ratio = adaptive.grid.baseStepCm / step
      let worst = 0
      for (let p = 0; p < adaptive.wavenumberCm.length; p++) {
        const index = adaptive.grid.nodeIndex[p] * ratio
        const tau = adaptive.opticalDepth[0][p]
        const ref = reference.opticalDepth[0][index]
        worst = Math.max(worst, Math.abs(tau - ref) / ref)
      }
      expect(worst).toBeLessThanOrEqual(1e-3)
    })
  }
})

describe('computeAdaptiveChunkOpticalDepth: work, determinism and edge cases', () => {
  it('when the same chunk is computed twice, returns bit-identical optical depths and grids', () => {
    const input = { lines: band, layers, startCm: 700, endCm: 702, options: { unitCm: 1 } }
    const a = computeAdaptiveChunkOpticalDepth(input)
    const b = computeAdaptiveChunkOpticalDepth(input)
    expect(Array.from(b.wavenumberCm)).toEqual(Array.from(a.wavenumberCm))
    for (let k = 0; k < layers.length; k++) {
      expect(Array.from(b.opticalDepth[k])).toEqual(Array.from(a.opticalDepth[k]))
    }
  })

  it('when the negligible-line budget is large, drops weak pairs and reports a dropped bound within the budget', () => {
    const options: AdaptiveOpticsOptions = {
      unitCm: 1,
      negligibleFluxWPerM2PerCm: 1e-3,
      negligibleHeatingKPerDayPerCm: 1,
    }
    const kept = computeAdaptiveChunkOpticalDepth({
      lines: band,
      layers,
      startCm: 700,
      endCm: 702,
      options: { unitCm: 1, negligibleFluxWPerM2PerCm: 0 },
    })
    const dropped = computeAdaptiveChunkOpticalDepth({
      lines: band,
      layers,
      startCm: 700,
      endCm: 702,
      options,
    })
    expect(kept.stats.droppedLineLayerCount).toBe(0)
    expect(dropped.stats.droppedLineLayerCount).toBeGreaterThan(0)
    // Per layer the budget is chunk width × min(flux budget, heating budget × c_p Δp/(g·86400 s)).
    expect(dropped.stats.droppedFluxBoundWPerM2).toBeLessThanOrEqual(layers.length * 2 * 1e-3)
  })

  it('when the line list is empty, returns τ = 0 plus the continuum hooks on the coarse grid', () => {
    const result = computeAdaptiveChunkOpticalDepth({
      lines: toLineTable([]),
      layers,
      startCm: 800,
      endCm: 801,
      options: { continuum: [(nu, _layer, k, out) => out.fill(0.01 * (k + 1))] },
    })
    expect(result.wavenumberCm.length).toBe(17)
    expect(result.opticalDepth[2].every((t) => t === 0.03)).toBe(true)
  })

  it('when there are no layers, returns an empty list of optical depths on the coarse grid', () => {
    const result = computeAdaptiveChunkOpticalDepth({
      lines: band,
      layers: [],
      startCm: 660,
      endCm: 661,
    })
    expect(result.opticalDepth).toEqual([])
    expect(result.wavenumberCm.length).toBe(17)
  })

  it.each([
    ['a coarsening ratio that is not a power of two', { multigrid: { coarseningRatio: 3 } }],
    ['fewer than one point per half width', { pointsPerHalfWidth: 0.5 }],
    ['a negative significance threshold', { significantPeakOpticalDepth: -1 }],
    ['a unit that does not divide the chunk', { unitCm: 0.7 }],
  ] as [string, AdaptiveOpticsOptions][])(
    'when given %s, throws PhysicsError',
    (_label, options) => {
      expect(() =>
        computeAdaptiveChunkOpticalDepth({
          lines: band,
          layers,
          startCm: 660,
          endCm: 661,
          options,
        }),
      ).toThrow(PhysicsError)
    },
  )
})

describe('voigtKFast', () => {
  it('when evaluated over regions I–IV, returns voigtKUnchecked to rounding (rel 1e-14)', () => {
    // Same Humlíček (1982) approximation, regions I and II written in real arithmetic.
    let worst = 0
    for (let i = 0; i <= 400; i++) {
      for (const y of [1e-6, 1e-3, 0.1, 1, 4, 30]) {
        const x = -40 + 0.2 * i
        const relative = Math.abs(voigtKFast(x, y) / voigtKUnchecked(x, y) - 1)
        worst = Math.max(worst, relative)
      }
    }
    expect(worst).toBeLessThanOrEqual(1e-14)
  })
})
