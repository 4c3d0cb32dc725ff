import { describe, expect, it } from 'vitest'
import { buildUsStandard1976Profile } from '../../../../shared/physics/atmosphere/us-standard-1976-profile'
import { usStandardAtmosphere1976 } from '../../../../shared/physics/atmosphere/us-standard-1976'
import { saturationVapourPressureOverWaterPa } from '../../../../shared/physics/atmosphere/humidity'
import { PhysicsError } from '../../../../shared/physics/errors'

describe('buildUsStandard1976Profile', () => {
  it('when built with defaults, has 61 levels from 101 325 Pa to 10 Pa at the standard temperatures', () => {
    const profile = buildUsStandard1976Profile()
    expect(profile.levels).toHaveLength(61)
    expect(profile.levels[0].pressurePa).toBe(101325)
    expect(profile.levels[60].pressurePa).toBe(10)
    expect(profile.surfaceTemperatureK).toBe(288.15) // U.S. Standard Atmosphere 1976 T₀
    for (const level of profile.levels) {
      const s = usStandardAtmosphere1976(level.heightM)
      expect(Math.abs(s.pressurePa / level.pressurePa - 1)).toBeLessThan(1e-12)
      expect(s.temperatureK).toBe(level.temperatureK)
    }
  })

  it('when spaced in height to 86 km, has evenly spaced geometric heights', () => {
    const profile = buildUsStandard1976Profile({
      levelCount: 87,
      spacing: 'height',
      topHeightM: 86000,
    })
    profile.levels.forEach((level, i) =>
      expect(Math.abs(level.heightM - 1000 * i)).toBeLessThan(1e-6),
    )
  })

  it('when built, is never supersaturated and has the uniform gases in dry air', () => {
    const profile = buildUsStandard1976Profile({ levelCount: 41, wellMixed: { co2Ppmv: 280 } })
    for (const level of profile.levels) {
      expect(level.vmr.H2O! * level.pressurePa).toBeLessThanOrEqual(
        saturationVapourPressureOverWaterPa(level.temperatureK) * (1 + 1e-12),
      )
      expect(Math.abs(level.vmr.CO2! / (1 - level.vmr.H2O!) - 280e-6)).toBeLessThan(1e-18)
      expect(Math.abs(level.vmr.CH4! / (1 - level.vmr.H2O!) - 1.9e-6)).toBeLessThan(1e-20)
    }
  })

  it('when the top is above 86 km or the level count is invalid, throws PhysicsError', () => {
    expect(() => buildUsStandard1976Profile({ topHeightM: 90000 })).toThrow(PhysicsError)
    expect(() => buildUsStandard1976Profile({ topPressurePa: 0.1 })).toThrow(PhysicsError)
    expect(() => buildUsStandard1976Profile({ levelCount: 1 })).toThrow(PhysicsError)
    expect(() => buildUsStandard1976Profile({ surfaceEmissivity: 1.5 })).toThrow(PhysicsError)
  })
})
