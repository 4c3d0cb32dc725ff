import { describe, expect, it } from 'vitest'
import {
  TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV,
  assembleLevels,
  logPressureLevels,
} from '../../../../shared/physics/atmosphere/profile-gases'
import * as atmosphere from '../../../../shared/physics/atmosphere'
import { PhysicsError } from '../../../../shared/physics/errors'

describe('logPressureLevels', () => {
  it('when asked for 5 levels from 1000 to 0.1 hPa, returns one per decade exactly at the ends', () => {
    const p = logPressureLevels(100000, 10, 5)
    expect(p[0]).toBe(100000)
    expect(p[4]).toBe(10)
    // analytic: pᵢ = p_s (p_top/p_s)^{i/4} = 10^{5−i} Pa
    for (let i = 1; i < 4; i++) expect(Math.abs(p[i] / 10 ** (5 - i) - 1)).toBeLessThan(1e-14)
  })

  it('when the top is not above the surface or the count is < 2, throws PhysicsError', () => {
    expect(() => logPressureLevels(1000, 1000, 5)).toThrow(PhysicsError)
    expect(() => logPressureLevels(1000, 10, 1)).toThrow(PhysicsError)
    expect(() => logPressureLevels(1000, 10, 2.5)).toThrow(PhysicsError)
  })
})

describe('assembleLevels', () => {
  const columns = {
    pressurePa: [100000, 50000],
    temperatureK: [288, 250],
    heightM: [0, 5500],
    waterVmr: [0.01, 0.001],
    ozoneVmr: [3e-8, 6e-8],
  }

  it('when given columns, converts the dry mole fractions to moist-air vmr x_d(1 − x_H2O)', () => {
    const levels = assembleLevels(columns)
    expect(levels[0].vmr.CO2).toBeCloseTo(400e-6 * 0.99, 18)
    expect(levels[1].vmr.N2O).toBeCloseTo(0.33e-6 * 0.999, 20)
    expect(levels[1].vmr.O3).toBe(6e-8)
    expect(levels[0].vmr.H2O).toBe(0.01)
    expect(levels[1].heightM).toBe(5500)
  })

  it('when defaults are used, they are 400 / 0.33 / 1.9 ppmv', () => {
    // typical present-day values (common practice)
    expect(TYPICAL_PRESENT_DAY_WELL_MIXED_PPMV).toEqual({
      co2Ppmv: 400,
      n2oPpmv: 0.33,
      ch4Ppmv: 1.9,
    })
  })

  it('when a well-mixed amount is negative, throws PhysicsError', () => {
    expect(() => assembleLevels(columns, { co2Ppmv: -1, n2oPpmv: 0.3, ch4Ppmv: 1.8 })).toThrow(
      PhysicsError,
    )
  })
})

describe('atmosphere index', () => {
  it('when imported, exposes the public builders', () => {
    expect(typeof atmosphere.buildClimatologyProfile).toBe('function')
    expect(typeof atmosphere.buildUsStandard1976Profile).toBe('function')
    expect(typeof atmosphere.levelsToLayers).toBe('function')
    expect(typeof atmosphere.usStandardAtmosphere1976).toBe('function')
    expect(typeof atmosphere.dewPointK).toBe('function')
    expect(typeof atmosphere.hypsometricHeightsM).toBe('function')
  })
})
