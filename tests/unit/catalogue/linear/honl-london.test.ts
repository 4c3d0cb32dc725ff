import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { honlLondonFactor } from '../../../../shared/catalogue/linear/honl-london'
import { expectRelativeClose } from '../../../support/expect-close'

describe('honlLondonFactor', () => {
  it('when summed over P, Q and R, returns 2J″+1 for every l″ and Δl (sum rule)', () => {
    for (let lowerL = 0; lowerL <= 3; lowerL++) {
      for (const deltaL of [-1, 0, 1]) {
        if (deltaL === -1 && lowerL === 0) continue
        for (let j = Math.max(lowerL, 1); j <= 80; j++) {
          const sum =
            honlLondonFactor(-1, j, lowerL, deltaL) +
            honlLondonFactor(0, j, lowerL, deltaL) +
            honlLondonFactor(1, j, lowerL, deltaL)
          // Sum rule of the Hönl–London factors (Herzberg 1945, Infrared and Raman Spectra, ch. IV;
          // from memory), exact algebra.
          expectRelativeClose(sum, 2 * j + 1, 1e-13, `l″=${lowerL} Δl=${deltaL} J=${j}`)
        }
      }
    }
  })

  it('when the lower level is Σ and Δl = +1, returns (J+2)/2, (2J+1)/2, (J−1)/2', () => {
    const j = 10
    // Reduced forms for l = 0 (Herzberg 1945, ch. IV; from memory).
    expect(honlLondonFactor(1, j, 0, 1)).toBeCloseTo((j + 2) / 2, 12)
    expect(honlLondonFactor(0, j, 0, 1)).toBeCloseTo((2 * j + 1) / 2, 12)
    expect(honlLondonFactor(-1, j, 0, 1)).toBeCloseTo((j - 1) / 2, 12)
  })

  it('when the band is Σ–Σ, returns J+1 (R), J (P) and 0 (Q)', () => {
    expect(honlLondonFactor(1, 7, 0, 0)).toBe(8)
    expect(honlLondonFactor(-1, 7, 0, 0)).toBe(7)
    expect(honlLondonFactor(0, 7, 0, 0)).toBe(0)
  })

  it('when the upper level would have J′ < l′, returns 0 (common practice: no such level)', () => {
    // Π→Δ (l″ = 1, Δl = +1): J′ ≥ 2 needed; P(1), P(2) and Q(1) end below J′ = 2.
    expect(honlLondonFactor(-1, 1, 1, 1)).toBe(0)
    expect(honlLondonFactor(-1, 2, 1, 1)).toBe(0)
    expect(honlLondonFactor(0, 1, 1, 1)).toBe(0)
    expect(honlLondonFactor(1, 1, 1, 1)).toBeGreaterThan(0)
  })

  it('when |Δl| > 1 or Δl = −1 from a Σ level, throws PhysicsError', () => {
    expect(() => honlLondonFactor(1, 3, 0, 2)).toThrow(PhysicsError)
    expect(() => honlLondonFactor(1, 3, 0, -1)).toThrow(PhysicsError)
    expect(() => honlLondonFactor(1, 0.5, 0, 1)).toThrow(PhysicsError)
  })
})
