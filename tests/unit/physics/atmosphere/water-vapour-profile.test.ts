import { describe, expect, it } from 'vitest'
import {
  MANABE_WETHERALD_STRATOSPHERIC_WATER_VMR,
  manabeWetheraldRelativeHumidity,
  waterVapourVmrProfile,
} from '../../../../shared/physics/atmosphere/water-vapour-profile'
import { saturationVapourPressureOverWaterPa } from '../../../../shared/physics/atmosphere/humidity'
import { PhysicsError } from '../../../../shared/physics/errors'

describe('manabeWetheraldRelativeHumidity', () => {
  it('when at the surface, returns RH* = 0.77; when Q ≤ 0.02, returns 0', () => {
    // Manabe & Wetherald 1967, J. Atmos. Sci. 24, 241 (form from memory): RH = RH*(Q − 0.02)/0.98.
    expect(manabeWetheraldRelativeHumidity(101325, 101325)).toBeCloseTo(0.77, 15)
    expect(manabeWetheraldRelativeHumidity(2000, 101325)).toBe(0)
    expect(manabeWetheraldRelativeHumidity(1000, 101325)).toBe(0)
  })

  it('when Q = 0.51, returns RH*/2', () => {
    // (0.51 − 0.02)/0.98 = 0.5 exactly (arithmetic from the formula).
    expect(manabeWetheraldRelativeHumidity(51000, 100000, 0.8)).toBeCloseTo(0.4, 14)
  })

  it('when RH* is outside [0, 1], throws PhysicsError', () => {
    expect(() => manabeWetheraldRelativeHumidity(5e4, 1e5, 1.2)).toThrow(PhysicsError)
  })
})

describe('waterVapourVmrProfile', () => {
  const pressurePa = [100000, 50000, 20000, 10000, 1000]
  const temperatureK = [290, 255, 215, 195, 230]

  it('when below the tropopause, returns RH·e_s/p; above, the stratospheric value', () => {
    const rh = [0.8, 0.5, 0.2, 0.1, 0]
    const x = waterVapourVmrProfile({
      pressurePa,
      temperatureK,
      relativeHumidity: rh,
      tropopausePressurePa: 15000,
      stratosphericVmr: 4e-6,
    })
    // definition of RH (WMO) with Murphy & Koop e_w
    expect(x[0]).toBeCloseTo((0.8 * saturationVapourPressureOverWaterPa(290)) / 100000, 15)
    expect(x[1]).toBeCloseTo((0.5 * saturationVapourPressureOverWaterPa(255)) / 50000, 15)
    expect(x[3]).toBe(4e-6)
    expect(x[4]).toBe(4e-6)
  })

  it('when the stratospheric value exceeds saturation at a cold level, caps it at saturation', () => {
    const x = waterVapourVmrProfile({
      pressurePa: [100000, 10000],
      temperatureK: [290, 170],
      relativeHumidity: [0.5, 0.1],
      tropopausePressurePa: 20000,
      stratosphericVmr: 1e-4,
    })
    const saturation = saturationVapourPressureOverWaterPa(170) / 10000
    expect(saturation).toBeLessThan(1e-4)
    expect(x[1]).toBeCloseTo(saturation, 20)
  })

  it('when the MW67 floor is used, equals 3 mg/kg as a vmr (≈ 4.82e-6)', () => {
    // x = r/(ε + r) with r = 3e-6 (Manabe & Wetherald 1967, from memory).
    expect(MANABE_WETHERALD_STRATOSPHERIC_WATER_VMR).toBeCloseTo(4.8233e-6, 9)
  })

  it('when arrays differ in length or RH is invalid, throws PhysicsError', () => {
    const base = { tropopausePressurePa: 1e4, stratosphericVmr: 4e-6 }
    expect(() =>
      waterVapourVmrProfile({
        ...base,
        pressurePa: [1e5],
        temperatureK: [280, 270],
        relativeHumidity: [0.5],
      }),
    ).toThrow(PhysicsError)
    expect(() =>
      waterVapourVmrProfile({
        ...base,
        pressurePa: [1e5],
        temperatureK: [280],
        relativeHumidity: [1.5],
      }),
    ).toThrow(PhysicsError)
  })
})
