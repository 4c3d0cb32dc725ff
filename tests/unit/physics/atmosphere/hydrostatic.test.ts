import { describe, expect, it } from 'vitest'
import {
  DRY_AIR_GAS_CONSTANT_J_PER_KG_K,
  geopotentialFromHeight,
  gravityMPerS2,
  heightFromGeopotential,
  hydrostaticPressuresPa,
  hypsometricHeightsM,
  normalGravityMPerS2,
  virtualTemperatureK,
} from '../../../../shared/physics/atmosphere/hydrostatic'
import { usStandardAtmosphere1976AtGeopotential } from '../../../../shared/physics/atmosphere/us-standard-1976'
import { EPSILON_WATER_DRY_AIR } from '../../../../shared/physics/atmosphere/humidity'
import { STANDARD_GRAVITY_M_PER_S2 } from '../../../../shared/physics/constants'
import { PhysicsError } from '../../../../shared/physics/errors'

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

const g0 = STANDARD_GRAVITY_M_PER_S2
const Rd = DRY_AIR_GAS_CONSTANT_J_PER_KG_K

describe('gravity', () => {
  it('when at the equator and the pole, returns the WGS 84 normal gravity', () => {
    // WGS 84 (NIMA TR8350.2, from memory): γ_e = 9.780 325 335 9, γ_p = 9.832 184 937 8 m s⁻².
    expectRelClose(normalGravityMPerS2(0), 9.7803253359, 1e-12)
    expectRelClose(normalGravityMPerS2(90), 9.8321849378, 1e-10)
    expectRelClose(normalGravityMPerS2(-90), 9.8321849378, 1e-10)
  })

  it('when near 45.5° latitude, is close to the conventional g₀ = 9.806 65', () => {
    // g₀ corresponds to ~45.5° latitude at sea level (U.S. Standard Atmosphere 1976, from memory).
    expectRelClose(normalGravityMPerS2(45.5), g0, 5e-5)
  })

  it('when at 10 km, falls by the inverse-square factor and Φ/z inverts exactly', () => {
    const model = { latitudeDeg: 30 }
    const r = 6371008.8
    expectRelClose(
      gravityMPerS2(model, 10000),
      normalGravityMPerS2(30) * (r / (r + 10000)) ** 2,
      1e-15,
    )
    expect(gravityMPerS2('standard', 10000)).toBe(g0)
    for (const z of [0, 500, 20000, 80000]) {
      expect(
        Math.abs(heightFromGeopotential(model, geopotentialFromHeight(model, z)) - z),
      ).toBeLessThan(1e-8)
      expect(
        Math.abs(heightFromGeopotential('standard', geopotentialFromHeight('standard', z)) - z),
      ).toBeLessThan(1e-9)
    }
  })

  it('when the latitude is outside ±90°, throws PhysicsError', () => {
    expect(() => normalGravityMPerS2(91)).toThrow(PhysicsError)
  })
})

describe('virtualTemperatureK', () => {
  it('when dry, returns T', () => {
    expect(virtualTemperatureK(280, 0)).toBe(280)
  })

  it('when x = 0.02 at 300 K, agrees with the approximation T(1 + 0.608 q) to 1e-5', () => {
    // T_v ≈ T(1 + 0.608 q), the textbook first-order form (Wallace & Hobbs 2006 ch. 3, from
    // memory; 0.608 = 1/ε − 1).
    const x = 0.02
    const q = (EPSILON_WATER_DRY_AIR * x) / (1 - (1 - EPSILON_WATER_DRY_AIR) * x)
    expectRelClose(
      virtualTemperatureK(300, x),
      300 * (1 + (1 / EPSILON_WATER_DRY_AIR - 1) * q),
      1e-12,
    )
    expectRelClose(virtualTemperatureK(300, x), 300 * (1 + 0.608 * q), 1e-5)
  })

  it('when the vmr is ≥ 1 or T ≤ 0, throws PhysicsError', () => {
    expect(() => virtualTemperatureK(300, 1)).toThrow(PhysicsError)
    expect(() => virtualTemperatureK(0, 0.01)).toThrow(PhysicsError)
  })
})

describe('hypsometricHeightsM', () => {
  it('when the atmosphere is isothermal and dry, returns z = (R_d T/g₀) ln(p_s/p) exactly', () => {
    // analytic solution of the hypsometric equation for constant T (Holton 2004 ch. 1).
    const p = Float64Array.from([100000, 80000, 50000, 10000, 100])
    const t = new Float64Array(p.length).fill(250)
    const z = hypsometricHeightsM(p, t, undefined)
    for (let i = 0; i < p.length; i++) {
      expect(Math.abs(z[i] - ((Rd * 250) / g0) * Math.log(100000 / p[i]))).toBeLessThan(
        1e-9 * (1 + z[i]),
      )
    }
  })

  it('when given the U.S. 1976 troposphere, converges to its geopotential heights at second order', () => {
    // U.S. Standard Atmosphere 1976 (T linear in H); R_d here uses CODATA R, the standard
    // 8.314 32, so the limit differs by 1.7e-5 relative — compared through the refinement error.
    const levelsFor = (n: number) => {
      const heights = Array.from({ length: n }, (_, i) => (11000 * i) / (n - 1))
      const states = heights.map((h) => usStandardAtmosphere1976AtGeopotential(h))
      return { heights, p: states.map((s) => s.pressurePa), t: states.map((s) => s.temperatureK) }
    }
    const errors: number[] = []
    for (const n of [3, 5, 9]) {
      const { heights, p, t } = levelsFor(n)
      const z = hypsometricHeightsM(p, t, undefined)
      // scale by R*/R so that only the interpolation error remains (US76 R* = 8.31432).
      const scale = 8.31432 / 8.314462618
      errors.push(Math.abs(z[n - 1] * scale - heights[n - 1]))
    }
    expect(errors[0] / errors[1]).toBeGreaterThan(3.5) // second order: ratio → 4
    expect(errors[1] / errors[2]).toBeGreaterThan(3.5)
    // trapezoid-in-ln-p estimate for T = T₀e^{κs}, κ = R_dΓ/g₀ ≈ 0.19: relative error
    // (κΔs)²/12 ≈ 1.1e-4 with Δs ≈ 0.19 (8 layers), i.e. ≈ 1.2 m at 11 km.
    expect(errors[2]).toBeLessThan(1.5)
  })

  it('when moist, places levels higher than dry air by the virtual-temperature factor', () => {
    const p = [100000, 50000]
    const t = [280, 280]
    const dry = hypsometricHeightsM(p, t, undefined)
    const moist = hypsometricHeightsM(p, t, [0.01, 0.01])
    expectRelClose(moist[1] / dry[1], 1 / (1 - 0.01 * (1 - EPSILON_WATER_DRY_AIR)), 1e-14)
  })

  it('when latitude gravity is used, heights are geometric (above the geopotential height)', () => {
    const p = [101325, 1000]
    const t = [250, 250]
    const zStd = hypsometricHeightsM(p, t, undefined)
    const zLat = hypsometricHeightsM(p, t, undefined, 0, { gravity: { latitudeDeg: 45.5 } })
    // at ~35 km the 1/r² decrease of g lifts the geometric height by a factor ≈ 1 + z/R (analytic, to O((z/R)²) and γ(45.5°)/g₀ − 1 ≈ 5e-5).
    expect(zLat[1]).toBeGreaterThan(zStd[1])
    expectRelClose(zLat[1] / zStd[1], 1 + zStd[1] / 6371008.8, 2e-4)
  })

  it('when pressures do not decrease, throws PhysicsError NOT_MONOTONIC', () => {
    expect(() => hypsometricHeightsM([1000, 1000], [250, 250], undefined)).toThrow(PhysicsError)
    expect(() => hypsometricHeightsM([1000, 900], [250], undefined)).toThrow(PhysicsError)
  })
})

describe('hydrostaticPressuresPa', () => {
  it('when T is linear in height (standard gravity), reproduces the polytropic law to 1e-12', () => {
    // analytic: p = p₀ (T/T₀)^{g₀/(R_d Γ)} for T = T₀ − Γz (U.S. Standard Atmosphere 1976
    // eq. 33a with R_d); the log-mean integration is exact here.
    const gamma = 0.0065
    const z = [0, 1000, 3000, 7000, 11000]
    const t = z.map((h) => 288.15 - gamma * h)
    const p = hydrostaticPressuresPa(z, t, undefined, 101325)
    for (let i = 0; i < z.length; i++) {
      expectRelClose(p[i], 101325 * (t[i] / 288.15) ** (g0 / (Rd * gamma)), 1e-12, `z=${z[i]}`)
    }
  })

  it('when given the U.S. 1976 temperatures at geopotential heights, matches its pressures to 3e-5', () => {
    // U.S. Standard Atmosphere 1976 (NOAA/NASA/USAF); the residual is R*(1976) = 8.314 32 vs CODATA
    // 8.314 462 6 (1.7e-5 relative in the exponent, times ln(p₀/p) ≤ 1.5 below 11 km).
    const z = [0, 2000, 5000, 8000, 11000]
    const states = z.map((h) => usStandardAtmosphere1976AtGeopotential(h))
    const p = hydrostaticPressuresPa(
      z,
      states.map((s) => s.temperatureK),
      undefined,
      101325,
    )
    for (let i = 0; i < z.length; i++) expectRelClose(p[i], states[i].pressurePa, 3e-5, `H=${z[i]}`)
  })

  it('when T_v is constant, round-trips with hypsometricHeightsM to 1e-7 m', () => {
    const z = [0, 2500, 9000, 30000]
    const t = [230, 230, 230, 230]
    const w = [0.002, 0.002, 0.002, 0.002] // constant, so T_v is constant too
    const gravity = { latitudeDeg: 60 }
    const p = hydrostaticPressuresPa(z, t, w, 100000, { gravity })
    const back = hypsometricHeightsM(p, t, w, 0, { gravity })
    for (let i = 0; i < z.length; i++) expect(Math.abs(back[i] - z[i])).toBeLessThan(1e-7)
  })

  it('when heights do not increase or the surface pressure is invalid, throws PhysicsError', () => {
    expect(() => hydrostaticPressuresPa([0, 0], [250, 250], undefined, 1e5)).toThrow(PhysicsError)
    expect(() => hydrostaticPressuresPa([0, 10], [250, 250], undefined, 0)).toThrow(PhysicsError)
  })
})
