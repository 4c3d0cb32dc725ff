import { describe, expect, it } from 'vitest'
import { loadBuiltInCatalogue } from '../../../../server/catalogue/builtin-catalogue'
import { buildClimatologyProfile } from '../../../../shared/physics/atmosphere/climatology'
import { computeRadiation } from '../../../../shared/physics/engine/compute'
import { detailPointRange } from '../../../../shared/physics/engine/detail-spectrum'
import type { RadiationResult } from '../../../../shared/physics/engine/merge'
import { resolveComputeSettings } from '../../../../shared/physics/engine/settings'

// The full-resolution window: spectra at the calculation's own grid points inside a chosen window.
// Checked against the run's own binned output (the same numbers averaged), not against outside values.
const profile = buildClimatologyProfile('mid-latitude-summer', {
  levelCount: 21,
  topPressurePa: 10,
})
const { table } = loadBuiltInCatalogue()
const base = { startCm: 660, endCm: 680, chunkWidthCm: 5, outputResolutionCm: 1 }
const window = { startCm: 663, endCm: 675 }

/** Trapezoid integral of y over the points with x in [lo, hi]. */
function trapezoid(x: Float64Array, y: Float64Array, lo: number, hi: number): number {
  let sum = 0
  for (let i = 1; i < x.length; i++) {
    if (x[i - 1] >= lo && x[i] <= hi) sum += 0.5 * (y[i] + y[i - 1]) * (x[i] - x[i - 1])
  }
  return sum
}

describe('full-resolution detail window', () => {
  const plain = computeRadiation(profile, table, base)
  const adaptive = computeRadiation(profile, table, { ...base, detailWindow: window })

  it('when a window is asked for, returns every grid point inside it once, in ascending order, edges included', () => {
    const nu = adaptive.detail!.wavenumberCm
    expect(nu.length).toBeGreaterThan(1000)
    expect(nu[0]).toBe(663) // bin edges are grid points (common practice of this engine's grid)
    expect(nu[nu.length - 1]).toBe(675)
    for (let i = 1; i < nu.length; i++) expect(nu[i]).toBeGreaterThan(nu[i - 1])
  })

  it('when a window is asked for, leaves fluxes and binned spectra bit for bit unchanged', () => {
    expect(Array.from(adaptive.fluxUpWPerM2)).toEqual(Array.from(plain.fluxUpWPerM2))
    expect(Array.from(adaptive.olrSpectral)).toEqual(Array.from(plain.olrSpectral))
    expect(plain.detail).toBeNull()
  })

  it('when integrated over an output bin, the detail spectrum gives the bin mean of the binned output', () => {
    const d = adaptive.detail!
    const check = (r: RadiationResult, field: 'olrSpectral' | 'surfaceDownSpectral') => {
      for (let b = 0; b < r.wavenumberCm.length; b++) {
        const lo = base.startCm + b
        if (lo < window.startCm || lo + 1 > window.endCm) continue
        const mean = trapezoid(d.wavenumberCm, d[field], lo, lo + 1)
        // The engine integrates with end-corrected trapezoid weights; the plain trapezoid here
        // differs by the end corrections only (≪ 1 % of a bin mean).
        expect(Math.abs(mean / r[field][b] - 1)).toBeLessThan(5e-3)
      }
    }
    check(plain, 'olrSpectral')
    check(plain, 'surfaceDownSpectral')
  })

  it('when the radiance is positive, gives its brightness temperature, inside the profile temperatures', () => {
    const d = adaptive.detail!
    for (let i = 0; i < d.wavenumberCm.length; i += 97) {
      expect(d.toaBrightnessTemperatureK[i]).toBeGreaterThan(180)
      expect(d.toaBrightnessTemperatureK[i]).toBeLessThan(310)
      expect(d.columnTransmittance[i]).toBeGreaterThanOrEqual(0)
      expect(d.columnTransmittance[i]).toBeLessThanOrEqual(1)
    }
  })

  it('when the uniform method is used, returns its uniform grid inside the window', () => {
    const r = computeRadiation(profile, table, {
      ...base,
      startCm: 666,
      endCm: 668,
      chunkWidthCm: 1,
      spectralMethod: 'uniform',
      detailWindow: { startCm: 666.5, endCm: 667.5 },
    })
    const nu = r.detail!.wavenumberCm
    expect(nu[0]).toBeGreaterThanOrEqual(666.5)
    expect(nu[nu.length - 1]).toBeLessThanOrEqual(667.5)
    const step = nu[1] - nu[0]
    for (let i = 2; i < nu.length; i++)
      expect(Math.abs(nu[i] - nu[i - 1] - step)).toBeLessThan(1e-6 * step + 1e-9)
  })
})

describe('detailPointRange', () => {
  const chunk = (startCm: number, endCm: number) => ({
    index: 0,
    startCm,
    endCm,
    firstBin: 0,
    binCount: 1,
  })
  const grid = Float64Array.from([10, 10.5, 11, 11.5, 12])

  it('when the window ends on a chunk edge, leaves that point to the chunk below the edge', () => {
    expect(detailPointRange(grid, chunk(10, 12), { startCm: 10.5, endCm: 12 })).toEqual({
      first: 1,
      end: 5,
    })
    expect(detailPointRange(grid, chunk(12, 14), { startCm: 10.5, endCm: 12 })).toEqual({
      first: 0,
      end: 0,
    })
  })

  it('when the window runs on past the chunk, keeps the chunk end for the next chunk', () => {
    expect(detailPointRange(grid, chunk(10, 12), { startCm: 11, endCm: 20 })).toEqual({
      first: 2,
      end: 4,
    })
  })

  it('when no window is set or it misses the chunk, returns an empty range', () => {
    expect(detailPointRange(grid, chunk(10, 12), null)).toEqual({ first: 0, end: 0 })
    expect(detailPointRange(grid, chunk(10, 12), { startCm: 13, endCm: 14 })).toEqual({
      first: 0,
      end: 0,
    })
  })
})

describe('detail window settings', () => {
  it('when the window leaves the run range or is too wide, throws naming detailWindow', () => {
    expect(() =>
      resolveComputeSettings({ ...base, detailWindow: { startCm: 650, endCm: 665 } }),
    ).toThrow(/detailWindow/)
    expect(() =>
      resolveComputeSettings({
        startCm: 10,
        endCm: 3000,
        detailWindow: { startCm: 100, endCm: 300 },
      }),
    ).toThrow(/detailWindow: must be at most 100/)
    expect(() =>
      resolveComputeSettings({ ...base, detailWindow: { startCm: 670, endCm: 670 } }),
    ).toThrow(/detailWindow/)
  })
})
