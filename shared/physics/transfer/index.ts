/** Radiative transfer: angular quadrature, exponential integrals, the solver, heating rates. */
export {
  DIFFUSIVITY_FACTOR,
  MAX_QUADRATURE_NODES,
  angleQuadrature,
  gaussJacobiMuUnitInterval,
  gaussLegendreUnitInterval,
} from './quadrature'
export type {
  AngleQuadrature,
  AngleQuadratureKind,
  AngleQuadratureSpec,
  QuadratureRule,
} from './quadrature'
export {
  MAX_EXPONENTIAL_INTEGRAL_ORDER,
  exponentialIntegralEn,
  fluxTransmittance,
} from './exponential-integral'
export { integrateWithWeights, trapezoidWeightsCm } from './spectral-integration'
export {
  createSchwarzschildResult,
  createSchwarzschildWorkspace,
  linearInTauCoefficient,
  solveSchwarzschild,
  surfaceDownwardRadiance,
  topOfAtmosphereRadiance,
} from './schwarzschild'
export type {
  LayerSourceMode,
  SchwarzschildInput,
  SchwarzschildResult,
  SchwarzschildResultShape,
  SchwarzschildWorkspace,
} from './schwarzschild'
export { heatingRateFromUpDownKPerDay, heatingRateKPerDay } from './heating-rate'
export type { HeatingRateOptions } from './heating-rate'
