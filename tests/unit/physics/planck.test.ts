/*
 * Reference values marked "mpmath" were computed for this test with mpmath 1.2.1 (Debian
 * python3-mpmath) at 40 significant digits by this snippet:
 *
 *   from mpmath import mp, mpf, expm1, quad, diff, inf
 *   mp.dps = 40
 *   h, c, k = mpf('6.62607015e-34'), mpf(299792458), mpf('1.380649e-23')
 *   c1, c2 = 2*h*c**2*10**8, h*c*100/k                  # W m-2 sr-1 cm4, cm K
 *   B = lambda nu, T: c1*nu**3/expm1(c2*nu/T)
 *   print(B(mpf(667), 288), diff(lambda t: B(mpf(667), t), 288))
 *   print(quad(lambda nu: B(nu, 288), [500, 850]))       # band integrals, [a, 1e4, inf] for ∞
 */
import { describe, expect, it } from 'vitest'
import {
  WIEN_X_WAVENUMBER,
  brightnessTemperatureK,
  planckBandIntegral,
  planckRadianceDerivativeWrtTemperature,
  planckRadianceOnGrid,
  planckRadianceWavenumber,
  wienPeakWavenumberCm,
} from '../../../shared/physics/planck'
import {
  C1L_W_PER_M2_SR_CM4,
  C2_CM_K,
  STEFAN_BOLTZMANN_W_PER_M2_K4,
} from '../../../shared/physics/constants'
import { PhysicsError } from '../../../shared/physics/errors'

/** Asserts |actual/expected − 1| ≤ tol and prints the relative error on failure. */
function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

/** Composite 16-point Gauss–Legendre (independent of the code under test) on [a, b]. */
function compositeQuadrature(
  f: (x: number) => number,
  a: number,
  b: number,
  panels: number,
): number {
  // Nodes/weights of 4-point Gauss–Legendre on [−1, 1] (numpy 1.24 leggauss(4)).
  const nodes = [-0.8611363115940526, -0.33998104358485626, 0.33998104358485626, 0.8611363115940526]
  const weights = [0.3478548451374537, 0.6521451548625462, 0.6521451548625462, 0.3478548451374537]
  const h = (b - a) / panels
  let sum = 0
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h
    for (let i = 0; i < 4; i++) sum += weights[i] * f(mid + 0.5 * h * nodes[i])
  }
  return 0.5 * h * sum
}

describe('planckRadianceWavenumber', () => {
  // Planck function computed with the CODATA 2018 constants (Tiesinga et al. 2021, Rev. Mod. Phys.
  // 93, 025010), 6 significant digits; the 17-digit values were computed with mpmath 1.2.1 (dps =
  // 40) for this test.
  const table: Array<[number, number, number]> = [
    [667, 288, 0.13090551247934209], // §1: 0.130 906
    [667, 220, 0.045649725744757078], // §1: 0.045 650
    [1000, 288, 0.081142455249473803], // §1: 0.081 142
    [500, 250, 0.08877383903531136], // §1: 0.088 774
    [2349, 296, 0.0016977243865302066], // §1: 1.697 7e-3
    [1e-3, 300, 2.4834429888613502e-12], // mpmath: deep Rayleigh–Jeans side (x ≈ 4.8e-6)
    [50000, 200, 9.112190624226024e-151], // mpmath: deep Wien side (x ≈ 360)
  ]

  it('when given the check wavenumbers and temperatures, returns the mpmath values to 1e-13', () => {
    for (const [nu, t, expected] of table)
      expectRelClose(planckRadianceWavenumber(nu, t), expected, 1e-13, `B(${nu}, ${t})`)
  })

  it('when given B(667 cm⁻¹, 288 K), returns 0.130 906 to 6 digits', () => {
    expect(planckRadianceWavenumber(667, 288)).toBeCloseTo(0.130906, 6) // computed (CODATA 2018)
    expect(Math.PI * planckRadianceWavenumber(667, 288)).toBeCloseTo(0.41125, 5) // πB, computed
  })

  it('when x = c₂ν̃/T is huge, returns 0 without NaN', () => {
    // exp overflow guard: x ≈ 1.4e5 (analytic limit B → 0).
    expect(planckRadianceWavenumber(1e5, 1)).toBe(0)
  })

  it('when the wavenumber is 0, returns 0', () => {
    expect(planckRadianceWavenumber(0, 288)).toBe(0) // analytic: B ∝ ν̃² as ν̃ → 0
  })

  it('when x → 0, returns the Rayleigh–Jeans limit c₁L ν̃² T/c₂ to 1e-9', () => {
    // analytic limit (Goody & Yung 1989 §1.1): B ≈ c₁L ν̃² T/c₂ (1 − x/2); x = 4.8e-9 here.
    const nu = 1e-6
    const t = 300
    const rj = (C1L_W_PER_M2_SR_CM4 * nu * nu * t) / C2_CM_K
    expectRelClose(planckRadianceWavenumber(nu, t), rj, 1e-8)
  })

  it('when the temperature is not positive or the wavenumber negative, throws PhysicsError', () => {
    expect(() => planckRadianceWavenumber(667, 0)).toThrow(PhysicsError)
    expect(() => planckRadianceWavenumber(667, -5)).toThrow(PhysicsError)
    expect(() => planckRadianceWavenumber(667, Number.NaN)).toThrow(PhysicsError)
    expect(() => planckRadianceWavenumber(-1, 288)).toThrow(PhysicsError)
  })
})

describe('planckRadianceOnGrid', () => {
  it('when given a grid, writes the same values as the scalar function into out', () => {
    const grid = Float64Array.from([0, 100, 667, 1000, 2349])
    const out = new Float64Array(grid.length)
    const returned = planckRadianceOnGrid(grid, 260, out)
    expect(returned).toBe(out)
    for (let i = 0; i < grid.length; i++)
      expect(out[i]).toBe(planckRadianceWavenumber(grid[i], 260))
  })

  it('when out has a different length or the grid holds NaN, throws PhysicsError', () => {
    expect(() => planckRadianceOnGrid(new Float64Array(3), 260, new Float64Array(2))).toThrow(
      PhysicsError,
    )
    expect(() =>
      planckRadianceOnGrid(Float64Array.from([1, Number.NaN]), 260, new Float64Array(2)),
    ).toThrow(PhysicsError)
  })
})

describe('planckRadianceDerivativeWrtTemperature', () => {
  it('when compared with mpmath numerical differentiation, agrees to 1e-12', () => {
    // mpmath 1.2.1 mp.diff of the Planck function at dps = 40 (computed for this test).
    const table: Array<[number, number, number]> = [
      [667, 288, 0.0015706778139961677],
      [667, 220, 0.0009168231954276462],
      [2349, 296, 6.5488494620424896e-5],
      [1e-3, 300, 8.2781631468889733e-15],
      [50000, 200, 1.6388011466930675e-150],
    ]
    for (const [nu, t, expected] of table)
      expectRelClose(
        planckRadianceDerivativeWrtTemperature(nu, t),
        expected,
        1e-12,
        `dB/dT(${nu}, ${t})`,
      )
  })

  it('when compared with a central difference of B, agrees to 1e-7', () => {
    // numerical check (common practice): (B(T+h) − B(T−h))/(2h), truncation error O(h²).
    for (const [nu, t] of [
      [10, 200],
      [667, 250],
      [1500, 300],
      [2500, 180],
    ]) {
      const h = 1e-3
      const fd =
        (planckRadianceWavenumber(nu, t + h) - planckRadianceWavenumber(nu, t - h)) / (2 * h)
      expectRelClose(planckRadianceDerivativeWrtTemperature(nu, t), fd, 1e-7, `ν=${nu} T=${t}`)
    }
  })

  it('when x is huge, returns 0 rather than NaN', () => {
    expect(planckRadianceDerivativeWrtTemperature(1e5, 1)).toBe(0) // analytic limit
  })
})

describe('brightnessTemperatureK', () => {
  it('when given B(ν̃, T), returns T to 1e-13 across 12 decades of x', () => {
    for (const nu of [1e-4, 0.1, 10, 667, 2349, 20000]) {
      for (const t of [150, 220, 288, 330, 6000]) {
        expectRelClose(
          brightnessTemperatureK(nu, planckRadianceWavenumber(nu, t)),
          t,
          1e-13,
          `ν=${nu} T=${t}`,
        )
      }
    }
  })

  it('when the radiance is tiny (x ≈ 700), still inverts without overflow', () => {
    const nu = 20000
    const t = 41 // x ≈ 702
    const radiance = planckRadianceWavenumber(nu, t)
    expect(radiance).toBeGreaterThan(0)
    expectRelClose(brightnessTemperatureK(nu, radiance), t, 1e-12)
  })

  it('when the radiance is not positive or the wavenumber is 0, throws PhysicsError', () => {
    expect(() => brightnessTemperatureK(667, 0)).toThrow(PhysicsError)
    expect(() => brightnessTemperatureK(667, -1)).toThrow(PhysicsError)
    expect(() => brightnessTemperatureK(0, 0.1)).toThrow(PhysicsError)
  })
})

describe('wienPeakWavenumberCm', () => {
  it('when T = 1 K, returns 1.960 998 55 cm⁻¹', () => {
    // x_ν/c₂ = 1.960 998 55 cm⁻¹ K⁻¹, computed with CODATA 2018 c₂; x_ν = 2.821 439 372 is the
    // root of x = 3(1 − e^{−x}).
    expectRelClose(wienPeakWavenumberCm(1), 1.96099855, 5e-9)
    expectRelClose(WIEN_X_WAVENUMBER, 2.821439372, 1e-9)
  })

  it('when multiplied by k/h, reproduces the CODATA 2018 Wien frequency constant', () => {
    // CODATA 2018 b′ = 5.878 925 757e10 Hz K⁻¹ (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010);
    // ν = c ν̃.
    expectRelClose(wienPeakWavenumberCm(1) * 29979245800, 5.878925757e10, 1e-9)
  })

  it('when evaluated at T, is a stationary point of B', () => {
    // analytic property: dB/dν̃ = 0 at the peak; check B is lower on both sides.
    const t = 288
    const peak = wienPeakWavenumberCm(t)
    expectRelClose(peak, 1.96099855 * 288, 5e-9) // computed, as above
    const b0 = planckRadianceWavenumber(peak, t)
    expect(planckRadianceWavenumber(peak * (1 + 1e-4), t)).toBeLessThan(b0)
    expect(planckRadianceWavenumber(peak * (1 - 1e-4), t)).toBeLessThan(b0)
    // and x satisfies 3(1 − e⁻ˣ) = x (its defining equation)
    expect(3 * -Math.expm1(-WIEN_X_WAVENUMBER)).toBeCloseTo(WIEN_X_WAVENUMBER, 14)
  })
})

describe('planckBandIntegral', () => {
  it('when integrated over [0, ∞), returns σT⁴/π with the CODATA σ to 1e-9', () => {
    // CODATA 2018 σ = 5.670 374 419e-8 W m⁻² K⁻⁴ (10 significant digits → tolerance 1e-9).
    for (const t of [150, 255, 288, 300, 5772]) {
      const expected = (STEFAN_BOLTZMANN_W_PER_M2_K4 * t ** 4) / Math.PI
      expectRelClose(planckBandIntegral(0, Infinity, t), expected, 1e-9, `T=${t}`)
    }
    // σ·288⁴ = 390.11 W m⁻², σ·255⁴ = 239.76 W m⁻² (computed with the CODATA 2018 σ)
    expect(Math.PI * planckBandIntegral(0, Infinity, 288)).toBeCloseTo(390.11, 2)
    expect(Math.PI * planckBandIntegral(0, Infinity, 255)).toBeCloseTo(239.76, 2)
  })

  it('when compared with mpmath quadrature, agrees to 1e-12 (both branches, narrow and wide bands)', () => {
    // mpmath 1.2.1 quad of B at dps = 40 (computed for this test).
    const table: Array<[number, number, number, number]> = [
      [0, 10, 288, 0.00077991479127755332], // small-x branch only
      [10, 250, 288, 7.5517949585022643], // small x → series
      [500, 850, 288, 44.357827464035856], // CO2 15 µm region, series branch
      [667, 668, 220, 0.04560117351931821], // narrow: Gauss–Legendre branch
      [2000, 2500, 296, 1.3601425962677847],
      [0, 2000, 250, 70.287867345160587],
      [1500, Infinity, 300, 9.7559062517654658],
      [3000, 3000.01, 288, 9.9631968113924072e-7], // very narrow
      [0.5, 1.5, 300, 2.6829662038515742e-6], // microwave, x ≪ 1
    ]
    for (const [a, b, t, expected] of table)
      expectRelClose(planckBandIntegral(a, b, t), expected, 1e-12, `[${a}, ${b}] at ${t} K`)
  })

  it('when compared with composite Gauss quadrature of B, agrees to 1e-11 on random-like bands', () => {
    // independent numerical quadrature (common practice) with 400 panels.
    const bands: Array<[number, number, number]> = [
      [20, 3000, 288],
      [550, 800, 210],
      [100, 101.7, 190],
      [1, 400, 340],
      [800, 1250, 300],
    ]
    for (const [a, b, t] of bands) {
      const q = compositeQuadrature((nu) => planckRadianceWavenumber(nu, t), a, b, 400)
      expectRelClose(planckBandIntegral(a, b, t), q, 1e-11, `[${a}, ${b}] at ${t} K`)
    }
  })

  it('when bands are adjacent, their integrals add up to the integral of the union', () => {
    // additivity invariant, across the narrow/wide and small-x/series switches.
    const t = 250
    const edges = [0, 0.01, 50, 173.7, 174, 500, 2000, 2000.5, 6000]
    let sum = 0
    for (let i = 0; i + 1 < edges.length; i++) sum += planckBandIntegral(edges[i], edges[i + 1], t)
    expectRelClose(sum, planckBandIntegral(0, 6000, t), 1e-13)
  })

  it('when the band is empty, returns 0', () => {
    expect(planckBandIntegral(667, 667, 288)).toBe(0) // analytic
  })

  it('when ν̃₂ < ν̃₁ or T ≤ 0, throws PhysicsError', () => {
    expect(() => planckBandIntegral(700, 600, 288)).toThrow(PhysicsError)
    expect(() => planckBandIntegral(600, 700, 0)).toThrow(PhysicsError)
    expect(() => planckBandIntegral(-1, 700, 288)).toThrow(PhysicsError)
  })
})
