import { describe, expect, it } from 'vitest'
import {
  climatologyTemperatureK,
  getClimatologyPreset,
} from '../../../../shared/physics/atmosphere/climatology'
import { saturationVapourPressurePa } from '../../../../shared/physics/atmosphere/humidity'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  blendedClimatologyTemperatureK,
  extendWithClimatology,
  extensionLevelCount,
  relaxationWeight,
  type ClimatologyJoin,
} from '../../../../shared/profiles/sounding/climatology-extension'

const tropical = getClimatologyPreset('tropical').parameters

/** A sounding top at 100 hPa, 211.15 K — about 18 K warmer than the tropical climatology there. */
const JOIN: ClimatologyJoin = {
  pressurePa: 10000,
  temperatureK: 211.15,
  heightM: 16500,
  waterVmr: 4.7e-6,
  ozoneVmr: 1e-6,
  surfaceHeightM: 112,
}

describe('relaxationWeight', () => {
  it('when at the join, half way and at the relaxation depth, returns 1, 1/2 and 0', () => {
    // raised cosine ½[1 + cos(πs/S)]: exact values at s = 0, S/2, S (analytic).
    expect(relaxationWeight(0, 2)).toBe(1)
    expect(relaxationWeight(1, 2)).toBeCloseTo(0.5, 15)
    expect(relaxationWeight(2, 2)).toBe(0)
    expect(relaxationWeight(5, 2)).toBe(0)
    expect(relaxationWeight(-0.1, 2)).toBe(1)
  })

  it('when the relaxation depth is not positive, throws PhysicsError', () => {
    expect(() => relaxationWeight(1, 0)).toThrow(PhysicsError)
    expect(() => relaxationWeight(Number.NaN, 2)).toThrow(PhysicsError)
  })
})

describe('blendedClimatologyTemperatureK', () => {
  it('when evaluated at the join, returns the sounding temperature exactly', () => {
    expect(blendedClimatologyTemperatureK(JOIN.pressurePa, JOIN, tropical)).toBeCloseTo(211.15, 10)
  })

  it('when two or more scale heights above the join, returns the climatology itself', () => {
    for (const p of [JOIN.pressurePa * Math.exp(-2), 500, 10]) {
      expect(blendedClimatologyTemperatureK(p, JOIN, tropical)).toBe(
        climatologyTemperatureK(p, tropical),
      )
    }
  })
})

describe('extendWithClimatology', () => {
  it('when extending from 100 hPa to 10 Pa, adds ⌈ln(1000)/0.25⌉ = 28 levels ending exactly at 10 Pa', () => {
    const added = extendWithClimatology(JOIN, 'tropical')
    expect(added.pressurePa).toHaveLength(28)
    expect(extensionLevelCount(JOIN.pressurePa, 10, 0.25)).toBe(28)
    expect(added.pressurePa[27]).toBe(10)
    expect(added.pressurePa[0]).toBeLessThan(JOIN.pressurePa)
    for (let k = 1; k < 28; k++) {
      expect(added.pressurePa[k]).toBeLessThan(added.pressurePa[k - 1])
      expect(added.heightM[k]).toBeGreaterThan(added.heightM[k - 1])
    }
    expect(added.heightM[0]).toBeGreaterThan(JOIN.heightM)
  })

  it('when the level spacing is halved, halves the temperature step at the join (continuous)', () => {
    // The unblended climatology would jump by T_c(p₁) − T_join ≈ −15…−18 K whatever the spacing;
    // the blended profile's first step shrinks in proportion to the spacing (first order).
    const steps = [0.2, 0.1, 0.05].map((spacing) => {
      const added = extendWithClimatology(JOIN, 'tropical', { levelSpacingLnP: spacing })
      const naive = climatologyTemperatureK(added.pressurePa[0], tropical) - JOIN.temperatureK
      expect(Math.abs(naive)).toBeGreaterThan(15)
      return Math.abs(added.temperatureK[0] - JOIN.temperatureK)
    })
    expect(steps[0] / steps[1]).toBeGreaterThan(1.6)
    expect(steps[0] / steps[1]).toBeLessThan(2.4)
    expect(steps[1] / steps[2]).toBeGreaterThan(1.6)
    expect(steps[1] / steps[2]).toBeLessThan(2.4)
    expect(steps[2]).toBeLessThan(1)
  })

  it('when the spacing is refined, water vapour and ozone at the first level tend to the join values', () => {
    const fine = extendWithClimatology(JOIN, 'tropical', { levelSpacingLnP: 0.01 })
    expect(Math.abs(fine.waterVmr[0] / JOIN.waterVmr! - 1)).toBeLessThan(1e-3)
    expect(Math.abs(fine.ozoneVmr[0] / JOIN.ozoneVmr! - 1)).toBeLessThan(0.03)
  })

  it('when adding levels, keeps water vapour at or below saturation at every level', () => {
    const added = extendWithClimatology({ ...JOIN, waterVmr: 5e-5 }, 'subarctic-winter')
    for (let k = 0; k < added.pressurePa.length; k++) {
      const saturationVmr = saturationVapourPressurePa(added.temperatureK[k]) / added.pressurePa[k]
      expect(added.waterVmr[k]).toBeLessThanOrEqual(saturationVmr * (1 + 1e-12))
    }
  })

  it('when the join is at or above the top pressure, adds nothing', () => {
    const added = extendWithClimatology({ ...JOIN, pressurePa: 8 }, 'tropical', {
      topPressurePa: 10,
    })
    expect(added.pressurePa).toHaveLength(0)
  })

  it('when the top pressure is below 1 Pa, throws PhysicsError', () => {
    expect(() => extendWithClimatology(JOIN, 'tropical', { topPressurePa: 0.5 })).toThrow(
      PhysicsError,
    )
  })
})
