/**
 * Options of the optical-depth calculation, their defaults and their validation.
 */
import { PhysicsError, assertFiniteInRange } from '../errors'
import type { MolarMassLookup, PartitionFunctionLookup } from '../spectroscopy'
import { validateContinuumHooks, type ContinuumHook } from './continuum'
import { validateLineWingWeights, type LineWingWeights } from './line-wing-weights'

/** Line shapes the optics can evaluate. */
export type OpticsLineShape = 'voigt'

/** Tuning of the multi-level (fine/coarse grid) evaluation; the defaults are the tested ones. */
export interface MultigridOptions {
  /** Step ratio between consecutive grid levels, integer in [2, 64] (default 8). */
  coarseningRatio?: number
  /**
   * Radius of a line's near zone at level ℓ in steps of level ℓ + 1, ≥ 6 (default 16): beyond it
   * the line is interpolated from level ℓ + 1 with at least this many coarse steps between the
   * line centre and the interpolated point.
   */
  nearZoneCoarseSteps?: number
  /** Points per Voigt HWHM on the finest level a line's core is evaluated on, ≥ 2 (default 8). */
  corePointsPerHalfWidth?: number
}

/** Options of `computeChunkOpticalDepth` (all optional). */
export interface OpticsOptions {
  /** Line-wing cutoff: a line adds nothing beyond |ν − ν*| > cutoff, cm⁻¹ (default 25). */
  wingCutoffCm?: number
  /** Subtract the profile value at the cutoff inside it (continuous at the edge; default false). */
  subtractPedestal?: boolean
  /**
   * Far-wing weights χ(|ν − ν*|, T_layer) by molecule number (e.g. { 2: CO2_CHI_WING_WEIGHT }):
   * the profile of each line of that molecule is multiplied by χ beyond the weight's onset, up to
   * the (common) wing cutoff; with pedestal subtraction the subtracted value is K(cutoff)·χ(cutoff)
   * (default none).
   */
  lineWingWeights?: LineWingWeights
  /** Grid step ≤ narrowest Voigt HWHM of the chunk / this (default 4). */
  pointsPerHalfWidth?: number
  /** Lower bound of the adaptive step, cm⁻¹ (default 1e-5). */
  minStepCm?: number
  /** Upper bound of the adaptive step, cm⁻¹ (default 0.01). */
  maxStepCm?: number
  /** Fixed grid step, cm⁻¹; replaces the adaptive choice (and its bounds) when given. */
  stepCm?: number
  /** Continuum terms that add optical depth to each layer (default none). */
  continuum?: readonly ContinuumHook[]
  /** Line shape (default 'voigt', the only one). */
  lineShape?: OpticsLineShape
  /** Partition function per isotopologue (default: the approximate table functions). */
  partitionFunctionLookup?: PartitionFunctionLookup
  /** Molar mass per isotopologue, g mol⁻¹ (default: the isotopologue table). */
  molarMassLookup?: MolarMassLookup
  /** Tuning of the fine/coarse evaluation (defaults are the tested ones). */
  multigrid?: MultigridOptions
}

/** Options of the brute-force reference path (the step is an explicit argument there). */
export type ReferenceOpticsOptions = Pick<
  OpticsOptions,
  | 'wingCutoffCm'
  | 'subtractPedestal'
  | 'lineWingWeights'
  | 'continuum'
  | 'lineShape'
  | 'partitionFunctionLookup'
  | 'molarMassLookup'
>

/** Default line-wing cutoff, cm⁻¹ (common practice for line-by-line models). */
export const DEFAULT_WING_CUTOFF_CM = 25
/** Default grid points per narrowest Voigt HWHM (common practice). */
export const DEFAULT_POINTS_PER_HALF_WIDTH = 4
/** Default lower bound of the adaptive step, cm⁻¹. */
export const DEFAULT_MIN_STEP_CM = 1e-5
/** Default upper bound of the adaptive step, cm⁻¹. */
export const DEFAULT_MAX_STEP_CM = 0.01
/** Default step ratio between grid levels. */
export const DEFAULT_COARSENING_RATIO = 8
/** Default near-zone radius in coarse steps. */
export const DEFAULT_NEAR_ZONE_COARSE_STEPS = 16
/** Default points per Voigt HWHM for interpolated line cores. */
export const DEFAULT_CORE_POINTS_PER_HALF_WIDTH = 8

/** Options with every default filled in. */
export interface ResolvedOpticsOptions {
  wingCutoffCm: number
  subtractPedestal: boolean
  lineWingWeights: LineWingWeights
  pointsPerHalfWidth: number
  minStepCm: number
  maxStepCm: number
  stepCm: number | null
  continuum: readonly ContinuumHook[]
  lineShape: OpticsLineShape
  partitionFunctionLookup: PartitionFunctionLookup | undefined
  molarMassLookup: MolarMassLookup | undefined
  coarseningRatio: number
  nearZoneCoarseSteps: number
  corePointsPerHalfWidth: number
}

/** Fills in defaults and validates; throws PhysicsError for invalid values. */
export function resolveOpticsOptions(options: OpticsOptions = {}): ResolvedOpticsOptions {
  const wingCutoffCm = options.wingCutoffCm ?? DEFAULT_WING_CUTOFF_CM
  assertFiniteInRange('wingCutoffCm', wingCutoffCm, Number.MIN_VALUE, 1e4)
  const pointsPerHalfWidth = options.pointsPerHalfWidth ?? DEFAULT_POINTS_PER_HALF_WIDTH
  assertFiniteInRange('pointsPerHalfWidth', pointsPerHalfWidth, 1, 1e3)
  const minStepCm = options.minStepCm ?? DEFAULT_MIN_STEP_CM
  const maxStepCm = options.maxStepCm ?? DEFAULT_MAX_STEP_CM
  assertFiniteInRange('minStepCm', minStepCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('maxStepCm', maxStepCm, minStepCm, Infinity)
  const stepCm = options.stepCm ?? null
  if (stepCm !== null) assertFiniteInRange('stepCm', stepCm, Number.MIN_VALUE, Infinity)
  const lineShape = options.lineShape ?? 'voigt'
  if (lineShape !== 'voigt') {
    throw new PhysicsError('UNSUPPORTED', `line shape '${String(lineShape)}' is not supported`, {
      lineShape,
    })
  }
  const continuum = options.continuum ?? []
  validateContinuumHooks(continuum)
  const multigrid = options.multigrid ?? {}
  const coarseningRatio = multigrid.coarseningRatio ?? DEFAULT_COARSENING_RATIO
  if (!Number.isInteger(coarseningRatio) || coarseningRatio < 2 || coarseningRatio > 64) {
    throw new PhysicsError('OUT_OF_RANGE', 'coarseningRatio must be an integer in [2, 64]', {
      coarseningRatio,
    })
  }
  const nearZoneCoarseSteps = multigrid.nearZoneCoarseSteps ?? DEFAULT_NEAR_ZONE_COARSE_STEPS
  assertFiniteInRange('nearZoneCoarseSteps', nearZoneCoarseSteps, 6, 1e4)
  const corePointsPerHalfWidth =
    multigrid.corePointsPerHalfWidth ?? DEFAULT_CORE_POINTS_PER_HALF_WIDTH
  assertFiniteInRange('corePointsPerHalfWidth', corePointsPerHalfWidth, 2, 1e3)
  if (options.subtractPedestal !== undefined && typeof options.subtractPedestal !== 'boolean') {
    throw new PhysicsError('INVALID_ARGUMENT', 'subtractPedestal must be a boolean')
  }
  return {
    wingCutoffCm,
    subtractPedestal: options.subtractPedestal ?? false,
    lineWingWeights: validateLineWingWeights(options.lineWingWeights),
    pointsPerHalfWidth,
    minStepCm,
    maxStepCm,
    stepCm,
    continuum,
    lineShape,
    partitionFunctionLookup: options.partitionFunctionLookup,
    molarMassLookup: options.molarMassLookup,
    coarseningRatio,
    nearZoneCoarseSteps,
    corePointsPerHalfWidth,
  }
}
