/**
 * Continuum terms of the physics engine: the water-vapour self and foreign continuum of the
 * 8–12 µm window (pure functions and a continuum hook), the CO2 sub-Lorentzian far-wing χ-factor
 * (a line-shape weight), and the hook list for the engine.
 */
export * from './water-vapour-continuum'
export { createWaterVapourContinuumHook } from './water-vapour-continuum-hook'
export * from './co2-chi-factor'
export type { LineWingWeight } from './line-wing-weight'
export { buildContinuumHooks } from './continuum-hooks'
export type { ContinuumSelection } from './continuum-hooks'
