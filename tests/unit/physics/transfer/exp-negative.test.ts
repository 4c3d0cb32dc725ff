import { describe, expect, it } from 'vitest'
import { expNegative } from '../../../../shared/physics/transfer/exp-negative'

/** Deterministic pseudo-random numbers in [0, 1) (Park & Miller 1988 minimal standard). */
function lehmer(seed: number): () => number {
  let state = seed
  return () => {
    state = (state * 16807) % 2147483647
    return (state - 1) / 2147483646
  }
}

describe('expNegative', () => {
  it('when t is drawn over [0, 2] and [0, 708], returns e^{−t} within 5e-16 relative of Math.exp', () => {
    // Reference: ECMAScript Math.exp (V8's port of fdlibm e_exp.c, error < 1 ulp; general-purpose
    // library). 2·10⁵ arguments; the bound is 2.25 ulp (measured maximum 4.4e-16).
    const random = lehmer(12345)
    let worst = 0
    for (let i = 0; i < 200_000; i++) {
      const t = i % 2 === 0 ? 2 * random() : 708 * random()
      const relative = Math.abs(expNegative(t) / Math.exp(-t) - 1)
      if (relative > worst) worst = relative
    }
    expect(worst, `max relative error ${worst}`).toBeLessThanOrEqual(5e-16)
  })

  it('when t is 0, ln 2 or an integer multiple of ln2/64, returns exactly 1 and powers of two to 1 ulp', () => {
    // Exact values: e⁰ = 1, e^{−ln 2} = 1/2, e^{−64·ln2} = 2⁻⁶⁴ (definition of ln 2).
    expect(expNegative(0)).toBe(1)
    expect(Math.abs(expNegative(Math.LN2) / 0.5 - 1)).toBeLessThanOrEqual(2.3e-16)
    expect(Math.abs(expNegative(64 * Math.LN2) / 2 ** -64 - 1)).toBeLessThanOrEqual(2e-15)
  })

  it('when t is beyond the table range, returns Math.exp(−t) (subnormal) and 0 past underflow', () => {
    // e^{−720} ≈ 2.9e-313 is subnormal; e^{−800} underflows to 0 (IEEE 754 binary64 range).
    expect(expNegative(720)).toBe(Math.exp(-720))
    expect(expNegative(800)).toBe(0)
    expect(expNegative(Infinity)).toBe(0)
  })

  it('when t is negative or NaN, returns NaN', () => {
    expect(Number.isNaN(expNegative(-1e-300))).toBe(true)
    expect(Number.isNaN(expNegative(NaN))).toBe(true)
  })
})
