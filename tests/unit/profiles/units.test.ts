import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../shared/physics/errors'
import {
  LEVEL_UNITS,
  dewPointFromMixingRatioK,
  fromSi,
  humidityFromWaterVmr,
  mixingRatioFromDewPoint,
  toSi,
  unitSymbol,
  waterVmrFromHumidity,
  type LevelQuantity,
} from '../../../shared/profiles/units'

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

/** |actual − expected| ≤ half a unit of the last printed digit. */
function expectToPrintedDigits(actual: number, expected: number, halfUnit: number, label: string) {
  const diff = Math.abs(actual - expected)
  expect(
    diff,
    `${label}: actual=${actual} expected=${expected} tol=${halfUnit}`,
  ).toBeLessThanOrEqual(halfUnit * (1 + 1e-9))
}

describe('LEVEL_UNITS', () => {
  it('when listing every quantity, offers its default unit among its units with a symbol and label', () => {
    for (const quantity of Object.keys(LEVEL_UNITS) as LevelQuantity[]) {
      const definition = LEVEL_UNITS[quantity]
      expect(definition.units.map((u) => u.id)).toContain(definition.defaultUnit)
      for (const unit of definition.units) {
        expect(unit.symbol.length, `${quantity}.${unit.id}`).toBeGreaterThan(0)
        expect(unit.label.length, `${quantity}.${unit.id}`).toBeGreaterThan(0)
      }
    }
  })

  it('when asked for the symbols of the level-table units, returns hPa, °C, g/kg, ppbv and %', () => {
    expect(unitSymbol('pressure', 'hPa')).toBe('hPa')
    expect(unitSymbol('temperature', 'degC')).toBe('°C')
    expect(unitSymbol('mixingRatio', 'gPerKg')).toBe('g/kg')
    expect(unitSymbol('ozone', 'ppbv')).toBe('ppbv')
    expect(unitSymbol('relativeHumidity', 'percent')).toBe('%')
  })
})

describe('toSi / fromSi', () => {
  it('when converting the SI-prefixed and Celsius units, applies the exact definitions', () => {
    // SI Brochure, 9th ed. (BIPM 2019): hecto = 10², kilo = 10³, T/K = t/°C + 273.15 (exact).
    expect(toSi('pressure', 850, 'hPa')).toBe(85000)
    expect(toSi('pressure', 101.325, 'kPa')).toBeCloseTo(101325, 9)
    expect(toSi('pressure', 500, 'Pa')).toBe(500)
    expect(toSi('temperature', 0, 'degC')).toBe(273.15)
    expect(toSi('temperature', -40, 'degC')).toBeCloseTo(233.15, 12)
    expect(toSi('dewPoint', 10, 'degC')).toBeCloseTo(283.15, 12)
    expect(toSi('height', 1.5, 'km')).toBe(1500)
  })

  it('when converting amounts, uses g/kg = 1e-3 kg/kg, ppmv = 1e-6 and ppbv = 1e-9 mol/mol', () => {
    // common practice for mass and mole fractions.
    expect(toSi('mixingRatio', 7.73, 'gPerKg')).toBeCloseTo(7.73e-3, 15)
    expect(toSi('ozone', 8, 'ppmv')).toBeCloseTo(8e-6, 18)
    expect(toSi('ozone', 40, 'ppbv')).toBeCloseTo(4e-8, 20)
    expect(toSi('waterVmr', 4.5, 'ppmv')).toBeCloseTo(4.5e-6, 18)
    expect(toSi('relativeHumidity', 85, 'percent')).toBeCloseTo(0.85, 15)
  })

  it('when converting to SI and back, returns the value to 1e-12 relative', () => {
    const cases: Array<[LevelQuantity, number, string]> = [
      ['pressure', 912.3, 'hPa'],
      ['temperature', -56.5, 'degC'],
      ['height', 11.02, 'km'],
      ['ozone', 33.3, 'ppbv'],
      ['specificHumidity', 12.1, 'gPerKg'],
    ]
    for (const [quantity, value, unit] of cases) {
      // @ts-expect-error — the unit is checked at run time for this generic loop
      const back = fromSi(quantity, toSi(quantity, value, unit), unit)
      expectRelClose(back, value, 1e-12, `${quantity} ${unit}`)
    }
  })

  it('when given an unknown unit or a non-finite value, throws PhysicsError naming the choices', () => {
    // @ts-expect-error — deliberately wrong unit
    expect(() => toSi('pressure', 1000, 'mmHg')).toThrow(/expected one of hPa, Pa, kPa/)
    expect(() => toSi('pressure', Number.NaN, 'hPa')).toThrow(PhysicsError)
    expect(() => fromSi('temperature', Number.POSITIVE_INFINITY, 'K')).toThrow(PhysicsError)
  })
})

describe('mixingRatioFromDewPoint / dewPointFromMixingRatioK', () => {
  it('when T_d = 10 °C and p = 1000 hPa with Bolton e_s, returns r = 7.73 g/kg', () => {
    // Worked value (computed by hand with Bolton 1980, Mon. Wea. Rev. 108, 1046, e_s and ε =
    // 0.622): e = 12.272 hPa, r = 7.73 g/kg. Here ε = M_w/M_d = 0.62198; the difference is 3e-5
    // relative.
    expectToPrintedDigits(
      mixingRatioFromDewPoint(283.15, 100000, 'bolton') * 1000,
      7.73,
      0.005,
      'r',
    )
  })

  it('when T_d = 20 °C and p = 1013.25 hPa with Bolton e_s, returns r = 14.68 g/kg', () => {
    // Worked value (computed by hand with Bolton 1980 e_s): r = 14.68 g/kg.
    expectToPrintedDigits(
      mixingRatioFromDewPoint(293.15, 101325, 'bolton') * 1000,
      14.68,
      0.005,
      'r',
    )
  })

  it('when T_d = 20 °C and p = 1013.25 hPa with Murphy–Koop e_s, returns r = 14.70 g/kg', () => {
    // Murphy & Koop 2005, QJRMS 131, 1539: e_w(20 °C) = 23.394 hPa (computed by hand); by hand
    // r = 0.62198 × 23.394/(1013.25 − 23.394) = 14.6997 g/kg (Wallace & Hobbs 2006 ch. 3 formula).
    expectToPrintedDigits(mixingRatioFromDewPoint(293.15, 101325) * 1000, 14.6997, 0.0005, 'r')
  })

  it('when given r = 7.73 g/kg at 1000 hPa with Bolton, returns a dew point of 10.00 °C', () => {
    // inverse of the Bolton worked value above; 7.73 is rounded from 7.7276, which moves
    // T_d by ≈ 0.004 K (de/dT ≈ 0.82 hPa/K at 10 °C), so 0.01 K is allowed.
    expectToPrintedDigits(
      dewPointFromMixingRatioK(7.73e-3, 100000, 'bolton') - 273.15,
      10,
      0.01,
      'T_d',
    )
  })

  it('when the mixing ratio is 0, throws PhysicsError (a dry level has no dew point)', () => {
    expect(() => dewPointFromMixingRatioK(0, 100000)).toThrow(PhysicsError)
  })
})

describe('waterVmrFromHumidity / humidityFromWaterVmr', () => {
  it('when given 80 % RH at 20 °C and 1013 hPa, returns 0.8 × 23.394 hPa / p', () => {
    // Murphy & Koop 2005, QJRMS 131, 1539: e_w(20 °C) = 23.394 hPa (computed by hand; 5 digits:
    // 2e-5 relative); x = RH e_s/p (WMO-No. 8 definition of RH; Dalton's law).
    const vmr = waterVmrFromHumidity('relativeHumidity', 0.8, 293.15, 101300)
    expectRelClose(vmr, (0.8 * 2339.4) / 101300, 3e-5, 'x')
  })

  it('when given a dew point of 0 °C at 850 hPa, returns 6.1121 hPa / 850 hPa', () => {
    // Murphy & Koop 2005, QJRMS 131, 1539: e_w(0 °C) = 6.1121 hPa (computed by hand).
    expectRelClose(waterVmrFromHumidity('dewPoint', 273.15, 273.15, 85000), 6.1121 / 850, 1e-5)
  })

  it('when given a mixing ratio, returns x = r/(ε + r) with ε = M_w/M_d', () => {
    // definition (Wallace & Hobbs 2006, ch. 3); hand value with ε = 18.01528/28.9644 = 0.6219801:
    // 0.008/(0.6219801 + 0.008) = 0.01269881.
    expectRelClose(waterVmrFromHumidity('mixingRatio', 0.008, 288.15, 100000), 0.01269881, 1e-6)
  })

  it('when converting a vmr to each humidity quantity and back, returns the vmr to 1e-9', () => {
    const vmr = 0.006
    for (const quantity of [
      'relativeHumidity',
      'dewPoint',
      'mixingRatio',
      'specificHumidity',
      'waterVmr',
    ] as const) {
      const value = humidityFromWaterVmr(quantity, vmr, 290, 90000)
      expectRelClose(waterVmrFromHumidity(quantity, value, 290, 90000), vmr, 1e-9, quantity)
    }
  })

  it('when the humidity is negative or too large for the pressure, throws PhysicsError', () => {
    expect(() => waterVmrFromHumidity('mixingRatio', -0.001, 290, 90000)).toThrow(PhysicsError)
    expect(() => waterVmrFromHumidity('relativeHumidity', 2, 290, 90000)).toThrow(PhysicsError)
    // dew point 330 K (≈ 57 °C) at 100 hPa: e_w ≈ 172 hPa exceeds the total pressure.
    expect(() => waterVmrFromHumidity('dewPoint', 330, 335, 10000)).toThrow(PhysicsError)
  })
})
