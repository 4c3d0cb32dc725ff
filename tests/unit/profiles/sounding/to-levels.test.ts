import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { checkLevels } from '../../../../shared/profiles/level-checks'
import { guessColumnMapping } from '../../../../shared/profiles/sounding/columns'
import { parseSoundingText } from '../../../../shared/profiles/sounding/parse'
import {
  soundingToLevels,
  type SoundingToLevelsOptions,
} from '../../../../shared/profiles/sounding/to-levels'

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/soundings/${name}`, import.meta.url), 'utf8')

/** Parse, accept the guessed mapping and units, convert. */
function convert(text: string, options: SoundingToLevelsOptions = {}) {
  const parsed = parseSoundingText(text)
  const guess = guessColumnMapping(parsed.header, parsed.rows, parsed)
  return { parsed, guess, ...soundingToLevels(parsed, guess.mapping, guess.units, options) }
}

function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

// Saturation vapour pressure over water, computed by hand from Murphy & Koop 2005, QJRMS 131, 1539
// (5 significant digits, so ≤ 4e-5 relative): 0 °C 6.1121 hPa, 20 °C 23.394 hPa, −20 °C 1.2550 hPa.
const E_W_0C_PA = 611.21
const E_W_20C_PA = 2339.4
const E_W_MINUS20C_PA = 125.5
const E_TOL = 4e-5

describe('soundingToLevels — good files', () => {
  it('when converting the comma CSV (hPa, °C, dew point), returns SI levels with the file heights', () => {
    const { levels, errors, report } = convert(fixture('comma-degc-hpa-dewpoint.csv'))
    expect(errors).toEqual([])
    expect(levels.map((l) => l.pressurePa)).toEqual([
      100000, 92500, 85000, 70000, 50000, 30000, 20000, 10000,
    ])
    // T/K = t/°C + 273.15 (SI Brochure, exact).
    const expectedK = [24.0, 19.6, 15.2, 5.4, -11.0, -38.5, -55.0, -62.0].map((c) => c + 273.15)
    levels.forEach((l, i) => expect(l.temperatureK).toBeCloseTo(expectedK[i], 10))
    expect(levels.map((l) => l.heightM)).toEqual([112, 790, 1510, 3130, 5820, 9570, 12150, 16500])
    // x = e_w(T_d)/p with T_d = 20, 0 and −20 °C on lines 4, 7 and 8.
    expectRelClose(levels[0].vmr.H2O!, E_W_20C_PA / 100000, E_TOL, '1000 hPa')
    expectRelClose(levels[2].vmr.H2O!, E_W_0C_PA / 85000, E_TOL, '850 hPa')
    expectRelClose(levels[3].vmr.H2O!, E_W_MINUS20C_PA / 70000, E_TOL, '700 hPa')
    expect(levels[0].vmr.O3).toBeUndefined()
    expect(report).toMatchObject({
      dropped: [],
      repaired: [],
      heightsFilled: false,
      order: 'surface-first',
      humiditySource: 'dewPoint',
      ozoneFromClimatology: false,
      levelLineNumbers: [4, 5, 7, 8, 9, 11, 12, 13],
    })
    expect(report.warnings.map((w) => w.code)).toEqual(['NO_OZONE'])
  })

  it('when converting the whitespace text (Pa, K, RH %), returns x = RH e_w(T)/p', () => {
    const { levels, errors, report } = convert(fixture('whitespace-k-pa-rh.txt'))
    expect(errors).toEqual([])
    expect(levels).toHaveLength(6)
    expect(levels[0]).toMatchObject({ pressurePa: 101300, temperatureK: 293.15, heightM: 10 })
    // RH over liquid water (WMO-No. 8 convention): 80 % at 20 °C, 40 % at 0 °C, 30 % at −20 °C.
    expectRelClose(levels[0].vmr.H2O!, (0.8 * E_W_20C_PA) / 101300, E_TOL, '1013 hPa')
    expectRelClose(levels[3].vmr.H2O!, (0.4 * E_W_0C_PA) / 70000, E_TOL, '700 hPa')
    expectRelClose(levels[4].vmr.H2O!, (0.3 * E_W_MINUS20C_PA) / 50000, E_TOL, '500 hPa')
    expect(report.humiditySource).toBe('relativeHumidity')
    expect(report.levelLineNumbers).toEqual([6, 7, 8, 9, 10, 11])
  })

  it('when converting the semicolon file (g/kg, no heights), fills heights hydrostatically', () => {
    const { levels, errors, report } = convert(fixture('semicolon-gkg-no-heights.csv'))
    expect(errors).toEqual([])
    expect(report.heightsFilled).toBe(true)
    // x = r/(ε + r), ε = M_w/M_d = 0.6219801 (definitions, Wallace & Hobbs 2006 ch. 3); by hand
    // for 8.00 g/kg: 0.008/0.6299801 = 0.01269881.
    expectRelClose(levels[0].vmr.H2O!, 0.01269881, 1e-6, 'x at 1000 hPa')
    // Hand values of the hypsometric equation Z₂ − Z₁ = (R_d/g₀) T̄_v ln(p₁/p₂) (Wallace & Hobbs
    // 2006 eq. 3.29, from memory), T̄_v the mean of the level virtual temperatures
    // T_v = T/[1 − x(1 − ε)], R_d = R/M_d = 287.05800 J kg⁻¹ K⁻¹, g₀ = 9.80665 m s⁻²; computed by
    // hand (Python arithmetic, 9 digits) from the file's values.
    const handHeightsM = [0, 883.148328, 1848.49453, 2916.30567, 4114.18892, 5484.859]
    levels.forEach((l, i) => {
      if (i === 0) expect(l.heightM).toBe(0)
      else expectRelClose(l.heightM, handHeightsM[i], 1e-8, `z at ${l.pressurePa} Pa`)
    })
  })

  it('when a dry isothermal sounding is converted, returns heights (R_d T/g₀) ln(p₀/p) above the surface height', () => {
    // Isothermal hypsometric equation (Wallace & Hobbs 2006 eq. 3.29, from memory): with
    // T = 250 K, R_d = 287.05800, g₀ = 9.80665: 1000 → 500 hPa 5072.41108 m, → 250 hPa
    // 10144.8222 m, → 100 hPa 16850.1849 m (hand values).
    const text = 'PRES,TEMP\n1000,250\n500,250\n250,250\n100,250\n'
    const { levels, errors, report } = convert(text, { surfaceHeightM: 120 })
    expect(errors).toEqual([])
    const hand = [0, 5072.41108, 10144.8222, 16850.1849]
    levels.forEach((l, i) => expect(Math.abs(l.heightM - 120 - hand[i])).toBeLessThan(1e-3))
    expect(report.warnings.map((w) => w.code)).toEqual(['NO_HUMIDITY', 'NO_OZONE'])
    expect(levels[0].vmr).toEqual({})
  })

  it('when the file lists levels from the top down, reverses it as a whole', () => {
    const down = convert('PRES,TEMP,DWPT\n1000,15,10\n850,6,1\n700,-2,-8\n500,-18,-28\n')
    const up = convert('PRES,TEMP,DWPT\n500,-18,-28\n700,-2,-8\n850,6,1\n1000,15,10\n')
    expect(up.errors).toEqual([])
    expect(up.report.order).toBe('top-first')
    expect(up.levels).toEqual(down.levels)
    expect(up.report.levelLineNumbers).toEqual([5, 4, 3, 2])
  })

  it('when every level is converted, the result passes checkLevels', () => {
    for (const name of [
      'comma-degc-hpa-dewpoint.csv',
      'whitespace-k-pa-rh.txt',
      'semicolon-gkg-no-heights.csv',
    ]) {
      const { levels } = convert(fixture(name), {
        extendAbove: { climatology: 'mid-latitude-summer' },
      })
      expect(checkLevels(levels).errors, name).toEqual([])
    }
  })
})

describe('soundingToLevels — rejected files (line and field named, no levels)', () => {
  it('when there is no pressure column, returns MISSING_COLUMN for pressure at the header line', () => {
    const { levels, errors } = convert(
      '# no pressure\nTEMP,DWPT,HGHT\n15,10,0\n6,1,1500\n-2,-8,3000\n',
    )
    expect(levels).toEqual([])
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({
      code: 'MISSING_COLUMN',
      lineNumber: 2,
      field: 'pressure',
      column: null,
    })
    expect(errors[0].message).toMatch(/^No pressure column: the header \(line 2\) has none/)
  })

  it('when there is no temperature column, returns MISSING_COLUMN for temperature', () => {
    const { levels, errors } = convert('PRES,DWPT\n1000,10\n850,1\n700,-8\n')
    expect(levels).toEqual([])
    expect(errors.map((e) => [e.code, e.lineNumber, e.field])).toEqual([
      ['MISSING_COLUMN', 1, 'temperature'],
    ])
  })

  it('when cells are not numbers, returns one error per cell naming line and column', () => {
    const text = 'PRES,TEMP,DWPT\n1000,15,10\n850,abc,1\n700,-2,-8\n500,-18,x7\n'
    const { levels, errors, errorCount } = convert(text)
    expect(levels).toEqual([])
    expect(errorCount).toBe(2)
    expect(errors.map((e) => [e.code, e.lineNumber, e.column, e.field, e.value])).toEqual([
      ['NOT_A_NUMBER', 3, 'TEMP', 'temperature', 'abc'],
      ['NOT_A_NUMBER', 5, 'DWPT', 'dewPoint', 'x7'],
    ])
    expect(errors[0].message).toBe(
      "Line 3, column 'TEMP': 'abc' is not a number; expected a number (temperature in °C) or a " +
        "missing-value marker such as '', NA, //// or -9999.",
    )
  })

  it('when pressure increases upward, returns PRESSURE_NOT_DECREASING naming the row and the row below', () => {
    const text = 'PRES,TEMP\n1000,15\n850,6\n900,3\n700,-2\n500,-18\n'
    const { levels, errors } = convert(text)
    expect(levels).toEqual([])
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({
      code: 'PRESSURE_NOT_DECREASING',
      lineNumber: 4,
      column: 'PRES',
      field: 'pressure',
      value: '900',
    })
    expect(errors[0].message).toMatch(
      /^Line 4, column 'PRES': pressure 900 hPa is not lower than the level below \(line 3, 850 hPa\)/,
    )
  })

  it('when a pressure is negative, returns PRESSURE_NOT_POSITIVE for that row', () => {
    const { levels, errors } = convert('PRES,TEMP\n1000,15\n-850,6\n700,-2\n500,-18\n')
    expect(levels).toEqual([])
    expect(errors.map((e) => [e.code, e.lineNumber, e.field])).toEqual([
      ['PRESSURE_NOT_POSITIVE', 3, 'pressure'],
    ])
  })

  it('when a temperature is below 150 K or above 350 K, returns TEMPERATURE_OUT_OF_RANGE per row', () => {
    const kelvin = convert('PRES,TEMP_K\n1000,288\n850,140\n700,270\n')
    expect(kelvin.errors.map((e) => [e.code, e.lineNumber, e.column, e.field])).toEqual([
      ['TEMPERATURE_OUT_OF_RANGE', 3, 'TEMP_K', 'temperature'],
    ])
    const celsius = convert('PRES,TEMP_C\n1000,80\n850,6\n700,-2\n')
    expect(celsius.errors[0]).toMatchObject({
      code: 'TEMPERATURE_OUT_OF_RANGE',
      lineNumber: 2,
      value: '80',
    })
    expect(celsius.errors[0].message).toContain('temperature 80 °C (353.15 K) is impossible')
    expect(celsius.levels).toEqual([])
  })

  it('when relative humidity is above 110 %, returns HUMIDITY_TOO_HIGH for that row', () => {
    const { levels, errors } = convert('PRES,TEMP,RELH\n1000,15,80\n850,6,115\n700,-2,60\n')
    expect(levels).toEqual([])
    expect(errors.map((e) => [e.code, e.lineNumber, e.column, e.field])).toEqual([
      ['HUMIDITY_TOO_HIGH', 3, 'RELH', 'relativeHumidity'],
    ])
  })

  it('when the dew point is far above the temperature, returns HUMIDITY_TOO_HIGH with the implied RH', () => {
    // T = 20 °C, T_d = 25 °C: RH = e_w(25 °C)/e_w(20 °C) ≈ 31.7/23.39 ≈ 1.36 (Murphy & Koop 2005).
    const { errors } = convert('PRES,TEMP,DWPT\n1000,20,25\n850,6,1\n700,-2,-8\n')
    expect(errors).toHaveLength(1)
    expect(errors[0]).toMatchObject({
      code: 'HUMIDITY_TOO_HIGH',
      lineNumber: 2,
      column: 'DWPT',
      field: 'dewPoint',
    })
    expect(errors[0].message).toMatch(
      /relative humidity of 13[5-7](\.\d)? % \(with respect to liquid water\)/,
    )
  })

  it('when humidity or ozone is negative, or ozone is in ppbv labelled ppmv, names each row', () => {
    const text =
      'PRES,TEMP,MIXR (g/kg),O3 (ppmv)\n1000,15,8,0.03\n850,6,-1,0.04\n700,-2,3,-0.01\n500,-18,1,8000\n'
    const { errors } = convert(text)
    expect(errors.map((e) => [e.code, e.lineNumber, e.field])).toEqual([
      ['NEGATIVE_HUMIDITY', 3, 'mixingRatio'],
      ['NEGATIVE_OZONE', 4, 'ozone'],
      ['OZONE_TOO_HIGH', 5, 'ozone'],
    ])
  })

  it('when two rows repeat a pressure with different values, returns DUPLICATE_PRESSURE', () => {
    const { levels, errors } = convert('PRES,TEMP\n1000,15\n850,6\n850,7\n700,-2\n')
    expect(levels).toEqual([])
    expect(errors[0]).toMatchObject({
      code: 'DUPLICATE_PRESSURE',
      lineNumber: 4,
      field: 'pressure',
    })
    expect(errors[0].message).toContain('pressure 850 hPa repeats line 3 with different values')
  })

  it('when a row exactly repeats the one before, drops and reports it and keeps the rest', () => {
    const { levels, errors, report } = convert('PRES,TEMP\n1000,15\n850,6\n850.0,6.0\n700,-2\n')
    expect(errors).toEqual([])
    expect(levels.map((l) => l.pressurePa)).toEqual([100000, 85000, 70000])
    expect(report.dropped).toEqual([{ lineNumber: 4, reason: 'exact duplicate of line 3' }])
  })

  it('when too few levels remain after dropping rows with missing values, returns TOO_FEW_LEVELS', () => {
    const { levels, errors, report } = convert('PRES,TEMP\n1000,15\n850,////\n700,NA\n500,-18\n')
    expect(levels).toEqual([])
    expect(report.dropped.map((d) => d.lineNumber)).toEqual([3, 4])
    expect(errors).toEqual([
      expect.objectContaining({ code: 'TOO_FEW_LEVELS', lineNumber: null, field: 'levels' }),
    ])
    expect(errors[0].message).toBe(
      'Only 2 levels remain after dropping 2 rows (lines 3, 4); at least 3 levels are needed.',
    )
  })

  it('when the mapping is broken, returns INVALID_MAPPING and MISSING_UNIT before reading rows', () => {
    const parsed = parseSoundingText('PRES,TEMP,DWPT\n1000,15,10\n850,6,1\n700,-2,-8\n')
    const result = soundingToLevels(
      parsed,
      { pressure: 0, temperature: 0, dewPoint: 7 },
      { pressure: 'hPa' },
    )
    expect(result.levels).toEqual([])
    expect(result.errors.map((e) => [e.code, e.field])).toEqual([
      ['INVALID_MAPPING', 'temperature'],
      ['INVALID_MAPPING', 'dewPoint'],
      ['MISSING_UNIT', 'temperature'],
    ])
  })

  it('when 60 rows have errors, returns the first 50 and counts all 60', () => {
    let text = 'PRES,TEMP\n1000,15\n'
    for (let i = 0; i < 60; i++) text += `${990 - i},bad\n`
    const { errors, errorCount, levels } = convert(text)
    expect(levels).toEqual([])
    expect(errors).toHaveLength(50)
    expect(errorCount).toBe(60)
  })
})

describe('soundingToLevels — missing values, filling, thinning, extension', () => {
  it('when cells hold missing-value markers, drops those rows and says why', () => {
    const text = 'PRES,TEMP,DWPT\n1000,15,10\n925,-9999,5\n850,6,1\n700,-2,////\n500,-18,-28\n'
    const { levels, errors, report } = convert(text)
    expect(errors).toEqual([])
    expect(levels.map((l) => l.pressurePa)).toEqual([100000, 85000, 50000])
    expect(report.dropped).toEqual([
      { lineNumber: 3, reason: "missing temperature (column 'TEMP': '-9999')" },
      { lineNumber: 5, reason: "missing dew point (column 'DWPT': '////')" },
    ])
  })

  it('when filling missing humidity, interpolates ln x linearly in ln p and reports the repair', () => {
    const text = 'PRES,TEMP,H2O (ppmv)\n1000,15,10000\n700,-2,NA\n490,-18,1000\n'
    const { levels, errors, report } = convert(text, { fillMissingHumidity: true })
    expect(errors).toEqual([])
    // ln p: f = ln(1000/700)/ln(1000/490) = 0.5002; x = 10000^(1−f) × 1000^f ppmv (hand formula).
    const f = Math.log(1000 / 700) / Math.log(1000 / 490)
    expectRelClose(levels[1].vmr.H2O!, 1e-6 * 10000 ** (1 - f) * 1000 ** f, 1e-12, 'filled x')
    expect(report.repaired).toEqual([
      expect.objectContaining({ lineNumber: 3, field: 'waterVmr', from: 'NA' }),
    ])
  })

  it('when some heights are missing, fills them hydrostatically from the nearest given height', () => {
    const text = 'PRES,HGHT,TEMP\n1000,100,250\n500,,250\n250,10245,250\n'
    const { levels, report } = convert(text)
    // isothermal 250 K: Δz(1000 → 500 hPa) = 5072.41 m (hand value, see above).
    expect(Math.abs(levels[1].heightM - (100 + 5072.41108))).toBeLessThan(1e-3)
    expect(report.heightsFilled).toBe(true)
    expect(report.repaired[0]).toMatchObject({ lineNumber: 3, field: 'height', from: '' })
  })

  it('when the sounding has more than 500 levels, returns an error unless thinning is chosen', () => {
    const lines = ['PRES,TEMP']
    for (let i = 0; i < 800; i++)
      lines.push(`${(1000 * Math.exp(-i * 0.005)).toFixed(3)},${(15 - i * 0.05).toFixed(2)}`)
    const text = lines.join('\n')
    const plain = convert(text)
    expect(plain.levels).toEqual([])
    expect(plain.errors[0]).toMatchObject({
      code: 'TOO_MANY_LEVELS',
      field: 'levels',
      value: '800',
    })
    const thinned = convert(text, { thinToMaxLevels: true })
    expect(thinned.errors).toEqual([])
    // rows are 0.005 apart in ln p and the thinning step is ln(p₀/p_top)/(500 − 2) =
    // 3.995/498 ≈ 0.0080, so every second row is kept, plus the top row: 1 + 399 + 1 = 401.
    expect(thinned.levels).toHaveLength(401)
    expect(thinned.report.thinnedFrom).toBe(800)
    expect(thinned.levels[0].pressurePa).toBe(100000)
    expect(thinned.report.levelLineNumbers.at(-1)).toBe(801)
  })

  it('when extending above the top, continues the sounding without a step and marks the added levels', () => {
    const { levels, errors, report } = convert(fixture('comma-degc-hpa-dewpoint.csv'), {
      extendAbove: { climatology: 'tropical', levelSpacingLnP: 0.05 },
    })
    expect(errors).toEqual([])
    const join = 7 // 100 hPa, the last sounding level
    expect(report.extendedAbove).toEqual({
      fromPressurePa: 10000,
      topPressurePa: 10,
      climatology: 'tropical',
      addedLevels: levels.length - 8,
    })
    expect(levels.at(-1)!.pressurePa).toBe(10)
    expect(report.levelLineNumbers[join]).toBe(13)
    expect(report.levelLineNumbers[join + 1]).toBeNull()
    // the tropical climatology is ≈ 18 K colder than the sounding at 100 hPa; the blended step
    // over 0.05 scale heights stays below 1 K (see climatology-extension tests for convergence).
    expect(Math.abs(levels[join + 1].temperatureK - levels[join].temperatureK)).toBeLessThan(1)
    expect(report.ozoneFromClimatology).toBe(true)
    for (const level of levels) expect(level.vmr.O3).toBeGreaterThan(0)
  })
})
