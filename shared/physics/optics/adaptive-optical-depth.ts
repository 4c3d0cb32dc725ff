/**
 * Layer optical depth of a spectral chunk on an adaptive grid: the engine's fast path.
 *
 * DESIGN
 *
 * The uniform fast path (optical-depth.ts) ties the step of a whole chunk to the narrowest line
 * of any layer — a Doppler core of the top layers, ≈ 1e-4 cm⁻¹ at 600 cm⁻¹ and ≈ 3e-5 cm⁻¹ in the
 * far infrared — although most lines in most layers are a thousand times wider and many narrow
 * cores are too weak to matter. Here each (line, layer) pair is judged by its peak optical depth
 * τ₀ = A·f(0) (A = S(T)·u, f the area-normalised Voigt profile) and by a bound on its effect on
 * fluxes, 2πB(ν*, T_ref)·A (an optically thin layer emits and absorbs at most that much):
 *
 * - significant pairs (τ₀ ≥ ε, default 1e-3) are resolved: the grid keeps P (default 1.5)
 *   points per Voigt HWHM near the line centre and a step growing like d/R (R = 4 half widths)
 *   with the distance d from it (adaptive-grid.ts); elsewhere it is the coarse step (1/16 of an
 *   output bin, at most 1/16 cm⁻¹);
 * - weak pairs (τ₀ < ε) only need their area, since e^{−τ} ≈ 1 − τ: where the local grid step s
 *   exceeds α_V/P, their Doppler width is raised to the smallest value for which the trapezoid
 *   rule on step s integrates the profile to 1e-4 (≈ 0.8 s for a Doppler line, none for γ ≳
 *   1.6 s). A Voigt profile convolved with a Gaussian is a Voigt profile with the Doppler widths
 *   added in quadrature, so the area is kept; the error is the change of the nonlinear part of
 *   the absorption, ≲ 1.3 ε of the pair's own absorption (3-node Gauss streams, slant factor up
 *   to 8.9), and a displacement of the absorption by ≲ s. Weak pairs also use a smaller near
 *   zone (ρ = 7 instead of 10 coarse steps), a coarser core level (Q = 2 instead of 4 points per
 *   HWHM) and no exact treatment of the jump at the wing cutoff (masked-multigrid.ts); each of
 *   these costs ≲ 1e-4 of the weak pair's own area;
 * - negligible pairs are dropped, the smallest bounds first, while the sum of dropped bounds of a
 *   layer stays within chunk width × min(3e-6 W m⁻² per cm⁻¹, 5e-7 K/day per cm⁻¹ × c_p Δp/(g ·
 *   86400 s)): over 10–3000 cm⁻¹ at most 0.009 W m⁻² of flux and 1.5e-3 K/day of heating rate per
 *   layer (bounds; the effect measured is far smaller).
 *
 * Optical depths are then summed with the fine/coarse multi-level scheme of the uniform path,
 * evaluated only on the levels and nodes the adaptive grid needs (masked-multigrid.ts), with a
 * coarsening ratio of 4. The output is point values of τ at the grid points: for significant
 * pairs to ≈ 1e-3 τ (interpolated cores with Q = 4 points per HWHM: (9/16)·4⁻⁴ ≈ 2e-3 of the peak
 * at worst; far wings with ρ = 10: ≈ 7e-4 of the wing at the zone edge), with integrals of τ much
 * closer (the interpolation errors change sign within a cell).
 *
 * Why point values on a graded grid are enough: every output of a run (band fluxes, heating rates,
 * bin means) is an integral over ν, integrated with the trapezoid rule on each uniform run plus
 * Gregory end corrections where the step changes (transfer/end-corrected-trapezoid.ts), which
 * converges fast for integrands analytic in a strip of width ≈ the narrowest resolved half width
 * (see adaptive-grid.ts). Measured against the brute-force path (uniform grid of α_min/4, every
 * line summed at every point, layer-by-layer solver) on the CO₂ Q branch, 665–670 cm⁻¹, 11 levels:
 * fluxes within 4.4e-6 W m⁻², heating rates within 5.2e-5 K/day (tests/unit/physics/optics/
 * adaptive-accuracy.test.ts); full 10–3000 cm⁻¹, 61 levels, against the uniform fast path: fluxes
 * within 1.5e-3 W m⁻², heating rates within 2.4e-4 K/day (`npm run bench`, scripts/bench).
 */
import { DRY_AIR_CP_J_PER_KG_K, SECONDS_PER_DAY, STANDARD_GRAVITY_M_PER_S2 } from '../constants'
import { PhysicsError, assertFiniteInRange } from '../errors'
import { planckRadianceWavenumber } from '../planck'
import {
  sliceLineTableByWavenumber,
  validateLineTable,
  voigtKUnchecked,
  type LineTable,
} from '../spectroscopy'
import type { AtmosphereLayer } from '../types'
import { planAdaptiveGrid, type AdaptiveSpectralGrid } from './adaptive-grid'
import { applyContinuumHooks, validateContinuumHooks, type ContinuumHook } from './continuum'
import {
  layerWingWeights,
  validateLineWingWeights,
  wingWeightOf,
  type LayerWingWeight,
  type LineWingWeights,
} from './line-wing-weights'
import {
  MAX_PRESSURE_SHIFT_CM,
  computeLayerLineState,
  createLayerLineState,
  validateLayerForOptics,
  type LayerLineState,
} from './layer-line-state'
import {
  clearMaskedAccumulators,
  createMaskedMultigrid,
  depositMaskedLine,
  extractMaskedPoints,
  interpolateMaskedLevels,
  maskedCoreLevel,
  maskedNodeCount,
  type MaskedMultigrid,
} from './masked-multigrid'
import { DEFAULT_WING_CUTOFF_CM } from './optics-options'
import type { MolarMassLookup, PartitionFunctionLookup } from '../spectroscopy'

const SQRT_LN2 = Math.sqrt(Math.LN2)
const SQRT_LN2_OVER_PI = Math.sqrt(Math.LN2 / Math.PI)

/**
 * Default peak optical depth from which a (line, layer) pair is resolved by the grid. The defaults
 * below were chosen with `npm run bench` and tests/.../adaptive-accuracy.test.ts: flux and heating
 * errors stay ≥ 20× inside the targets (0.05 W m⁻², 0.01 K/day over 10–3000 cm⁻¹).
 */
export const DEFAULT_SIGNIFICANT_PEAK_OPTICAL_DEPTH = 1e-3
/** Default grid points per Voigt HWHM at the centre of a significant line. */
export const DEFAULT_ADAPTIVE_POINTS_PER_HALF_WIDTH = 1.5
/** Default half widths within which the fine step is kept (then it grows like d/R). */
export const DEFAULT_GRADING_HALF_WIDTHS = 4
/** Default upper bound of the coarse step, cm⁻¹. */
export const DEFAULT_MAX_COARSE_STEP_CM = 1 / 16
/** Default lower bound of any step, cm⁻¹. */
export const DEFAULT_ADAPTIVE_MIN_STEP_CM = 2 ** -20
/** Default near-zone radius (in coarse steps) of weak pairs. */
export const DEFAULT_WEAK_NEAR_ZONE_COARSE_STEPS = 7
/**
 * Default points per Voigt HWHM on the level where a significant pair's core is first evaluated:
 * points read from finer levels get the core by cubic interpolation, error ≤ (9/16)(1/Q)⁴ ≈ 2e-3
 * of the peak (Lorentz core; Abramowitz & Stegun 1964, 25.2.13, from memory).
 */
export const DEFAULT_ADAPTIVE_CORE_POINTS_PER_HALF_WIDTH = 4
/** The same for weak pairs (their peak is < ε, so a 4 % interpolation error is < 4e-5 in τ). */
export const DEFAULT_WEAK_CORE_POINTS_PER_HALF_WIDTH = 2
/** Default near-zone radius (in coarse steps) of significant pairs. */
export const DEFAULT_ADAPTIVE_NEAR_ZONE_COARSE_STEPS = 10
/** Default budget of dropped pairs for fluxes, W m⁻² per cm⁻¹ of chunk (9e-3 W m⁻² over 2990 cm⁻¹). */
export const DEFAULT_NEGLIGIBLE_FLUX_W_PER_M2_PER_CM = 3e-6
/** Default budget of dropped pairs for heating rates, K/day per cm⁻¹ of chunk, per layer. */
export const DEFAULT_NEGLIGIBLE_HEATING_K_PER_DAY_PER_CM = 5e-7
/** Default coarsening ratio of the multi-level summation (a power of two). */
export const DEFAULT_ADAPTIVE_COARSENING_RATIO = 4

/** Options of `computeAdaptiveChunkOpticalDepth` (all optional). */
export interface AdaptiveOpticsOptions {
  /** Line-wing cutoff, cm⁻¹ (default 25). */
  wingCutoffCm?: number
  /** Subtract the profile value at the cutoff inside it (default false). */
  subtractPedestal?: boolean
  /**
   * Far-wing weights χ(|ν − ν*|, T_layer) by molecule number (e.g. { 2: CO2_CHI_WING_WEIGHT }),
   * applied beyond each weight's onset up to the common cutoff, as in `OpticsOptions` (default
   * none).
   */
  lineWingWeights?: LineWingWeights
  /**
   * Unit the coarse step divides: the coarse step is unitCm/2^k, the largest such step not above
   * maxCoarseStepCm, so every multiple of unitCm from the chunk start is a grid point (default:
   * the chunk width). The engine passes its output-bin width.
   */
  unitCm?: number
  /** Upper bound of the coarse step, cm⁻¹ (default 1/16). */
  maxCoarseStepCm?: number
  /** No step finer than this, cm⁻¹ (default 2⁻²⁰). */
  minStepCm?: number
  /** Peak optical depth ε from which a (line, layer) pair is resolved (default 1e-3). */
  significantPeakOpticalDepth?: number
  /** Grid points per Voigt HWHM at significant line centres, P (default 1.5). */
  pointsPerHalfWidth?: number
  /** Half widths R over which the fine step is kept, then grows like d/R (default 4). */
  gradingHalfWidths?: number
  /**
   * Pairs whose flux bound 2πB(ν*, T_ref)·A (W m⁻²) is this small are dropped, within a budget
   * per layer of chunk width × min(negligibleFluxWPerM2PerCm, negligibleHeatingKPerDayPerCm ×
   * c_p Δp/(g·86400 s)). 0 disables (defaults 3e-6 W m⁻² per cm⁻¹ and 5e-7 K/day per cm⁻¹).
   */
  negligibleFluxWPerM2PerCm?: number
  negligibleHeatingKPerDayPerCm?: number
  /** Temperature of the flux bound, K (default: warmest layer + 30 K). */
  referenceTemperatureK?: number
  /** Near-zone radius ρ of weak pairs in coarse steps (≥ 6, default 7). */
  weakNearZoneCoarseSteps?: number
  /** Points per Voigt HWHM on the level where a weak pair's core is first evaluated (≥ 2, default 2). */
  weakCorePointsPerHalfWidth?: number
  /**
   * Multi-level tuning of significant pairs: ratio (power of two, default 4), near zone ρ
   * (default 10), points per HWHM Q on the core level (default 4).
   */
  multigrid?: {
    coarseningRatio?: number
    nearZoneCoarseSteps?: number
    corePointsPerHalfWidth?: number
  }
  /** Continuum terms added to each layer (default none). */
  continuum?: readonly ContinuumHook[]
  partitionFunctionLookup?: PartitionFunctionLookup
  molarMassLookup?: MolarMassLookup
}

/** Input of `computeAdaptiveChunkOpticalDepth`. */
export interface AdaptiveChunkOpticalDepthInput {
  /** Line table sorted by wavenumber; the whole table may be passed. */
  lines: LineTable
  /** Homogeneous layers, index 0 at the surface. */
  layers: readonly AtmosphereLayer[]
  /** Chunk bounds, cm⁻¹ (0 < startCm < endCm); the chunk must be a whole number of units. */
  startCm: number
  endCm: number
  options?: AdaptiveOpticsOptions
}

/** Bookkeeping of one adaptive chunk. */
export interface AdaptiveOpticalDepthStats {
  pointCount: number
  coarseStepCm: number
  finestStepCm: number
  refinementLevels: number
  /** Levels of the multi-level summation. */
  levelCount: number
  /** Masked nodes over all levels (per layer). */
  maskedNodeCount: number
  lineCount: number
  activeLineLayerCount: number
  significantLineLayerCount: number
  widenedLineLayerCount: number
  /** Pairs dropped as negligible, and the sum of their flux bounds, W m⁻². */
  droppedLineLayerCount: number
  droppedFluxBoundWPerM2: number
  voigtEvaluations: number
}

/** Output of `computeAdaptiveChunkOpticalDepth`. */
export interface AdaptiveChunkOpticalDepthResult {
  grid: AdaptiveSpectralGrid
  /** Grid wavenumbers (= grid.wavenumberCm), cm⁻¹. */
  wavenumberCm: Float64Array
  /** Vertical optical depth [layer][point]. */
  opticalDepth: Float64Array[]
  stats: AdaptiveOpticalDepthStats
}

export interface ResolvedAdaptiveOptions {
  wingCutoffCm: number
  subtractPedestal: boolean
  lineWingWeights: LineWingWeights
  unitCm: number
  maxCoarseStepCm: number
  minStepCm: number
  significantPeakOpticalDepth: number
  pointsPerHalfWidth: number
  gradingHalfWidths: number
  coarseningRatio: number
  nearZoneCoarseSteps: number
  weakNearZoneCoarseSteps: number
  corePointsPerHalfWidth: number
  weakCorePointsPerHalfWidth: number
  negligibleFluxWPerM2PerCm: number
  negligibleHeatingKPerDayPerCm: number
  referenceTemperatureK: number | null
  continuum: readonly ContinuumHook[]
  partitionFunctionLookup: PartitionFunctionLookup | undefined
  molarMassLookup: MolarMassLookup | undefined
}

function resolveOptions(
  options: AdaptiveOpticsOptions,
  chunkWidthCm: number,
): ResolvedAdaptiveOptions {
  const number = (
    name: string,
    value: number | undefined,
    fallback: number,
    min: number,
    max: number,
  ) => {
    const v = value ?? fallback
    assertFiniteInRange(name, v, min, max)
    return v
  }
  const multigrid = options.multigrid ?? {}
  const coarseningRatio = multigrid.coarseningRatio ?? DEFAULT_ADAPTIVE_COARSENING_RATIO
  if (![2, 4, 8, 16, 32, 64].includes(coarseningRatio)) {
    throw new PhysicsError('OUT_OF_RANGE', 'coarseningRatio must be a power of two in [2, 64]', {
      coarseningRatio,
    })
  }
  const continuum = options.continuum ?? []
  validateContinuumHooks(continuum)
  if (options.subtractPedestal !== undefined && typeof options.subtractPedestal !== 'boolean') {
    throw new PhysicsError('INVALID_ARGUMENT', 'subtractPedestal must be a boolean')
  }
  return {
    wingCutoffCm: number(
      'wingCutoffCm',
      options.wingCutoffCm,
      DEFAULT_WING_CUTOFF_CM,
      Number.MIN_VALUE,
      1e4,
    ),
    subtractPedestal: options.subtractPedestal ?? false,
    lineWingWeights: validateLineWingWeights(options.lineWingWeights),
    unitCm: number('unitCm', options.unitCm, chunkWidthCm, Number.MIN_VALUE, Infinity),
    maxCoarseStepCm: number(
      'maxCoarseStepCm',
      options.maxCoarseStepCm,
      DEFAULT_MAX_COARSE_STEP_CM,
      1e-6,
      100,
    ),
    minStepCm: number('minStepCm', options.minStepCm, DEFAULT_ADAPTIVE_MIN_STEP_CM, 1e-9, 1),
    significantPeakOpticalDepth: number(
      'significantPeakOpticalDepth',
      options.significantPeakOpticalDepth,
      DEFAULT_SIGNIFICANT_PEAK_OPTICAL_DEPTH,
      0,
      1e3,
    ),
    pointsPerHalfWidth: number(
      'pointsPerHalfWidth',
      options.pointsPerHalfWidth,
      DEFAULT_ADAPTIVE_POINTS_PER_HALF_WIDTH,
      1,
      100,
    ),
    gradingHalfWidths: number(
      'gradingHalfWidths',
      options.gradingHalfWidths,
      DEFAULT_GRADING_HALF_WIDTHS,
      1,
      1e3,
    ),
    coarseningRatio,
    nearZoneCoarseSteps: number(
      'nearZoneCoarseSteps',
      multigrid.nearZoneCoarseSteps,
      DEFAULT_ADAPTIVE_NEAR_ZONE_COARSE_STEPS,
      6,
      1e4,
    ),
    weakNearZoneCoarseSteps: number(
      'weakNearZoneCoarseSteps',
      options.weakNearZoneCoarseSteps,
      DEFAULT_WEAK_NEAR_ZONE_COARSE_STEPS,
      6,
      1e4,
    ),
    negligibleFluxWPerM2PerCm: number(
      'negligibleFluxWPerM2PerCm',
      options.negligibleFluxWPerM2PerCm,
      DEFAULT_NEGLIGIBLE_FLUX_W_PER_M2_PER_CM,
      0,
      1,
    ),
    negligibleHeatingKPerDayPerCm: number(
      'negligibleHeatingKPerDayPerCm',
      options.negligibleHeatingKPerDayPerCm,
      DEFAULT_NEGLIGIBLE_HEATING_K_PER_DAY_PER_CM,
      0,
      1,
    ),
    referenceTemperatureK:
      options.referenceTemperatureK === undefined
        ? null
        : number('referenceTemperatureK', options.referenceTemperatureK, 0, 1, 1e4),
    corePointsPerHalfWidth: number(
      'corePointsPerHalfWidth',
      multigrid.corePointsPerHalfWidth,
      DEFAULT_ADAPTIVE_CORE_POINTS_PER_HALF_WIDTH,
      2,
      1e3,
    ),
    weakCorePointsPerHalfWidth: number(
      'weakCorePointsPerHalfWidth',
      options.weakCorePointsPerHalfWidth,
      DEFAULT_WEAK_CORE_POINTS_PER_HALF_WIDTH,
      2,
      1e3,
    ),
    continuum,
    partitionFunctionLookup: options.partitionFunctionLookup,
    molarMassLookup: options.molarMassLookup,
  }
}

/** Largest unit/2^k not above maxStep (k ≥ 0); the unit itself when it is small enough. */
function coarseStepFor(unitCm: number, maxStepCm: number): number {
  let step = unitCm
  while (step > maxStepCm) step /= 2
  return step
}

/**
 * Peak optical depth of a line in a layer, τ₀ = A·√(ln2/π)/α_D·K(0, y).
 *
 * Method: the area-normalised Voigt profile at its centre, K from Humlíček 1982 (relative error
 * ≈ 1e-4). Notes: 0 for inactive rows. Units: dimensionless.
 * Source: Voigt profile via K(x, y), Armstrong 1967, JQSRT 7, 61 (from memory).
 */
export function peakOpticalDepth(state: LayerLineState, row: number): number {
  const strength = state.integratedOpticalDepthCm[row]
  if (!(strength > 0)) return 0
  const alphaD = state.dopplerHalfWidthCm[row]
  const y = (state.lorentzHalfWidthCm[row] * SQRT_LN2) / alphaD
  return ((strength * SQRT_LN2_OVER_PI) / alphaD) * voigtKUnchecked(0, y)
}

/** Kinds of (line, layer) pairs. */
const DROPPED = 0
const WEAK = 1
const SIGNIFICANT = 2
/** Histogram of log₂ of the flux bounds: bins [2^(b − 1100), 2^(b − 1099)). */
const BOUND_BINS = 1200
const BOUND_BIN_OFFSET = 1100

/**
 * Marks as DROPPED the active pairs of one layer with the smallest flux bounds, as many as fit in
 * `budget` (W m⁻²): bounds are binned by ⌊log₂⌋, and whole bins are dropped from the smallest up
 * while the running sum of the bounds in them stays within the budget. Returns the dropped sum.
 */
function dropNegligiblePairs(
  bounds: Float64Array,
  bins: Uint16Array,
  flags: Uint8Array,
  count: number,
  budget: number,
  binSums: Float64Array,
): number {
  if (!(budget > 0)) return 0
  binSums.fill(0)
  for (let i = 0; i < count; i++) {
    if (flags[i] === DROPPED) continue
    const bin = boundBin(bounds[i])
    bins[i] = bin
    binSums[bin] += bounds[i]
  }
  let sum = 0
  let limit = -1
  for (let b = 0; b < BOUND_BINS; b++) {
    if (sum + binSums[b] > budget) break
    sum += binSums[b]
    limit = b
  }
  if (limit < 0) return 0
  for (let i = 0; i < count; i++) {
    if (flags[i] !== DROPPED && bins[i] <= limit) flags[i] = DROPPED
  }
  return sum
}

function boundBin(bound: number): number {
  if (!(bound > 0)) return 0
  const b = Math.floor(Math.log2(bound)) + BOUND_BIN_OFFSET
  return b < 0 ? 0 : b >= BOUND_BINS ? BOUND_BINS - 1 : b
}

/** Target relative error of the trapezoid area of a widened weak line. */
const WIDENED_AREA_TOLERANCE = 1e-4
const WIDENING_EXPONENT = Math.log(2 / WIDENED_AREA_TOLERANCE)

/**
 * Doppler HWHM a weak line needs so that the trapezoid rule with step h integrates its Voigt
 * profile to WIDENED_AREA_TOLERANCE: the aliasing error of a uniform grid is ≈ 2·exp(−2πγ/h −
 * π²α_D²/(ln2·h²)) (Fourier transform of the Voigt profile; Poisson summation), so
 * α_D ≥ (h/π)·√(ln2·max(0, ln(2/δ) − 2πγ/h)). Lines with γ ≳ 1.6h need no widening.
 * Source: Trefethen & Weideman 2014, SIAM Rev. 56, 385, §3 (from memory).
 */
function smoothingDopplerWidthCm(gammaCm: number, stepCm: number): number {
  const deficit = WIDENING_EXPONENT - (2 * Math.PI * gammaCm) / stepCm
  return deficit > 0 ? (stepCm / Math.PI) * Math.sqrt(Math.LN2 * deficit) : 0
}

/** Largest spacing of the grid among the points within ±5 points of ν. */
function localStepCm(grid: Float64Array, nu: number): number {
  const reach = 5
  let a = 0
  let b = grid.length
  while (a < b) {
    const mid = (a + b) >> 1
    if (grid[mid] < nu) a = mid + 1
    else b = mid
  }
  const lo = Math.max(1, a - reach)
  const hi = Math.min(grid.length - 1, a + reach)
  let step = 0
  for (let i = lo; i <= hi; i++) {
    const d = grid[i] - grid[i - 1]
    if (d > step) step = d
  }
  return step
}

/**
 * Rows of the line slice a deposit takes: every row (null), only the rows of one molecule, or
 * every row but that molecule's (the two halves of a concentration sweep).
 */
export type RowSelection = { moleculeId: number; only: boolean } | null

/**
 * Per-row widths that fix how lines are represented, instead of each line's own Voigt HWHM:
 * whether a weak line is widened (`conditionHalfWidthCm` < P·step) and the level its core is first
 * evaluated on (`coreHalfWidthCm`). A sweep gives every reference amount the same ones.
 */
export interface LineRepresentation {
  conditionHalfWidthCm: Float64Array
  coreHalfWidthCm: Float64Array
}

/** `voigtHalfWidthCm` without its argument checks, for the inner loop (Olivero & Longbothum 1977). */
function voigtHalfWidthOf(alphaD: number, gamma: number): number {
  return 0.5346 * gamma + Math.sqrt(0.2166 * gamma * gamma + alphaD * alphaD)
}

/**
 * The Doppler HWHM a pair is deposited with: its own, or for a weak pair whose width
 * (`conditionHalfWidthCm`) is below P points per local step, the smoothing width when larger.
 */
export function representedDopplerHalfWidthCm(
  kind: number,
  conditionHalfWidthCm: number,
  alphaD: number,
  gamma: number,
  stepCm: number,
  pointsPerHalfWidth: number,
): number {
  if (kind !== WEAK || !(conditionHalfWidthCm < pointsPerHalfWidth * stepCm)) return alphaD
  const width = smoothingDopplerWidthCm(gamma, stepCm)
  return width > alphaD ? width : alphaD
}

/** The Voigt HWHM a pair is deposited with (after any widening). */
export function representedVoigtHalfWidthCm(
  kind: number,
  conditionHalfWidthCm: number,
  state: LayerLineState,
  row: number,
  stepCm: number,
  pointsPerHalfWidth: number,
): number {
  const alphaD = state.dopplerHalfWidthCm[row]
  const gamma = state.lorentzHalfWidthCm[row]
  const represented = representedDopplerHalfWidthCm(kind, conditionHalfWidthCm, alphaD, gamma, stepCm, pointsPerHalfWidth)
  return represented === alphaD ? state.voigtHalfWidthCm[row] : voigtHalfWidthOf(represented, gamma)
}

/** Adds the selected active lines of one layer (weak unresolved ones widened) to the accumulators. */
function depositLayer(
  ws: MaskedMultigrid,
  state: LayerLineState,
  moleculeId: Int32Array,
  weights: readonly (LayerWingWeight | undefined)[],
  flags: Uint8Array,
  stepNearLine: Float64Array,
  options: ResolvedAdaptiveOptions,
  reachLoCm: number,
  reachHiCm: number,
  selection: RowSelection,
  representation: LineRepresentation | null,
): number {
  const cutoff = options.wingCutoffCm
  const P = options.pointsPerHalfWidth
  const selectedMolecule = selection ? selection.moleculeId : -1
  const selectOnly = selection ? selection.only : true
  let widened = 0
  for (let i = 0; i < state.length; i++) {
    const kind = flags[i]
    if (kind === DROPPED) continue
    if (selectedMolecule >= 0 && (moleculeId[i] === selectedMolecule) !== selectOnly) continue
    const strength = state.integratedOpticalDepthCm[i]
    const centre = state.centreCm[i]
    if (centre < reachLoCm || centre > reachHiCm) continue
    const gamma = state.lorentzHalfWidthCm[i]
    const unwidenedHalfWidth = state.voigtHalfWidthCm[i]
    // The discrete choices (widening, core level) may follow widths given by the caller; see depositLayerLines.
    const alphaD = representedDopplerHalfWidthCm(
      kind,
      representation ? representation.conditionHalfWidthCm[i] : unwidenedHalfWidth,
      state.dopplerHalfWidthCm[i],
      gamma,
      stepNearLine[i],
      P,
    )
    let alphaV = unwidenedHalfWidth
    if (alphaD !== state.dopplerHalfWidthCm[i]) {
      alphaV = voigtHalfWidthOf(alphaD, gamma)
      widened++
    }
    const coreWidth = representation ? representation.coreHalfWidthCm[i] : alphaV
    const scale = SQRT_LN2 / alphaD
    const y = gamma * scale
    const amplitude = (strength * SQRT_LN2_OVER_PI) / alphaD
    const weight = wingWeightOf(weights, moleculeId[i])
    let pedestal = 0
    if (options.subtractPedestal) {
      pedestal = voigtKUnchecked(cutoff * scale, y)
      if (weight !== undefined && cutoff > weight.onsetCm) pedestal *= weight.chi(cutoff)
      ws.voigtEvaluations++
    }
    const coreLevel = maskedCoreLevel(
      ws,
      coreWidth,
      kind === WEAK ? options.weakCorePointsPerHalfWidth : options.corePointsPerHalfWidth,
    )
    const rho = kind === WEAK ? options.weakNearZoneCoarseSteps : options.nearZoneCoarseSteps
    // Weak lines skip the exact treatment of the cutoff jump (error ≲ 1e-4 of their area).
    depositMaskedLine(
      ws,
      centre,
      amplitude,
      scale,
      y,
      pedestal,
      cutoff,
      coreLevel,
      rho,
      kind !== WEAK,
      weight,
    )
  }
  return widened
}

/** Validated inputs of one adaptive chunk, shared by single runs and sweeps. */
export interface AdaptiveChunkSetup {
  startCm: number
  endCm: number
  options: ResolvedAdaptiveOptions
  coarseStepCm: number
  /** Lines that can reach the chunk (a slice of the table, sorted by wavenumber). */
  slice: LineTable
  lookups: {
    partitionFunctionLookup: PartitionFunctionLookup | undefined
    molarMassLookup: MolarMassLookup | undefined
  }
  /** 2πB(ν*, T_ref) per slice row: the flux bound per unit integrated optical depth, W m⁻² per cm⁻¹. */
  fluxPerArea: Float64Array
}

/**
 * Checks the chunk bounds and layers, resolves the options and slices the lines that can reach
 * the chunk. Method: bookkeeping (see `computeAdaptiveChunkOpticalDepth`). Source: —.
 */
export function setupAdaptiveChunk(input: AdaptiveChunkOpticalDepthInput): AdaptiveChunkSetup {
  const { lines, layers, startCm, endCm } = input
  assertFiniteInRange('startCm', startCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('endCm', endCm, startCm, Infinity)
  if (!(endCm > startCm)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'endCm must be greater than startCm', {
      startCm,
      endCm,
    })
  }
  if (!Array.isArray(layers)) throw new PhysicsError('INVALID_ARGUMENT', 'layers must be an array')
  layers.forEach((layer, index) => validateLayerForOptics(layer, index))
  const options = resolveOptions(input.options ?? {}, endCm - startCm)
  const cutoff = options.wingCutoffCm
  const ratio = options.coarseningRatio
  const rho = options.nearZoneCoarseSteps
  const topStepBoundCm = (ratio * cutoff) / (rho * ratio - 2 * ratio - 1)
  const margin = cutoff + MAX_PRESSURE_SHIFT_CM + 3 * topStepBoundCm
  const slice = sliceLineTableByWavenumber(lines, startCm - margin, endCm + margin)
  validateLineTable(slice)
  let referenceTemperatureK = options.referenceTemperatureK ?? 0
  if (options.referenceTemperatureK === null) {
    for (const layer of layers)
      referenceTemperatureK = Math.max(referenceTemperatureK, layer.meanTemperatureK)
    referenceTemperatureK += 30
  }
  const fluxPerArea = new Float64Array(slice.length)
  for (let i = 0; i < slice.length; i++) {
    fluxPerArea[i] =
      2 * Math.PI * planckRadianceWavenumber(slice.wavenumberCm[i], referenceTemperatureK)
  }
  return {
    startCm,
    endCm,
    options,
    coarseStepCm: coarseStepFor(options.unitCm, options.maxCoarseStepCm),
    slice,
    lookups: {
      partitionFunctionLookup: options.partitionFunctionLookup,
      molarMassLookup: options.molarMassLookup,
    },
    fluxPerArea,
  }
}

/** The line state of every slice row in one layer. */
export function adaptiveLayerLineState(
  setup: AdaptiveChunkSetup,
  layer: AtmosphereLayer,
): LayerLineState {
  const state = createLayerLineState(setup.slice.length)
  computeLayerLineState(setup.slice, layer, state, setup.lookups)
  return state
}

/** Scratch and running totals of `classifyLayerPairs` over the layers of a chunk. */
export interface PairClassification {
  bounds: Float64Array
  bins: Uint16Array
  binSums: Float64Array
  activeLineLayerCount: number
  significantLineLayerCount: number
  droppedLineLayerCount: number
  droppedFluxBoundWPerM2: number
  /** Per slice row: narrowest significant Voigt HWHM and the range of its shifted centres. */
  narrowestCm: Float64Array
  centreLoCm: Float64Array
  centreHiCm: Float64Array
}

export function createPairClassification(rowCount: number): PairClassification {
  return {
    bounds: new Float64Array(rowCount),
    bins: new Uint16Array(rowCount),
    binSums: new Float64Array(BOUND_BINS),
    activeLineLayerCount: 0,
    significantLineLayerCount: 0,
    droppedLineLayerCount: 0,
    droppedFluxBoundWPerM2: 0,
    narrowestCm: new Float64Array(rowCount).fill(Infinity),
    centreLoCm: new Float64Array(rowCount).fill(Infinity),
    centreHiCm: new Float64Array(rowCount).fill(-Infinity),
  }
}

/**
 * Flags of one layer's (line, layer) pairs — SIGNIFICANT (τ₀ ≥ ε), WEAK, or DROPPED (negligible,
 * within the layer's budget) — and the grid requirements of the significant ones.
 * Method: see the module comment. Source: as `computeAdaptiveChunkOpticalDepth`.
 */
export function classifyLayerPairs(
  setup: AdaptiveChunkSetup,
  state: LayerLineState,
  layer: AtmosphereLayer,
  totals: PairClassification,
): Uint8Array {
  const { options } = setup
  const n = state.length
  const { bounds } = totals
  totals.activeLineLayerCount += state.activeCount
  const flags = new Uint8Array(n)
  for (let i = 0; i < n; i++) {
    const strength = state.integratedOpticalDepthCm[i]
    if (!(strength > 0)) continue
    flags[i] = peakOpticalDepth(state, i) < options.significantPeakOpticalDepth ? WEAK : SIGNIFICANT
    bounds[i] = setup.fluxPerArea[i] * strength
  }
  const heatingToFlux = DRY_AIR_CP_J_PER_KG_K / (STANDARD_GRAVITY_M_PER_S2 * SECONDS_PER_DAY)
  const deltaPressurePa = Math.max(0, layer.pressureBottomPa - layer.pressureTopPa)
  const budget =
    (setup.endCm - setup.startCm) *
    Math.min(
      options.negligibleFluxWPerM2PerCm,
      options.negligibleHeatingKPerDayPerCm * heatingToFlux * deltaPressurePa,
    )
  totals.droppedFluxBoundWPerM2 += dropNegligiblePairs(
    bounds,
    totals.bins,
    flags,
    n,
    budget,
    totals.binSums,
  )
  for (let i = 0; i < n; i++) {
    if (flags[i] === DROPPED) {
      if (state.integratedOpticalDepthCm[i] > 0) totals.droppedLineLayerCount++
      continue
    }
    if (flags[i] !== SIGNIFICANT) continue
    totals.significantLineLayerCount++
    noteSignificantPair(totals, state, i)
  }
  return flags
}

/** Adds the width and centre of a significant pair to the grid requirements of its line. */
export function noteSignificantPair(
  totals: PairClassification,
  state: LayerLineState,
  row: number,
): void {
  const width = state.voigtHalfWidthCm[row]
  if (width < totals.narrowestCm[row]) totals.narrowestCm[row] = width
  const centre = state.centreCm[row]
  if (centre < totals.centreLoCm[row]) totals.centreLoCm[row] = centre
  if (centre > totals.centreHiCm[row]) totals.centreHiCm[row] = centre
}

/** True when the pair is resolved by the grid. */
export function isSignificantPair(flags: Uint8Array, row: number): boolean {
  return flags[row] === SIGNIFICANT
}

/** The adaptive grid of the chunk from the requirements of the lines significant somewhere. */
export function planChunkGrid(
  setup: AdaptiveChunkSetup,
  totals: PairClassification,
): AdaptiveSpectralGrid {
  const { narrowestCm, centreLoCm, centreHiCm } = totals
  const n = narrowestCm.length
  let count = 0
  for (let i = 0; i < n; i++) if (narrowestCm[i] < Infinity) count++
  const requirements = {
    count,
    centreCm: new Float64Array(count),
    spreadCm: new Float64Array(count),
    halfWidthCm: new Float64Array(count),
  }
  for (let i = 0, r = 0; i < n; i++) {
    if (!(narrowestCm[i] < Infinity)) continue
    requirements.centreCm[r] = 0.5 * (centreLoCm[i] + centreHiCm[i])
    requirements.spreadCm[r] = 0.5 * (centreHiCm[i] - centreLoCm[i])
    requirements.halfWidthCm[r] = narrowestCm[i]
    r++
  }
  return planAdaptiveGrid(requirements, {
    startCm: setup.startCm,
    endCm: setup.endCm,
    coarseStepCm: setup.coarseStepCm,
    minStepCm: setup.options.minStepCm,
    pointsPerHalfWidth: setup.options.pointsPerHalfWidth,
    gradingHalfWidths: setup.options.gradingHalfWidths,
  })
}

/** The masked multi-level workspace of a chunk's grid, reused for every layer deposit. */
export interface AdaptiveDepositor {
  setup: AdaptiveChunkSetup
  grid: AdaptiveSpectralGrid
  ws: MaskedMultigrid
  /** Grid spacing near each slice row (at its unshifted position), cm⁻¹. */
  stepNearLine: Float64Array
  /** Lines whose centre is outside [reachLoCm, reachHiCm] touch no masked node. */
  reachLoCm: number
  reachHiCm: number
  widenedLineLayerCount: number
}

export function createAdaptiveDepositor(
  setup: AdaptiveChunkSetup,
  grid: AdaptiveSpectralGrid,
): AdaptiveDepositor {
  const cutoff = setup.options.wingCutoffCm
  const ws = createMaskedMultigrid(
    setup.startCm,
    grid.baseStepCm,
    grid.refinementLevels,
    grid.nodeIndex,
    setup.options.coarseningRatio,
    setup.options.nearZoneCoarseSteps,
    cutoff,
  )
  const reach = cutoff + 3 * ws.stepCm[ws.levelCount - 1]
  const n = setup.slice.length
  // The ±5-point reach of localStepCm covers the pressure shift.
  const stepNearLine = new Float64Array(n)
  for (let i = 0; i < n; i++)
    stepNearLine[i] = localStepCm(grid.wavenumberCm, setup.slice.wavenumberCm[i])
  return {
    setup,
    grid,
    ws,
    stepNearLine,
    reachLoCm: setup.startCm - reach,
    reachHiCm: setup.endCm + reach,
    widenedLineLayerCount: 0,
  }
}

/**
 * Line optical depth of one layer at the grid points (no continuum): the selected rows of the
 * state with their flags, summed by the masked multi-level scheme into `out`.
 * `representation` (optional) replaces each line's Voigt HWHM where a discrete choice depends on
 * it — whether a weak line is widened, the level its core is evaluated on — so that a sweep's
 * reference amounts all represent a line the same way and its optical depth varies smoothly
 * between them.
 */
export function depositLayerLines(
  depositor: AdaptiveDepositor,
  state: LayerLineState,
  flags: Uint8Array,
  layerTemperatureK: number,
  selection: RowSelection,
  out: Float64Array,
  representation: LineRepresentation | null = null,
): void {
  const { ws, setup } = depositor
  clearMaskedAccumulators(ws)
  depositor.widenedLineLayerCount += depositLayer(
    ws,
    state,
    setup.slice.moleculeId,
    layerWingWeights(setup.options.lineWingWeights, layerTemperatureK),
    flags,
    depositor.stepNearLine,
    setup.options,
    depositor.reachLoCm,
    depositor.reachHiCm,
    selection,
    representation,
  )
  interpolateMaskedLevels(ws)
  extractMaskedPoints(ws, out)
}

/** Bookkeeping of a chunk computed from its setup, classification and depositor. */
export function adaptiveOpticsStats(
  depositor: AdaptiveDepositor,
  totals: PairClassification,
): AdaptiveOpticalDepthStats {
  const { grid, ws, setup } = depositor
  return {
    pointCount: grid.wavenumberCm.length,
    coarseStepCm: setup.coarseStepCm,
    finestStepCm: grid.baseStepCm,
    refinementLevels: grid.refinementLevels,
    levelCount: ws.levelCount,
    maskedNodeCount: maskedNodeCount(ws),
    lineCount: setup.slice.length,
    activeLineLayerCount: totals.activeLineLayerCount,
    significantLineLayerCount: totals.significantLineLayerCount,
    widenedLineLayerCount: depositor.widenedLineLayerCount,
    droppedLineLayerCount: totals.droppedLineLayerCount,
    droppedFluxBoundWPerM2: totals.droppedFluxBoundWPerM2,
    voigtEvaluations: ws.voigtEvaluations,
  }
}

/**
 * Vertical optical depth of every layer on the adaptive grid of one spectral chunk.
 *
 * Method: per layer k and line i the integrated optical depth A_ik, centre, widths
 * (`computeLayerLineState`) and peak optical depth τ₀ (`peakOpticalDepth`); pairs with τ₀ ≥ ε set
 * the grid (`planAdaptiveGrid` with the line's narrowest significant Voigt HWHM and the spread of
 * its shifted centres); weak pairs on a grid coarser than α_V/P get α_D → √(α_D² + s²); then
 * τ_k(ν) = Σ_i A_ik f_ik(ν − ν*_ik) by the masked multi-level summation, plus continuum hooks;
 * f_ik is multiplied by the far-wing weight χ(ν − ν*_ik, T_k) of the line's molecule beyond the
 * weight's onset when `lineWingWeights` has one (kinks of χ evaluated exactly for significant pairs).
 * Notes: see the module comment for the error budget (weak-pair widening ≲ 1.3ε of each weak
 * pair's absorption; multi-level summation as the uniform path). Deterministic: the same input
 * gives bit-identical output. Memory ≈ (chunk width / finest step) doubles of scratch per level
 * (untouched pages stay unallocated) plus layers × points for the output. Units: cm⁻¹, τ
 * dimensionless.
 * Source: Beer–Lambert optical depth, Goody & Yung 1989, Atmospheric Radiation, ch. 3–4; Voigt
 * function: Humlíček 1982, JQSRT 27, 437; convolution of Voigt and Gauss profiles: Armstrong 1967,
 * JQSRT 7, 61 (from memory); trapezoid-rule convergence: Trefethen & Weideman 2014, SIAM Rev. 56,
 * 385 (from memory).
 * @param input lines, layers, chunk bounds (cm⁻¹), options
 * @returns the grid, optical depth [layer][point] and stats
 */
export function computeAdaptiveChunkOpticalDepth(
  input: AdaptiveChunkOpticalDepthInput,
): AdaptiveChunkOpticalDepthResult {
  const setup = setupAdaptiveChunk(input)
  const { layers } = input
  const totals = createPairClassification(setup.slice.length)
  const states: LayerLineState[] = []
  const flags: Uint8Array[] = []
  for (const layer of layers) {
    const state = adaptiveLayerLineState(setup, layer)
    states.push(state)
    flags.push(classifyLayerPairs(setup, state, layer, totals))
  }
  const grid = planChunkGrid(setup, totals)
  const depositor = createAdaptiveDepositor(setup, grid)
  const opticalDepth: Float64Array[] = []
  for (let k = 0; k < layers.length; k++) {
    const tau = new Float64Array(grid.wavenumberCm.length)
    depositLayerLines(depositor, states[k], flags[k], layers[k].meanTemperatureK, null, tau)
    applyContinuumHooks(setup.options.continuum, grid.wavenumberCm, layers[k], k, tau)
    opticalDepth.push(tau)
  }
  return {
    grid,
    wavenumberCm: grid.wavenumberCm,
    opticalDepth,
    stats: adaptiveOpticsStats(depositor, totals),
  }
}
