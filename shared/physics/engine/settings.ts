/**
 * Settings of one line-by-line calculation, with defaults and validation. These are the knobs an
 * analyst sets on a run; everything else follows from the profile and the line list.
 */
import { PhysicsError } from '../errors'
import type { AngleQuadratureSpec } from '../transfer/quadrature'
import type { LayerSourceMode } from '../transfer/schwarzschild'

export interface ComputeSettings {
  /** Spectral range, cm⁻¹. */
  startCm: number
  endCm: number
  /** Width of one spectral chunk (the unit of parallel work), cm⁻¹. Must be a multiple of the output resolution. */
  chunkWidthCm: number
  /** Width of the bins of stored spectral output, cm⁻¹ (e.g. 1 or 0.1). */
  outputResolutionCm: number
  /** Lines contribute up to this distance from their centre, cm⁻¹. */
  wingCutoffCm: number
  /** Grid points per narrowest Voigt half width of the 'uniform' and 'reference' methods. */
  pointsPerHalfWidth: number
  /** Angular quadrature for fluxes. */
  quadrature: AngleQuadratureSpec
  /** Source function inside a layer. */
  layerSource: LayerSourceMode
  /** Water-vapour continuum on/off (Roberts et al. 1976 form, 650–1300 cm⁻¹; see physics/continuum). */
  waterVapourContinuum: boolean
  /** Sub-Lorentzian far wings of CO₂ lines (χ factor, Perrin & Hartmann 1989; default on): each
   * CO₂ line's profile is multiplied by χ beyond 3 cm⁻¹ up to the common wing cutoff. */
  co2SubLorentzianWings: boolean
  /**
   * How each chunk is sampled in wavenumber (default 'adaptive'): 'adaptive' refines a coarse grid
   * only near lines that are optically significant in some layer; 'uniform' uses one fine grid tied
   * to the narrowest line of any layer (steps of pointsPerHalfWidth); 'reference' is 'uniform' with
   * brute-force optics (every line summed at every point) — slow, for checks on narrow windows.
   */
  spectralMethod?: SpectralMethod
  /** Tuning of the 'adaptive' method (defaults are the tested ones). */
  adaptive?: AdaptiveGridSettings
  /**
   * A window kept at the calculation's own spectral grid (no bin averaging), for line shapes and
   * comparison with measured spectra; inside [startCm, endCm], at most MAX_DETAIL_WINDOW_WIDTH_CM wide.
   */
  detailWindow?: DetailWindow | null
}

/** Wavenumber window of the full-resolution output, cm⁻¹. */
export interface DetailWindow {
  startCm: number
  endCm: number
}

/**
 * Widest full-resolution window, cm⁻¹. The adaptive grid has up to ≈ 1 500 points per cm⁻¹ in the
 * strongest bands of the built-in catalogue at 60 layers, so 100 cm⁻¹ stays below ≈ 150 000 points.
 */
export const MAX_DETAIL_WINDOW_WIDTH_CM = 100

/** Spectral sampling of a chunk; see `ComputeSettings.spectralMethod`. */
export type SpectralMethod = 'adaptive' | 'uniform' | 'reference'

/**
 * Tuning of the adaptive spectral grid (see optics/adaptive-optical-depth.ts for the method and
 * its error budget). Unset fields take the defaults of the optics, which keep fluxes within
 * ≈ 2e-3 W m⁻² and heating rates within ≈ 3e-4 K/day of the fine-grid paths over 10–3000 cm⁻¹.
 */
export interface AdaptiveGridSettings {
  /** Peak optical depth of a line in a layer from which the grid resolves it (default 1e-3). */
  significantPeakOpticalDepth?: number
  /** Grid points per Voigt HWHM at the centre of a significant line (default 1.5). */
  pointsPerHalfWidth?: number
  /** Half widths over which the fine step is kept before it grows with distance (default 4). */
  gradingHalfWidths?: number
  /** Largest grid step, cm⁻¹ (default 1/16; the step is the bin width / 2^k). */
  maxCoarseStepCm?: number
  /** Budget of dropped negligible lines for fluxes, W m⁻² per cm⁻¹ (default 3e-6; 0 = keep all). */
  negligibleFluxWPerM2PerCm?: number
  /** Budget of dropped negligible lines for heating rates, K/day per cm⁻¹ per layer (default 5e-7). */
  negligibleHeatingKPerDayPerCm?: number
}

const ADAPTIVE_LIMITS: Record<keyof AdaptiveGridSettings, [number, number]> = {
  significantPeakOpticalDepth: [0, 1],
  pointsPerHalfWidth: [1, 20],
  gradingHalfWidths: [1, 100],
  maxCoarseStepCm: [1e-4, 1],
  negligibleFluxWPerM2PerCm: [0, 1e-3],
  negligibleHeatingKPerDayPerCm: [0, 1e-3],
}

export const DEFAULT_COMPUTE_SETTINGS: ComputeSettings = {
  startCm: 10,
  endCm: 3000,
  // Each chunk also sets up the lines whose wings reach it (±wingCutoffCm), so wider chunks repeat
  // less of that work: 20 cm⁻¹ is ≈ 14 % faster than 10 over 10–3000 cm⁻¹ and still gives 150
  // chunks to spread over workers (docs/PERFORMANCE.md).
  chunkWidthCm: 20,
  outputResolutionCm: 1,
  wingCutoffCm: 25,
  pointsPerHalfWidth: 4,
  quadrature: { kind: 'gauss-legendre', nodes: 3 },
  layerSource: 'linear-in-tau',
  waterVapourContinuum: true,
  co2SubLorentzianWings: true,
  spectralMethod: 'adaptive',
}

/** Fills defaults and checks consistency; throws PhysicsError naming the bad setting. */
export function resolveComputeSettings(partial: Partial<ComputeSettings> = {}): ComputeSettings {
  const s: ComputeSettings = { ...DEFAULT_COMPUTE_SETTINGS, ...partial }
  const bad = (field: string, message: string) => {
    throw new PhysicsError('INVALID_ARGUMENT', `${field}: ${message}`, { field })
  }
  if (!(s.startCm >= 0.1 && s.startCm < s.endCm)) bad('startCm', 'must be ≥ 0.1 and below endCm')
  if (!(s.endCm <= 50_000)) bad('endCm', 'must be ≤ 50 000 cm⁻¹')
  if (!(s.outputResolutionCm >= 0.001 && s.outputResolutionCm <= 100)) {
    bad('outputResolutionCm', 'must be between 0.001 and 100 cm⁻¹')
  }
  if (!(s.chunkWidthCm >= s.outputResolutionCm && s.chunkWidthCm <= 500)) {
    bad('chunkWidthCm', 'must be at least the output resolution and at most 500 cm⁻¹')
  }
  const binsPerChunk = s.chunkWidthCm / s.outputResolutionCm
  if (Math.abs(binsPerChunk - Math.round(binsPerChunk)) > 1e-9) {
    bad('chunkWidthCm', 'must be a whole multiple of outputResolutionCm')
  }
  const bins = (s.endCm - s.startCm) / s.outputResolutionCm
  if (Math.abs(bins - Math.round(bins)) > 1e-6) {
    bad('endCm', 'the range must be a whole number of output bins')
  }
  if (!(s.wingCutoffCm > 0 && s.wingCutoffCm <= 500))
    bad('wingCutoffCm', 'must be in (0, 500] cm⁻¹')
  if (!(s.pointsPerHalfWidth >= 1 && s.pointsPerHalfWidth <= 20)) {
    bad('pointsPerHalfWidth', 'must be between 1 and 20')
  }
  const method = s.spectralMethod ?? 'adaptive'
  if (method !== 'adaptive' && method !== 'uniform' && method !== 'reference') {
    bad('spectralMethod', "must be 'adaptive', 'uniform' or 'reference'")
  }
  s.spectralMethod = method
  if (s.adaptive !== undefined) {
    if (typeof s.adaptive !== 'object' || s.adaptive === null) bad('adaptive', 'must be an object')
    const adaptive = { ...s.adaptive }
    for (const key of Object.keys(adaptive) as (keyof AdaptiveGridSettings)[]) {
      const limits = ADAPTIVE_LIMITS[key]
      if (!limits) bad('adaptive', `unknown setting '${String(key)}'`)
      const value = adaptive[key]
      if (value === undefined) continue
      if (!(typeof value === 'number' && value >= limits[0] && value <= limits[1])) {
        bad(`adaptive.${key}`, `must be a number in [${limits[0]}, ${limits[1]}]`)
      }
    }
    s.adaptive = adaptive
  }
  if (s.detailWindow != null) {
    const w = s.detailWindow
    if (typeof w !== 'object' || !Number.isFinite(w.startCm) || !Number.isFinite(w.endCm)) {
      bad('detailWindow', 'must be an object with numeric startCm and endCm')
    }
    if (!(w.startCm >= s.startCm && w.endCm <= s.endCm && w.startCm < w.endCm)) {
      bad('detailWindow', `must lie inside the run's range ${s.startCm}–${s.endCm} cm⁻¹ and start below its end`)
    }
    if (w.endCm - w.startCm > MAX_DETAIL_WINDOW_WIDTH_CM) {
      bad('detailWindow', `must be at most ${MAX_DETAIL_WINDOW_WIDTH_CM} cm⁻¹ wide`)
    }
    s.detailWindow = { startCm: w.startCm, endCm: w.endCm }
  } else {
    delete s.detailWindow
  }
  return s
}
