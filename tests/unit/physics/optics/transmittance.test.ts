import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  beerLambertTransmittance,
  columnOpticalDepth,
  layerAbsorptance,
  layerTransmittance,
  opticalDepthFromTop,
} from '../../../../shared/physics/optics/transmittance'
import { expectRelativeClose } from '../../../support/expect-close'

describe('beerLambertTransmittance', () => {
  it('when τ = ln 2 vertically or τ = ln 2 / 2 at μ = 1/2, returns 1/2', () => {
    // Analytic: exp(−ln 2) = 1/2 (Beer–Lambert, Goody & Yung 1989 §1.2, from memory).
    expectRelativeClose(beerLambertTransmittance(Math.LN2), 0.5, 1e-15)
    expectRelativeClose(beerLambertTransmittance(Math.LN2 / 2, 0.5), 0.5, 1e-15)
  })

  it('when a layer is split in two, returns the product of the two transmittances', () => {
    // Beer–Lambert: transmittances of successive layers multiply (Goody & Yung 1989 §1.2, from memory).
    const whole = beerLambertTransmittance(2.5, 0.6)
    const split = beerLambertTransmittance(1.1, 0.6) * beerLambertTransmittance(1.4, 0.6)
    expectRelativeClose(whole, split, 1e-14)
  })

  it('when τ is negative or μ is outside (0, 1], throws OUT_OF_RANGE', () => {
    expect(() => beerLambertTransmittance(-1e-3)).toThrow(PhysicsError)
    expect(() => beerLambertTransmittance(1, 0)).toThrow(/mu/)
    expect(() => beerLambertTransmittance(1, 1.5)).toThrow(/mu/)
    expect(() => beerLambertTransmittance(Number.NaN)).toThrow(PhysicsError)
  })
})

describe('layerTransmittance and layerAbsorptance', () => {
  it('when given an array, returns exp(−τ/μ) and 1 − exp(−τ/μ) per point', () => {
    // Analytic: τ = 0 → T = 1; τ = ln 4 at μ = 1 → T = 1/4 (Beer–Lambert).
    const tau = new Float64Array([0, Math.log(4), 2 * Math.log(4)])
    const t = new Float64Array(3)
    const a = new Float64Array(3)
    layerTransmittance(tau, 1, t)
    layerAbsorptance(tau, 1, a)
    expect(t[0]).toBe(1)
    expectRelativeClose(t[1], 0.25, 1e-15)
    expectRelativeClose(t[2], 0.0625, 1e-15)
    expect(a[0]).toBe(0)
    expectRelativeClose(a[1], 0.75, 1e-15)
    expectRelativeClose(a[2], 0.9375, 1e-15)
  })

  it('when τ/μ is 1e-12, returns the absorptance to full precision (no cancellation)', () => {
    // Series: 1 − e^{−x} = x − x²/2 + …, so for x = 2e-12 it is 2e-12 (1 − 1e-12) (analytic).
    const a = new Float64Array(1)
    layerAbsorptance(new Float64Array([1e-12]), 0.5, a)
    expectRelativeClose(a[0], 2e-12 * (1 - 1e-12), 1e-15)
  })

  it('when τ is negative or NaN, or lengths differ, throws', () => {
    const out = new Float64Array(2)
    expect(() => layerTransmittance(new Float64Array([1, -1]), 1, out)).toThrow(/point 1/)
    expect(() => layerAbsorptance(new Float64Array([Number.NaN, 1]), 1, out)).toThrow(/point 0/)
    expect(() => layerTransmittance(new Float64Array(3), 1, out)).toThrow(/length/)
  })
})

describe('columnOpticalDepth', () => {
  it('when given layers, returns their sum per point, also for a sub-range of layers', () => {
    // Definition: the column optical depth is the sum of layer optical depths (Beer–Lambert).
    const layers = [
      new Float64Array([1, 2]),
      new Float64Array([0.5, 0.25]),
      new Float64Array([4, 8]),
    ]
    const out = new Float64Array(2)
    columnOpticalDepth(layers, out)
    expect(Array.from(out)).toEqual([5.5, 10.25])
    columnOpticalDepth(layers, out, 1, 3)
    expect(Array.from(out)).toEqual([4.5, 8.25])
    columnOpticalDepth(layers, out, 2, 2)
    expect(Array.from(out)).toEqual([0, 0])
  })

  it('when the layer range is invalid, throws INVALID_ARGUMENT', () => {
    const layers = [new Float64Array(2)]
    expect(() => columnOpticalDepth(layers, new Float64Array(2), 0, 2)).toThrow(PhysicsError)
    expect(() => columnOpticalDepth(layers, new Float64Array(2), 1, 0)).toThrow(PhysicsError)
    expect(() => columnOpticalDepth(layers, new Float64Array(3))).toThrow(/length/)
  })
})

describe('opticalDepthFromTop', () => {
  it('when given three layers, returns 0 at the top and the column sum at the surface', () => {
    // Definition: τ(level k) = Σ_{j ≥ k} τ_j, measured from the top (Goody & Yung 1989 §1.2, from memory).
    const layers = [new Float64Array([1]), new Float64Array([2]), new Float64Array([4])]
    const levels = [0, 1, 2, 3].map(() => new Float64Array(1))
    opticalDepthFromTop(layers, levels)
    expect(levels.map((level) => level[0])).toEqual([7, 6, 4, 0])
  })

  it('when the number of level arrays is not layers + 1, throws INVALID_ARGUMENT', () => {
    expect(() => opticalDepthFromTop([new Float64Array(1)], [new Float64Array(1)])).toThrow(
      /one output array per level/,
    )
  })
})
