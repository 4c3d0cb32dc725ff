/**
 * Per-layer line state: everything the optical-depth kernels need about each line in one
 * homogeneous layer, precomputed once per (layer, chunk) as a struct of typed arrays.
 *
 * For line i in a layer with Curtis–Godson mean pressure p and temperature T:
 * - integrated optical depth A_i = S_i(T) · u_g (cm⁻¹): intensity scaled to T times the layer
 *   column u_g of the line's gas, so that τ(ν) = Σ_i A_i f_i(ν − ν*_i);
 * - pressure-shifted centre ν*_i = ν_i + δ_i p;
 * - Doppler HWHM α_D,i and Lorentz HWHM γ_i = (296/T)ⁿ [γ_air (p − p_self) + γ_self p_self] with
 *   p_self = x_g p from the layer's mean mixing ratio of the line's gas;
 * - Voigt HWHM (Olivero–Longbothum approximation), used to choose grid steps.
 * Lines of a molecule that the engine does not know, or whose gas is absent from the layer
 * (no column or zero column), get A_i = 0 and are skipped by the kernels.
 */
import { STANDARD_ATMOSPHERE_PA } from '../constants'
import { PhysicsError, assertFiniteInRange } from '../errors'
import {
  MOLECULE_IDS,
  defaultPartitionFunctionLookup,
  dopplerHalfWidths,
  isotopologueMolarMassGPerMol,
  lorentzHalfWidths,
  pressureShiftedWavenumbers,
  scaleLineIntensities,
  voigtHalfWidthCm,
  type LineTable,
  type MolarMassLookup,
  type PartitionFunction,
  type PartitionFunctionLookup,
} from '../spectroscopy'
import { GAS_IDS, type AtmosphereLayer, type GasId } from '../types'

/** Struct-of-arrays state of the lines of one table in one layer (row i = table row i). */
export interface LayerLineState {
  /** Number of rows in use (= the line table length of the last `computeLayerLineState`). */
  length: number
  /** Number of rows with a positive integrated optical depth. */
  activeCount: number
  /** Pressure-shifted line centre ν*, cm⁻¹. */
  centreCm: Float64Array
  /** Integrated optical depth A = S(T)·u of the line in the layer, cm⁻¹ (0 = skip). */
  integratedOpticalDepthCm: Float64Array
  /** Doppler HWHM α_D, cm⁻¹ (0 for rows of absent gases). */
  dopplerHalfWidthCm: Float64Array
  /** Lorentz HWHM γ, cm⁻¹ (0 for rows of absent gases). */
  lorentzHalfWidthCm: Float64Array
  /** Approximate Voigt HWHM, cm⁻¹ (0 for rows of absent gases). */
  voigtHalfWidthCm: Float64Array
}

/** Optional physics look-ups used to build a layer line state. */
export interface LayerLineStateOptions {
  /** Partition function per isotopologue (default: the approximate table functions). */
  partitionFunctionLookup?: PartitionFunctionLookup
  /** Molar mass per isotopologue, g mol⁻¹ (default: the isotopologue table). */
  molarMassLookup?: MolarMassLookup
}

/** Largest accepted |δ p| (pressure shift of a line in a layer), cm⁻¹; see `computeLayerLineState`. */
export const MAX_PRESSURE_SHIFT_CM = 1

const GAS_BY_MOLECULE_ID: ReadonlyMap<number, GasId> = new Map(
  GAS_IDS.map((gas) => [MOLECULE_IDS[gas], gas] as [number, GasId]),
)

/**
 * The engine's gas of a database molecule number (1 H2O, 2 CO2, 3 O3, 4 N2O, 6 CH4), or undefined
 * for molecules the engine does not model.
 * Source: molecule numbering of the public spectroscopic databases (Rothman et al. 1998, JQSRT 60,
 * 665, Table 1; from memory), as `MOLECULE_IDS`.
 */
export function gasIdOfMolecule(moleculeId: number): GasId | undefined {
  return GAS_BY_MOLECULE_ID.get(moleculeId)
}

/** Allocates a state with room for `capacity` lines (all arrays zero). */
export function createLayerLineState(capacity: number): LayerLineState {
  if (!Number.isInteger(capacity) || capacity < 0) {
    throw new PhysicsError('INVALID_ARGUMENT', 'capacity must be a non-negative integer', {
      capacity,
    })
  }
  return {
    length: 0,
    activeCount: 0,
    centreCm: new Float64Array(capacity),
    integratedOpticalDepthCm: new Float64Array(capacity),
    dopplerHalfWidthCm: new Float64Array(capacity),
    lorentzHalfWidthCm: new Float64Array(capacity),
    voigtHalfWidthCm: new Float64Array(capacity),
  }
}

/** Throws unless the layer's mean state and gas amounts are usable by the optics. */
export function validateLayerForOptics(layer: AtmosphereLayer, layerIndex = 0): void {
  const where = `layer ${layerIndex}`
  if (!(Number.isFinite(layer.meanPressurePa) && layer.meanPressurePa >= 0)) {
    throw new PhysicsError('OUT_OF_RANGE', `${where}: meanPressurePa must be finite and ≥ 0`, {
      layerIndex,
      value: layer.meanPressurePa,
    })
  }
  if (!(Number.isFinite(layer.meanTemperatureK) && layer.meanTemperatureK > 0)) {
    throw new PhysicsError('OUT_OF_RANGE', `${where}: meanTemperatureK must be finite and > 0`, {
      layerIndex,
      value: layer.meanTemperatureK,
    })
  }
  for (const gas of GAS_IDS) {
    const column = layer.gasColumnMoleculesPerCm2[gas]
    if (column !== undefined && !(Number.isFinite(column) && column >= 0)) {
      throw new PhysicsError('OUT_OF_RANGE', `${where}: column of ${gas} must be finite and ≥ 0`, {
        layerIndex,
        gas,
        value: column,
      })
    }
    const vmr = layer.meanVmr[gas]
    if (vmr !== undefined && !(Number.isFinite(vmr) && vmr >= 0 && vmr <= 1)) {
      throw new PhysicsError('OUT_OF_RANGE', `${where}: mean vmr of ${gas} must be in [0, 1]`, {
        layerIndex,
        gas,
        value: vmr,
      })
    }
  }
}

const UNIT_PARTITION_FUNCTION: PartitionFunction = () => 1

/**
 * Fills `state` with the per-line quantities of `lines` in `layer`.
 *
 * Method (per line i of gas g, layer mean pressure p in atm, temperature T):
 *   A_i = S_i(T) · u_g,  S_i(T) by `scaleLineIntensities` (partition-function ratio, Boltzmann
 *   factor, stimulated emission), u_g = layer column of g (molecule cm⁻²);
 *   ν*_i = ν_i + δ_i p;  α_D,i by `dopplerHalfWidths`;
 *   γ_i = (296/T)ⁿ [γ_air,i (p − x_g p) + γ_self,i x_g p], x_g = layer mean vmr of g;
 *   α_V,i = 0.5346 γ_i + √(0.2166 γ_i² + α_D,i²).
 * Notes: the layer is described by its air-weighted Curtis–Godson mean p and T (the same for all
 * gases). Lines whose molecule is not an engine gas, or whose gas has no (or zero) column in the
 * layer, get A_i = 0; their look-ups are not called, so unknown isotopologues of absent gases do no
 * harm. Every computed value is checked finite (PhysicsError otherwise), and |δ_i p| must not
 * exceed MAX_PRESSURE_SHIFT_CM (the margin the chunked optics keep for shifted lines).
 * Units: cm⁻¹ for all outputs.
 * Sources: intensity and width formulas as in `scaleLineIntensities`, `lorentzHalfWidths`,
 * `dopplerHalfWidths` (Rothman et al. 1998, JQSRT 60, 665, Appendix; from memory);
 * Beer–Lambert optical depth as the product of absorption cross-section and column, Goody & Yung
 * 1989, Atmospheric Radiation, 2nd ed., §1.2 and ch. 3 (from memory); Voigt width: Olivero &
 * Longbothum 1977, JQSRT 17, 233 (from memory).
 * @param lines line table (validated rows, e.g. from `toLineTable`)
 * @param layer homogeneous layer (Curtis–Godson means, columns, mean mixing ratios)
 * @param state output, capacity ≥ lines.length (see `createLayerLineState`)
 * @param options partition-function and molar-mass look-ups
 */
export function computeLayerLineState(
  lines: LineTable,
  layer: AtmosphereLayer,
  state: LayerLineState,
  options: LayerLineStateOptions = {},
): void {
  validateLayerForOptics(layer)
  const n = lines.length
  if (state.centreCm.length < n) {
    throw new PhysicsError('INVALID_ARGUMENT', 'layer line state is smaller than the line table', {
      capacity: state.centreCm.length,
      lineCount: n,
    })
  }
  const pressureAtm = layer.meanPressurePa / STANDARD_ATMOSPHERE_PA
  const temperatureK = layer.meanTemperatureK
  const partitionLookup = options.partitionFunctionLookup ?? defaultPartitionFunctionLookup
  const molarMassLookup = options.molarMassLookup ?? isotopologueMolarMassGPerMol

  // Column (molecule cm⁻²) and partial pressure (atm) by molecule number; 0 = absent.
  let maxMoleculeId = 0
  for (let i = 0; i < n; i++)
    if (lines.moleculeId[i] > maxMoleculeId) maxMoleculeId = lines.moleculeId[i]
  const columnByMolecule = new Float64Array(maxMoleculeId + 1)
  const selfPressureByMolecule = new Float64Array(maxMoleculeId + 1)
  for (const gas of GAS_IDS) {
    const id = MOLECULE_IDS[gas]
    if (id > maxMoleculeId) continue
    columnByMolecule[id] = layer.gasColumnMoleculesPerCm2[gas] ?? 0
    selfPressureByMolecule[id] = Math.min(pressureAtm, (layer.meanVmr[gas] ?? 0) * pressureAtm)
  }
  const active = (moleculeId: number): boolean => columnByMolecule[moleculeId] > 0

  state.length = n
  state.activeCount = 0
  if (n === 0) return
  const strength = state.integratedOpticalDepthCm
  const doppler = state.dopplerHalfWidthCm
  const lorentz = state.lorentzHalfWidthCm
  const centre = state.centreCm
  const voigt = state.voigtHalfWidthCm

  // Look-ups are only consulted for present gases: inactive rows get placeholder values that are
  // overwritten below.
  scaleLineIntensities(lines, temperatureK, strength, (moleculeId, isotopologueId) =>
    active(moleculeId) ? partitionLookup(moleculeId, isotopologueId) : UNIT_PARTITION_FUNCTION,
  )
  dopplerHalfWidths(lines, temperatureK, doppler, (moleculeId, isotopologueId) =>
    active(moleculeId) ? molarMassLookup(moleculeId, isotopologueId) : 1,
  )
  lorentzHalfWidths(lines, pressureAtm, selfPressureByMolecule, temperatureK, lorentz)
  pressureShiftedWavenumbers(lines, pressureAtm, centre)

  let activeCount = 0
  for (let i = 0; i < n; i++) {
    const moleculeId = lines.moleculeId[i]
    if (!active(moleculeId)) {
      strength[i] = 0
      doppler[i] = 0
      lorentz[i] = 0
      voigt[i] = 0
      centre[i] = lines.wavenumberCm[i]
      continue
    }
    strength[i] *= columnByMolecule[moleculeId]
    const shift = centre[i] - lines.wavenumberCm[i]
    if (!(Math.abs(shift) <= MAX_PRESSURE_SHIFT_CM)) {
      throw new PhysicsError(
        'OUT_OF_RANGE',
        `line at ${lines.wavenumberCm[i]} cm⁻¹: pressure shift ${shift} cm⁻¹ exceeds ${MAX_PRESSURE_SHIFT_CM} cm⁻¹`,
        { row: i, shiftCm: shift },
      )
    }
    assertFiniteInRange('integratedOpticalDepthCm', strength[i], 0, Infinity)
    assertFiniteInRange('dopplerHalfWidthCm', doppler[i], Number.MIN_VALUE, Infinity)
    assertFiniteInRange('lorentzHalfWidthCm', lorentz[i], 0, Infinity)
    voigt[i] = voigtHalfWidthCm(doppler[i], lorentz[i])
    if (strength[i] > 0) activeCount++
  }
  state.activeCount = activeCount
}
