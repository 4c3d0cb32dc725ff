import type { AtmosphereProfile } from '../physics/types'
import { SWEPT_GASES, type SweptGas } from '../schemas/sweeps'
import { applyMixture } from './apply-mixture'

/**
 * The profile with `gas` at a uniform dry-air amount (in the gas's unit: ppmv for CO₂, ppbv for
 * CH₄ and N₂O) at every level, as a mixture's uniform setting applies it. It does not depend on
 * the profile's own amount of that gas, so the members of a sweep can be rebuilt from any one.
 */
export function withSweptAmount(profile: AtmosphereProfile, gas: SweptGas, amount: number): AtmosphereProfile {
  return applyMixture(profile, { [gas]: { mode: 'uniform', vmr: amount * SWEPT_GASES[gas].vmrPerUnit } }).profile
}
