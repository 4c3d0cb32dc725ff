import { describe, expect, it } from 'vitest'
import type { AtmosphereLevel } from '../../../shared/physics/types'
import {
  LEVEL_LIMITS,
  checkLevels,
  levelRelativeHumidity,
} from '../../../shared/profiles/level-checks'

/** A plausible four-level column (invented numbers): 1000, 850, 500, 200 hPa. */
function goodLevels(): AtmosphereLevel[] {
  return [
    { pressurePa: 100000, temperatureK: 288, heightM: 100, vmr: { H2O: 0.01, O3: 3e-8 } },
    { pressurePa: 85000, temperatureK: 280, heightM: 1500, vmr: { H2O: 0.006, O3: 4e-8 } },
    { pressurePa: 50000, temperatureK: 255, heightM: 5600, vmr: { H2O: 0.001, O3: 6e-8 } },
    { pressurePa: 20000, temperatureK: 218, heightM: 11800, vmr: { H2O: 2e-5, O3: 3e-7 } },
  ]
}

// Computed by hand from Murphy & Koop 2005, QJRMS 131, 1539: e_w(20 °C) = 23.394 hPa,
// e_w(−20 °C) = 1.2550 hPa, e_i(−20 °C) = 1.0325 hPa.
const E_WATER_20C_PA = 2339.4
const E_WATER_MINUS20C_PA = 125.5
const E_ICE_MINUS20C_PA = 103.25

describe('checkLevels', () => {
  it('when the levels are physically sound, returns no errors and no warnings', () => {
    expect(checkLevels(goodLevels())).toEqual({ errors: [], warnings: [] })
  })

  it('when a pressure is not lower than the level below, returns an error naming both levels', () => {
    const levels = goodLevels()
    levels[2].pressurePa = 86000
    const { errors } = checkLevels(levels)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({
      levelIndex: 2,
      field: 'pressurePa',
      value: 86000,
      code: 'PRESSURE_NOT_DECREASING',
      expected: 'a pressure lower than 850 hPa',
    })
    expect(errors[0].message).toBe(
      'Level 3: pressure 860 hPa is not lower than the level below (Level 2, 850 hPa); ' +
        'pressure must decrease upward, surface first.',
    )
  })

  it('when two levels have the same pressure, returns a duplicate-level error', () => {
    const levels = goodLevels()
    levels[1].pressurePa = 100000
    const { errors } = checkLevels(levels)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({ levelIndex: 1, field: 'pressurePa', code: 'DUPLICATE_LEVEL' })
    expect(errors[0].message).toMatch(
      /^Level 2: pressure 1000 hPa repeats the level below \(Level 1\)/,
    )
  })

  it('when a pressure is zero or negative, returns an error for that level only', () => {
    const levels = goodLevels()
    levels[0].pressurePa = -100
    const { errors } = checkLevels(levels)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({
      levelIndex: 0,
      field: 'pressurePa',
      code: 'PRESSURE_NOT_POSITIVE',
    })
    expect(errors[0].message).toContain('Level 1: pressure -1 hPa is not positive')
  })

  it('when a temperature is below 150 K or above 350 K, returns an error; 150 and 350 K pass', () => {
    // limits of LEVEL_LIMITS (common practice: outside every observed air temperature).
    const levels = goodLevels()
    levels[0].temperatureK = 351
    levels[3].temperatureK = 149
    const { errors } = checkLevels(levels)
    expect(errors.map((e) => [e.levelIndex, e.field, e.code])).toEqual([
      [0, 'temperatureK', 'TEMPERATURE_OUT_OF_RANGE'],
      [3, 'temperatureK', 'TEMPERATURE_OUT_OF_RANGE'],
    ])
    expect(errors[1].message).toBe(
      'Level 4: temperature 149 K is outside 150 K to 350 K; check the unit (°C or K) and the value.',
    )
    levels[0].temperatureK = LEVEL_LIMITS.maxTemperatureK
    levels[3].temperatureK = LEVEL_LIMITS.minTemperatureK
    levels[3].vmr.H2O = 1e-10 // e_w(150 K) ≈ 1.6e-5 Pa (Murphy & Koop eq. 10): 20 ppmv would be supersaturated
    expect(checkLevels(levels).errors).toEqual([])
  })

  it('when relative humidity is 105 %, returns a warning stating it is over liquid water', () => {
    const levels = goodLevels()
    levels[0].temperatureK = 293.15
    levels[0].vmr.H2O = (1.05 * E_WATER_20C_PA) / 100000
    const { errors, warnings } = checkLevels(levels)
    expect(errors).toEqual([])
    expect(warnings).toHaveLength(1)
    expect(warnings[0]).toMatchObject({ levelIndex: 0, field: 'vmr.H2O', code: 'SUPERSATURATION' })
    expect(warnings[0].message).toBe(
      'Level 1: relative humidity 105 % (with respect to liquid water) is above 100 % ' +
        '(supersaturated); accepted, but check it.',
    )
  })

  it('when relative humidity is 112 %, returns an error', () => {
    const levels = goodLevels()
    levels[0].temperatureK = 293.15
    levels[0].vmr.H2O = (1.12 * E_WATER_20C_PA) / 100000
    const { errors, warnings } = checkLevels(levels)
    expect(warnings).toEqual([])
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({ levelIndex: 0, field: 'vmr.H2O', code: 'SUPERSATURATED' })
    expect(errors[0].message).toContain('relative humidity 112 % (with respect to liquid water)')
  })

  it('when 95 % over water at −20 °C is checked over ice, returns an error of 115.5 % over ice', () => {
    // RH_ice = 0.95 × e_w/e_i = 0.95 × 1.2550/1.0325 = 1.1547 (Murphy & Koop values
    // above).
    const levels = goodLevels()
    levels[2].temperatureK = 253.15
    levels[2].vmr.H2O = (0.95 * E_WATER_MINUS20C_PA) / 50000
    expect(checkLevels(levels)).toEqual({ errors: [], warnings: [] })
    const { errors } = checkLevels(levels, { saturationPhase: 'ice-below-freezing' })
    expect(errors).toHaveLength(1)
    expect(errors[0].message).toContain(
      'relative humidity 115.5 % (with respect to ice (below 0 °C))',
    )
  })

  it('when water vapour or ozone is negative, returns an error naming the gas', () => {
    const levels = goodLevels()
    levels[1].vmr.H2O = -0.001
    levels[3].vmr.O3 = -1e-7
    const { errors } = checkLevels(levels)
    expect(errors.map((e) => [e.levelIndex, e.field, e.code])).toEqual([
      [1, 'vmr.H2O', 'NEGATIVE_AMOUNT'],
      [3, 'vmr.O3', 'NEGATIVE_AMOUNT'],
    ])
    expect(errors[0].message).toBe(
      'Level 2: water vapour -1000 ppmv is negative; expected 0 or more.',
    )
    expect(errors[1].message).toBe('Level 4: ozone -0.1 ppmv is negative; expected 0 or more.')
  })

  it('when a height is not above the level below, returns an error', () => {
    const levels = goodLevels()
    levels[2].heightM = 1500
    const { errors } = checkLevels(levels)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({
      levelIndex: 2,
      field: 'heightM',
      code: 'HEIGHT_NOT_INCREASING',
    })
  })

  it('when a value is NaN, returns a not-a-number error', () => {
    const levels = goodLevels()
    levels[1].temperatureK = Number.NaN
    const { errors } = checkLevels(levels)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({ levelIndex: 1, field: 'temperatureK', code: 'NOT_A_NUMBER' })
  })

  it('when there are fewer than 3 levels, returns a whole-profile error', () => {
    const { errors } = checkLevels(goodLevels().slice(0, 2))
    expect(errors).toEqual([
      {
        levelIndex: null,
        field: 'levels',
        value: 2,
        code: 'TOO_FEW_LEVELS',
        expected: 'at least 3 levels',
        message: 'The profile has 2 levels; at least 3 are needed.',
      },
    ])
  })

  it('when there are more than 500 levels, returns a whole-profile error', () => {
    const levels: AtmosphereLevel[] = []
    for (let i = 0; i < 501; i++) {
      levels.push({
        pressurePa: 100000 * Math.exp(-i * 0.01),
        temperatureK: 250,
        heightM: 70 * i,
        vmr: {},
      })
    }
    const { errors } = checkLevels(levels)
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({ levelIndex: null, code: 'TOO_MANY_LEVELS', value: 501 })
    expect(checkLevels(levels.slice(0, 500)).errors).toEqual([])
  })

  it('when display units and level names are given, writes messages with them', () => {
    const levels = goodLevels()
    levels[2].pressurePa = 86000
    const { errors } = checkLevels(levels, {
      displayUnits: { pressure: 'Pa' },
      describeLevel: (i) => `Row ${i + 10}`,
    })
    expect(errors[0].message).toContain(
      'Row 12: pressure 86000 Pa is not lower than the level below (Row 11, 85000 Pa)',
    )
  })
})

describe('levelRelativeHumidity', () => {
  it('when x p equals e_w(20 °C) = 23.394 hPa, returns RH = 1 over water', () => {
    // Murphy & Koop 2005 value, computed by hand (5 digits: 2e-5 relative).
    const rh = levelRelativeHumidity(E_WATER_20C_PA / 100000, 293.15, 100000)
    expect(rh?.over).toBe('water')
    expect(Math.abs((rh?.relativeHumidity ?? 0) - 1)).toBeLessThan(3e-5)
  })

  it('when x p equals e_i(−20 °C) = 1.0325 hPa over ice, returns RH = 1 over ice', () => {
    // Murphy & Koop 2005 ice value, computed by hand (5 digits: 5e-5 relative).
    const rh = levelRelativeHumidity(E_ICE_MINUS20C_PA / 50000, 253.15, 50000, 'ice-below-freezing')
    expect(rh?.over).toBe('ice')
    expect(Math.abs((rh?.relativeHumidity ?? 0) - 1)).toBeLessThan(6e-5)
  })

  it('when the temperature is outside the saturation formula range or x < 0, returns null', () => {
    expect(levelRelativeHumidity(0.01, 340, 100000)).toBeNull()
    expect(levelRelativeHumidity(-0.01, 280, 100000)).toBeNull()
  })
})
