import { describe, expect, it } from 'vitest'
import {
  GREEN_OZONE_MIDLATITUDE,
  greenOzoneColumnAboveMoleculesPerCm2,
  greenOzoneNumberDensityPerCm3,
  greenOzoneVmr,
} from '../../../../shared/physics/atmosphere/ozone'
import {
  BOLTZMANN_J_PER_K,
  DOBSON_UNIT_MOLECULES_PER_CM2,
} from '../../../../shared/physics/constants'
import { PhysicsError } from '../../../../shared/physics/errors'

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

describe('greenOzoneColumnAboveMoleculesPerCm2', () => {
  it('when a = 0.4 cm, b = 20 km, c = 5 km, returns the hand-computed column table', () => {
    // Green 1964 form as used by Lacis & Hansen 1974, J. Atmos. Sci. 31, 118 (from memory); u
    // computed by hand (cm STP):
    // 0 km 0.400, 10 km 0.359, 20 km 0.204, 30 km 0.049, 40 km 0.007. 1 cm STP = 1000 DU.
    const rows: Array<[number, number]> = [
      [0, 0.4],
      [10000, 0.359],
      [20000, 0.204],
      [30000, 0.049],
      [40000, 0.007],
    ]
    for (const [h, cmStp] of rows) {
      const u =
        greenOzoneColumnAboveMoleculesPerCm2(h, GREEN_OZONE_MIDLATITUDE) /
        DOBSON_UNIT_MOLECULES_PER_CM2 /
        1000
      expect(Math.abs(u - cmStp), `h=${h} u=${u}`).toBeLessThanOrEqual(0.0005)
    }
  })

  it('when at the ground, returns exactly the total column', () => {
    // u(0) = a by construction (analytic).
    const params = { totalColumnDu: 300, peakHeightM: 24000, widthM: 4000 }
    expectRelClose(
      greenOzoneColumnAboveMoleculesPerCm2(0, params),
      300 * DOBSON_UNIT_MOLECULES_PER_CM2,
      1e-15,
    )
  })

  it('when far above the peak, decays without overflow', () => {
    const u = greenOzoneColumnAboveMoleculesPerCm2(5e6, GREEN_OZONE_MIDLATITUDE)
    expect(u).toBeGreaterThanOrEqual(0)
    expect(u).toBeLessThan(1e-300)
  })
})

describe('greenOzoneNumberDensityPerCm3', () => {
  it('when integrated over height, returns the total column to 1e-9', () => {
    // analytic: ∫₀^∞ n dh = u(0) = a. Composite Simpson on 0–200 km with 20 m steps.
    const params = { totalColumnDu: 320, peakHeightM: 22000, widthM: 5000 }
    const step = 20
    let integral = 0
    for (let i = 0; i <= 10000; i++) {
      const w = i === 0 || i === 10000 ? 1 : i % 2 === 1 ? 4 : 2
      integral += w * greenOzoneNumberDensityPerCm3(i * step, params)
    }
    integral *= (step * 100) / 3
    expectRelClose(integral, 320 * DOBSON_UNIT_MOLECULES_PER_CM2, 1e-9)
  })

  it('when compared with a central difference of the column, equals −du/dh', () => {
    const h = 17000
    const d = 1
    const slope =
      (greenOzoneColumnAboveMoleculesPerCm2(h - d, GREEN_OZONE_MIDLATITUDE) -
        greenOzoneColumnAboveMoleculesPerCm2(h + d, GREEN_OZONE_MIDLATITUDE)) /
      (2 * d * 100)
    expectRelClose(greenOzoneNumberDensityPerCm3(h, GREEN_OZONE_MIDLATITUDE), slope, 1e-7)
  })

  it('when at the peak height, is maximal and equals a(1 + e^{−b/c})/(4c)', () => {
    const p = GREEN_OZONE_MIDLATITUDE
    const peak = greenOzoneNumberDensityPerCm3(p.peakHeightM, p)
    const a = p.totalColumnDu * DOBSON_UNIT_MOLECULES_PER_CM2
    expectRelClose(peak, (a * (1 + Math.exp(-4))) / (4 * 500000), 1e-14)
    expect(greenOzoneNumberDensityPerCm3(p.peakHeightM - 100, p)).toBeLessThan(peak)
    expect(greenOzoneNumberDensityPerCm3(p.peakHeightM + 100, p)).toBeLessThan(peak)
  })

  it('when parameters are out of range, throws PhysicsError', () => {
    expect(() =>
      greenOzoneNumberDensityPerCm3(0, { totalColumnDu: -1, peakHeightM: 2e4, widthM: 5e3 }),
    ).toThrow(PhysicsError)
    expect(() =>
      greenOzoneNumberDensityPerCm3(0, { totalColumnDu: 300, peakHeightM: 2e4, widthM: 0 }),
    ).toThrow(PhysicsError)
    expect(() => greenOzoneNumberDensityPerCm3(-5, GREEN_OZONE_MIDLATITUDE)).toThrow(PhysicsError)
  })
})

describe('greenOzoneVmr', () => {
  it('when divided by the ideal-gas air density, gives a few ppmv near the peak', () => {
    // ideal gas n = p/(kT); stratospheric ozone peaks at a few ppmv (common practice).
    const p = 5000
    const t = 220
    const x = greenOzoneVmr(20000, p, t, GREEN_OZONE_MIDLATITUDE)
    const n = greenOzoneNumberDensityPerCm3(20000, GREEN_OZONE_MIDLATITUDE)
    expectRelClose(x, n / ((p / (BOLTZMANN_J_PER_K * t)) * 1e-6), 1e-15)
    expect(x).toBeGreaterThan(1e-6)
    expect(x).toBeLessThan(1e-5)
  })
})
