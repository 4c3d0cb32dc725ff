import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { lineBroadening } from '../../../../shared/catalogue/asymmetric/broadening-model'
import type { BroadeningModel } from '../../../../shared/catalogue/asymmetric/constants/types'
import { expectRelativeClose } from '../../../support/expect-close'

const MODEL: BroadeningModel = {
  airAtJ0CmPerAtm: 0.1,
  airDecayPerJ: 0.07,
  airMinCmPerAtm: 0.01,
  selfToAirRatio: 5,
  nAirAtJ0: 0.75,
  nAirSlopePerJ: 0.0125,
  nAirMin: 0.45,
  pressureShiftCmPerAtm: -0.005,
  source: 'test',
  confidence: 'MEMORY-low',
}

describe('lineBroadening', () => {
  it('when J″ = 10, returns γ_air = 0.1 e^{−0.7}, γ_self = 5 γ_air, n = 0.625', () => {
    // The model's defining formula (analytic); relative tolerance 1e-15.
    const widths = lineBroadening(MODEL, 10)
    expectRelativeClose(widths.airHalfWidthCmPerAtm, 0.1 * Math.exp(-0.7), 1e-15)
    expectRelativeClose(widths.selfHalfWidthCmPerAtm, 0.5 * Math.exp(-0.7), 1e-15)
    expectRelativeClose(widths.temperatureExponentAir, 0.625, 1e-15)
    expect(widths.pressureShiftCmPerAtm).toBe(-0.005)
  })

  it('when J″ is large, returns the floors', () => {
    const widths = lineBroadening(MODEL, 100)
    expect(widths.airHalfWidthCmPerAtm).toBe(0.01)
    expect(widths.temperatureExponentAir).toBe(0.45)
  })

  it('when J″ is negative, throws PhysicsError', () => {
    expect(() => lineBroadening(MODEL, -1)).toThrow(PhysicsError)
  })
})
