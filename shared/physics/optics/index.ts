/**
 * Optics of the physics engine: per-layer line state, layer optical depth on spectral grids
 * (adaptive grid with masked multi-level summation — the engine's default —, uniform multi-level
 * path, and brute-force reference), continuum hooks, Beer–Lambert
 * transmittance and column optical depths, and the split of a spectrum into chunks.
 */
export {
  MAX_PRESSURE_SHIFT_CM,
  computeLayerLineState,
  createLayerLineState,
  gasIdOfMolecule,
  validateLayerForOptics,
} from './layer-line-state'
export type { LayerLineState, LayerLineStateOptions } from './layer-line-state'
export {
  DEFAULT_COARSENING_RATIO,
  DEFAULT_CORE_POINTS_PER_HALF_WIDTH,
  DEFAULT_MAX_STEP_CM,
  DEFAULT_MIN_STEP_CM,
  DEFAULT_NEAR_ZONE_COARSE_STEPS,
  DEFAULT_POINTS_PER_HALF_WIDTH,
  DEFAULT_WING_CUTOFF_CM,
  resolveOpticsOptions,
} from './optics-options'
export type {
  MultigridOptions,
  OpticsLineShape,
  OpticsOptions,
  ReferenceOpticsOptions,
  ResolvedOpticsOptions,
} from './optics-options'
export { gridIndexRange, gridWavenumbersCm, planChunks } from './spectral-grid'
export type { GridIndexRange, SpectralChunk } from './spectral-grid'
export { chooseUniformStepCm, computeChunkOpticalDepth } from './optical-depth'
export type {
  ChunkOpticalDepthInput,
  ChunkOpticalDepthResult,
  ChunkOpticalDepthStats,
} from './optical-depth'
export {
  computeAdaptiveChunkOpticalDepth,
  peakOpticalDepth,
  DEFAULT_SIGNIFICANT_PEAK_OPTICAL_DEPTH,
} from './adaptive-optical-depth'
export type {
  AdaptiveChunkOpticalDepthInput,
  AdaptiveChunkOpticalDepthResult,
  AdaptiveOpticalDepthStats,
  AdaptiveOpticsOptions,
} from './adaptive-optical-depth'
export { planAdaptiveGrid, requiredStepCm } from './adaptive-grid'
export type {
  AdaptiveGridParameters,
  AdaptiveSpectralGrid,
  GridRequirements,
} from './adaptive-grid'
export { computeReferenceOpticalDepth } from './reference-optical-depth'
export type {
  ReferenceOpticalDepthInput,
  ReferenceOpticalDepthResult,
} from './reference-optical-depth'
export { applyContinuumHooks, validateContinuumHooks } from './continuum'
export type { ContinuumHook } from './continuum'
export {
  beerLambertTransmittance,
  columnOpticalDepth,
  layerAbsorptance,
  layerTransmittance,
  opticalDepthFromTop,
} from './transmittance'
export { layerWingWeights, validateLineWingWeights, wingWeightOf } from './line-wing-weights'
export type { LayerWingWeight, LineWingWeights } from './line-wing-weights'
