/** Diagnostics of radiative-transfer results. */
export { brightnessTemperatureSpectrumK } from './brightness-temperature'
export { createEmissionLevelResult, emissionLevel } from './emission-height'
export type { EmissionLevelOptions, EmissionLevelResult } from './emission-height'
export {
  apodizationFunction,
  convolveInstrumentLineShape,
  ftsLineShape,
  ftsLineShapeByQuadrature,
  instrumentLineShapeKernel,
} from './instrument-line-shape'
export type { Apodization, InstrumentLineShape } from './instrument-line-shape'
export { radiativeForcing, spectralForcing } from './forcing'
export type { ForcingResult } from './forcing'
export {
  CO2_BENDING_ATOMIC_OXYGEN_RATE_CM3_PER_S,
  CO2_BENDING_EINSTEIN_A_PER_S,
  LTE_RATIO_THRESHOLD,
  co2BendingVtRateCoefficientCm3PerS,
  lteCheck,
} from './lte-check'
export type { LteCheckOptions, LteCheckResult } from './lte-check'
export {
  besselI0Scaled,
  besselI1Scaled,
  equivalentWidthCm,
  ladenburgReicheFunction,
  lorentzEquivalentWidthCm,
} from './curve-of-growth'
export { fitLogarithmicForcing } from './log-fit'
export type { LogFitResult } from './log-fit'
