import { describe, expect, it } from 'vitest'
import type { AtmosphereLevel } from '@shared/physics/types'
import {
  cellValue,
  DEFAULT_TABLE_UNITS,
  formatCell,
  insertLevelAbove,
  issuesByCell,
  levelAboveTop,
  levelBetween,
  parseCell,
  sortedByPressure,
  withCell,
  withHydrostaticHeights,
  type TableUnits,
} from '@/components/profiles/level-table'
import { presetRequestFromQuery, presetRequestToQuery } from '@/components/profiles/preset-query'

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b)
const level = (
  pressurePa: number,
  temperatureK: number,
  heightM: number,
  vmr: AtmosphereLevel['vmr'] = {},
): AtmosphereLevel => ({ pressurePa, temperatureK, heightM, vmr })
const units = (u: Partial<TableUnits>): TableUnits => ({ ...DEFAULT_TABLE_UNITS, ...u })

describe('cells of the level table', () => {
  it('when shown in other units, converts from SI without touching the level', () => {
    const l = level(85000, 273.15, 1457, { H2O: 0.006, O3: 4e-8 })
    const before = structuredClone(l)
    // 1 hPa = 100 Pa; t/°C = T/K − 273.15 (SI Brochure, 9th ed.); 1 ppbv = 1e-9 mol/mol (common practice)
    expect(cellValue(l, 'pressure', units({ pressure: 'hPa' }))).toBe(850)
    expect(cellValue(l, 'pressure', units({ pressure: 'Pa' }))).toBe(85000)
    expect(cellValue(l, 'temperature', units({ temperature: 'degC' }))).toBe(0)
    expect(rel(cellValue(l, 'ozone', units({ ozone: 'ppbv' }))!, 40)).toBeLessThan(1e-12)
    expect(rel(cellValue(l, 'humidity', units({ humidity: 'waterVmr' }))!, 6000)).toBeLessThan(
      1e-12,
    )
    expect(l).toEqual(before)
  })

  it('when a humidity is typed as RH, dew point or g/kg, shows the same number back (round trip to 1e-9)', () => {
    const l = level(85000, 283.15, 1457, { H2O: 0.004 })
    for (const humidity of ['relativeHumidity', 'dewPoint', 'mixingRatio', 'waterVmr'] as const) {
      for (const temperature of ['K', 'degC'] as const) {
        const u = units({ humidity, temperature })
        const shown = cellValue(l, 'humidity', u)!
        const edited = withCell(l, 'humidity', shown, u)
        expect(rel(edited.vmr.H2O!, 0.004), `${humidity} ${temperature}`).toBeLessThan(1e-9)
      }
    }
  })

  it('when a humidity cannot be converted, throws a sentence and keeps the level', () => {
    const l = level(85000, 283.15, 1457, { H2O: 0.004 })
    expect(() => withCell(l, 'humidity', 400, units({ humidity: 'relativeHumidity' }))).toThrow(
      /Cannot use this humidity/,
    )
    expect(() =>
      withCell(level(NaN, NaN, 0), 'humidity', 50, units({ humidity: 'relativeHumidity' })),
    ).toThrow(/pressure and temperature/)
  })

  it('when a cell is cleared, stores NaN for a required number and removes a gas', () => {
    const l = level(85000, 283.15, 1457, { H2O: 0.004, O3: 5e-8 })
    expect(withCell(l, 'pressure', null, DEFAULT_TABLE_UNITS).pressurePa).toBeNaN()
    expect(withCell(l, 'ozone', null, DEFAULT_TABLE_UNITS).vmr).toEqual({ H2O: 0.004 })
  })

  it('when text is typed, reads decimal commas and the minus sign, and rejects words', () => {
    expect(parseCell(' 12,5 ')).toBe(12.5)
    expect(parseCell('\u221256.5')).toBe(-56.5)
    expect(parseCell('')).toBeNull()
    expect(parseCell('warm')).toBe('invalid')
    expect(formatCell(868.65932)).toBe('868.659')
    expect(formatCell(2e-9)).toBe('2e-9')
    expect(formatCell(null)).toBe('')
  })
})

describe('adding, sorting and height helpers', () => {
  it('when a level is inserted between two, puts it halfway in ln p with geometric-mean gases', () => {
    const l = levelBetween(
      level(100000, 280, 0, { H2O: 0.01 }),
      level(50000, 250, 5500, { H2O: 0.001 }),
    )
    // √(100000·50000) = 70710.678… Pa; √(0.01·0.001) = 0.00316227766… (Python math.sqrt)
    expect(rel(l.pressurePa, 70710.67811865476)).toBeLessThan(1e-12)
    expect(l.temperatureK).toBe(265)
    expect(l.heightM).toBe(2750)
    expect(rel(l.vmr.H2O!, 0.0031622776601683794)).toBeLessThan(1e-12)
  })

  it('when a level is added above a dry 250 K top, places it one ln 2 of scale height higher', () => {
    // H = R_d T/g₀ = 287.058 × 250 / 9.80665 m (R = 8.314462618 CODATA 2018, M_d = 28.9644 g/mol,
    // U.S. Standard Atmosphere 1976); H ln 2 = 5072.411 m (computed with Python)
    const l = levelAboveTop(level(10000, 250, 16000, { O3: 1e-6 }))
    expect(l.pressurePa).toBe(5000)
    expect(rel(l.heightM - 16000, 5072.411082083665)).toBeLessThan(1e-9)
    expect(l.vmr).toEqual({ O3: 1e-6 })
  })

  it('when heights are computed for a dry isothermal column, gives z = H ln(p₀/p) (hypsometric equation)', () => {
    const out = withHydrostaticHeights([
      level(100000, 250, 0),
      level(50000, 250, NaN),
      level(25000, 250, NaN),
    ])
    // Analytic for T constant: z = (R_d T/g₀) ln(p₀/p); values as in the test above, rounded to 0.1 m by the helper
    expect(out.map((l) => l.heightM)).toEqual([0, 5072.4, 10144.8])
  })

  it('when pressures do not decrease, refuses to compute heights with a sentence', () => {
    expect(() => withHydrostaticHeights([level(100000, 250, 0), level(100000, 250, 1)])).toThrow(
      /decrease upward/,
    )
  })

  it('when sorted, orders levels surface first and puts blank pressures last', () => {
    const sorted = sortedByPressure([level(50000, 250, 5), level(NaN, 1, 1), level(100000, 280, 0)])
    expect(sorted.map((l) => l.pressurePa)).toEqual([100000, 50000, NaN])
  })

  it('when inserting above the last level, extends the top instead of interpolating', () => {
    const levels = insertLevelAbove([level(100000, 280, 0), level(50000, 250, 5500)], 1)
    expect(levels).toHaveLength(3)
    expect(levels[2].pressurePa).toBe(25000)
  })

  it('when issues are grouped, files them under their level and column', () => {
    const map = issuesByCell(
      [
        {
          levelIndex: 2,
          field: 'pressurePa',
          value: 1,
          code: 'PRESSURE_NOT_DECREASING',
          expected: '',
          message: 'e',
        },
      ],
      [
        {
          levelIndex: 1,
          field: 'vmr.H2O',
          value: 1,
          code: 'SUPERSATURATION',
          expected: '',
          message: 'w',
        },
      ],
    )
    expect(map.get('2:pressure')).toEqual([{ severity: 'error', message: 'e' }])
    expect(map.get('1:humidity')).toEqual([{ severity: 'warning', message: 'w' }])
  })
})

describe('the preset address', () => {
  it('when written and read back, keeps the request; a bad preset reads as none', () => {
    const request = {
      preset: 'tropical' as const,
      levelCount: 41,
      topPressurePa: 10,
      humidityScale: 0.5,
      surfaceEmissivity: 0.98,
      surfaceTemperatureK: 302,
      tropopausePressurePa: 9000,
    }
    const query = presetRequestToQuery(request) as Record<string, string>
    expect(presetRequestFromQuery(query)).toEqual(request)
    expect(presetRequestFromQuery({ preset: 'venus' })).toBeNull()
  })
})
