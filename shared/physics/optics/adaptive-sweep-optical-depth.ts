/**
 * Layer optical depths of the members of a concentration sweep — runs that differ only in the
 * amount of one gas — on one shared adaptive grid, with the work that does not depend on the
 * swept gas done once.
 *
 * DESIGN
 *
 * Optical depth is a sum over lines, τ_k(ν) = τ_k,other(ν) + τ_k,swept(ν), and only the second
 * term changes between members. The lines of the swept gas depend on its amount in two ways:
 * their integrated optical depth A = S(T)·u grows in proportion to the layer column u, and their
 * Lorentz half width γ = (296/T)ⁿ p [γ_air (1 − x) + γ_self x] is linear in the mixing ratio x
 * (self-broadening). So per unit column the swept gas's optical depth F_k(ν; x) = τ_k,swept / u
 * depends on x only through the widths, and only slightly: the relative width change over a
 * sweep is s = Δx |γ_self − γ_air| / γ, ≈ 2e-3 for CO₂ from 100 to 6400 ppmv.
 *
 * Per layer the sweep therefore computes
 * - the other gases once, with the continuum terms that do not read the swept gas (their line
 *   states do not depend on it: the members' layers are checked to be identical in everything
 *   else, bit for bit);
 * - F_k at a few reference mixing ratios spread over [x_min, x_max] — as many pieces as keep the
 *   width change of each piece within s_max = 6e-3 — and each member's F_k by linear
 *   interpolation in x, τ_k,swept = u_m · F_k(x_m). The interpolation error of a line shape is
 *   ≤ (s²/8)·max|∂²f/∂γ²|·γ², which for a Lorentz core (the worst case, γ²f''/f = 2 at the centre)
 *   is s²/4 ≤ 1e-5 of the local optical depth, a hundred times below the adaptive method's own
 *   error (≈ 1e-3 τ). For this to hold, every reference represents a line the same way: the
 *   discrete choices of the deposit (widening a weak line, the level of its core) follow the
 *   narrowest width any reference gives it. What remains pointwise are the fast Voigt function's
 *   region switches, ≈ 1e-4 relative (its own accuracy); integrals of τ agree to ≈ 1e-6.
 *   When the references would be as many as the members' distinct amounts, the references are
 *   those amounts and nothing is interpolated.
 *
 * One grid and one classification serve every member, taken at the largest amount in each layer
 * (the "envelope"): a pair significant for any member is resolved for all (τ₀ grows with u), the
 * grid keeps the narrowest width of every reference, and pairs are dropped as negligible by the
 * envelope's budget, so each member's dropped flux bound — smaller than the envelope's, as its
 * bounds are — stays within its budget. Every member is thus computed at least as finely as its
 * own run would be; members agree with independent runs within the adaptive method's tolerances
 * (tests/unit/physics/engine/sweep.test.ts).
 *
 * Cost: the other gases once, the swept gas at 1–3 reference amounts (instead of once per member),
 * the interpolation per member (layers × points multiply-adds). For an 8-member CO₂ sweep in the
 * 15 µm band the optics cost ≈ 2.3 runs' optics instead of 8; the transfer stays per member
 * (engine/compute-sweep.ts shares its Planck radiances).
 */
import { PhysicsError, assertFiniteInRange } from '../errors'
import { MOLECULE_IDS } from '../spectroscopy'
import type { LineTable } from '../spectroscopy'
import { GAS_IDS, type AtmosphereLayer, type GasId } from '../types'
import {
  adaptiveLayerLineState,
  adaptiveOpticsStats,
  classifyLayerPairs,
  createAdaptiveDepositor,
  createPairClassification,
  depositLayerLines,
  isSignificantPair,
  noteSignificantPair,
  planChunkGrid,
  representedVoigtHalfWidthCm,
  setupAdaptiveChunk,
  type AdaptiveChunkSetup,
  type AdaptiveDepositor,
  type LineRepresentation,
  type AdaptiveOpticalDepthStats,
  type AdaptiveOpticsOptions,
  type PairClassification,
} from './adaptive-optical-depth'
import type { AdaptiveSpectralGrid } from './adaptive-grid'
import { applyContinuumHooks, continuumHookReadsGas } from './continuum'
import type { LayerLineState } from './layer-line-state'

/**
 * Largest relative change of a swept line's Lorentz width within one interpolation piece; keeps
 * the interpolation error of the line shapes ≤ s²/4 ≈ 1e-5 of the optical depth (see above).
 */
export const MAX_PIECE_WIDTH_SPREAD = 6e-3

/** Input of `computeAdaptiveSweepOpticalDepth`. */
export interface AdaptiveSweepOpticalDepthInput {
  /** Line table sorted by wavenumber; the whole table may be passed. */
  lines: LineTable
  /** The layers of every member (≥ 1 member), index 0 at the surface; equal except for the swept gas. */
  memberLayers: readonly (readonly AtmosphereLayer[])[]
  /** The gas whose amount differs between members. */
  sweptGas: GasId
  /** Chunk bounds, cm⁻¹, as `computeAdaptiveChunkOpticalDepth`. */
  startCm: number
  endCm: number
  options?: AdaptiveOpticsOptions
  /**
   * Largest relative width change of the swept lines per interpolation piece (default
   * MAX_PIECE_WIDTH_SPREAD; 0 computes every distinct amount exactly).
   */
  maxPieceWidthSpread?: number
}

/** Bookkeeping of a sweep chunk: the shared optics plus the reference deposits of the swept gas. */
export interface AdaptiveSweepOpticalDepthStats extends AdaptiveOpticalDepthStats {
  memberCount: number
  /** Layer deposits of the swept gas (Σ over layers of its reference amounts). */
  sweptGasLayerDeposits: number
  /** Largest relative width change of a swept line over one interpolation piece (0 when exact). */
  largestPieceWidthSpread: number
}

/** Output of `computeAdaptiveSweepOpticalDepth` (the optical depths go to the visitor). */
export interface AdaptiveSweepOpticalDepthResult {
  grid: AdaptiveSpectralGrid
  stats: AdaptiveSweepOpticalDepthStats
}

/**
 * Receives member m's optical depth [layer][point] on the shared grid; the arrays are reused for
 * the next member.
 */
export type SweepMemberVisitor = (
  member: number,
  opticalDepth: readonly Float64Array[],
  shared: AdaptiveSweepOpticalDepthResult,
) => void

const LAYER_NUMBER_FIELDS = [
  'pressureBottomPa',
  'pressureTopPa',
  'heightBottomM',
  'heightTopM',
  'meanPressurePa',
  'meanTemperatureK',
  'airColumnMoleculesPerCm2',
] as const

/**
 * Why the members' layers cannot share optical depths, or null when they can: they must have the
 * same layers, identical in everything but the swept gas's column and mixing ratio.
 * Method: exact comparison of every field. Source: — (bookkeeping).
 */
export function sweepLayersDifference(
  memberLayers: readonly (readonly AtmosphereLayer[])[],
  sweptGas: GasId,
): string | null {
  const first = memberLayers[0]
  for (let m = 1; m < memberLayers.length; m++) {
    const layers = memberLayers[m]
    if (layers.length !== first.length)
      return `member ${m} has ${layers.length} layers, member 0 has ${first.length}`
    for (let k = 0; k < layers.length; k++) {
      const a = first[k]
      const b = layers[k]
      for (const field of LAYER_NUMBER_FIELDS) {
        if (a[field] !== b[field]) return `layer ${k} of member ${m} differs in ${field}`
      }
      for (const gas of GAS_IDS) {
        if (gas === sweptGas) continue
        if (
          (a.gasColumnMoleculesPerCm2[gas] ?? 0) !== (b.gasColumnMoleculesPerCm2[gas] ?? 0) ||
          (a.meanVmr[gas] ?? 0) !== (b.meanVmr[gas] ?? 0)
        ) {
          return `layer ${k} of member ${m} differs in its ${gas}`
        }
      }
    }
  }
  return null
}

/** Reference amounts of the swept gas in one layer, and each member's weights on them. */
interface LayerReferences {
  states: LayerLineState[]
  /** weights[m] lists (reference index, coefficient) pairs: τ_swept,m = Σ c·τ_ref. */
  weights: { reference: number; coefficient: number }[][]
  pieceSpread: number
}

/** The layer with the swept gas at column `columnPerCm2` and mixing ratio `vmr`. */
function withSweptAmount(
  layer: AtmosphereLayer,
  gas: GasId,
  columnPerCm2: number,
  vmr: number,
): AtmosphereLayer {
  return {
    ...layer,
    gasColumnMoleculesPerCm2: { ...layer.gasColumnMoleculesPerCm2, [gas]: columnPerCm2 },
    meanVmr: { ...layer.meanVmr, [gas]: vmr },
  }
}

/** Largest relative difference of the swept rows' Lorentz widths between two states. */
function widthSpread(a: LayerLineState, b: LayerLineState, rows: Int32Array): number {
  let spread = 0
  for (const i of rows) {
    const lo = Math.min(a.lorentzHalfWidthCm[i], b.lorentzHalfWidthCm[i])
    if (!(lo > 0)) continue
    const s = Math.abs(a.lorentzHalfWidthCm[i] - b.lorentzHalfWidthCm[i]) / lo
    if (s > spread) spread = s
  }
  return spread
}

/**
 * Chooses the reference amounts of one layer and computes their line states at the envelope's
 * column: the members' distinct mixing ratios when they are few, else the ends of [x_min, x_max]
 * and enough points between them that each piece changes the swept widths by ≤ MAX_PIECE_WIDTH_SPREAD.
 */
function layerReferences(
  setup: AdaptiveChunkSetup,
  envelope: AtmosphereLayer,
  envelopeState: LayerLineState,
  gas: GasId,
  memberLayers: readonly (readonly AtmosphereLayer[])[],
  k: number,
  sweptRows: Int32Array,
  maxPieceWidthSpread: number,
): LayerReferences {
  const columnUnit = envelope.gasColumnMoleculesPerCm2[gas] ?? 0
  const vmrs = memberLayers.map((layers) => layers[k].meanVmr[gas] ?? 0)
  const columns = memberLayers.map((layers) => layers[k].gasColumnMoleculesPerCm2[gas] ?? 0)
  if (!(columnUnit > 0)) {
    return { states: [], weights: vmrs.map(() => []), pieceSpread: 0 }
  }
  // At the envelope's own mixing ratio the reference is the envelope layer itself.
  const stateAt = (vmr: number) =>
    vmr === envelope.meanVmr[gas]
      ? envelopeState
      : adaptiveLayerLineState(setup, withSweptAmount(envelope, gas, columnUnit, vmr))
  const distinct = [...new Set(vmrs)].sort((a, b) => a - b)
  const lo = distinct[0]
  const hi = distinct[distinct.length - 1]
  const ends = distinct.length > 1 ? [stateAt(lo), stateAt(hi)] : [stateAt(lo)]
  const spread = ends.length > 1 ? widthSpread(ends[0], ends[1], sweptRows) : 0
  const pieces = spread > 0 ? Math.max(1, Math.ceil(spread / maxPieceWidthSpread)) : 1
  if (pieces + 1 >= distinct.length) {
    // Exact: one reference per distinct amount.
    const states = distinct.map((vmr, r) =>
      r === 0 ? ends[0] : r === distinct.length - 1 ? ends[1] : stateAt(vmr),
    )
    const weights = vmrs.map((vmr, m) => [
      { reference: distinct.indexOf(vmr), coefficient: columns[m] / columnUnit },
    ])
    return { states, weights, pieceSpread: 0 }
  }
  const amounts = Array.from({ length: pieces + 1 }, (_, r) =>
    r === pieces ? hi : lo + ((hi - lo) * r) / pieces,
  )
  const states = amounts.map((vmr, r) =>
    r === 0 ? ends[0] : r === pieces ? ends[1] : stateAt(vmr),
  )
  const weights = vmrs.map((vmr, m) => {
    const scale = columns[m] / columnUnit
    const r = Math.min(pieces - 1, Math.floor(((vmr - lo) / (hi - lo)) * pieces))
    const t = (vmr - amounts[r]) / (amounts[r + 1] - amounts[r])
    return [
      { reference: r, coefficient: (1 - t) * scale },
      { reference: r + 1, coefficient: t * scale },
    ]
  })
  return { states, weights, pieceSpread: spread / pieces }
}

/**
 * How every reference amount represents the swept lines of a layer: the discrete choices
 * (widening a weak line, the level of its core) follow the narrowest width any reference gives
 * the line, so the references differ only in smooth ways and interpolating between them is
 * accurate (otherwise a core switching level between two references would differ by the
 * multi-level method's own error, ≈ 1e-3 of the peak).
 */
function sharedRepresentation(
  depositor: AdaptiveDepositor,
  states: readonly LayerLineState[],
  flags: Uint8Array,
  sweptRows: Int32Array,
): LineRepresentation {
  const n = depositor.setup.slice.length
  const conditionHalfWidthCm = new Float64Array(n).fill(Infinity)
  const coreHalfWidthCm = new Float64Array(n).fill(Infinity)
  const P = depositor.setup.options.pointsPerHalfWidth
  for (const state of states) {
    for (const i of sweptRows)
      conditionHalfWidthCm[i] = Math.min(conditionHalfWidthCm[i], state.voigtHalfWidthCm[i])
  }
  for (const state of states) {
    for (const i of sweptRows) {
      const width = representedVoigtHalfWidthCm(
        flags[i],
        conditionHalfWidthCm[i],
        state,
        i,
        depositor.stepNearLine[i],
        P,
      )
      coreHalfWidthCm[i] = Math.min(coreHalfWidthCm[i], width)
    }
  }
  return { conditionHalfWidthCm, coreHalfWidthCm }
}

/**
 * Optical depths of every member of a sweep on one adaptive grid, handed to `visit` member by
 * member (the arrays are reused, so the visitor must use them before it returns).
 *
 * Method: see the module comment — shared grid and pair classification from the largest amount
 * per layer; other gases deposited once; the swept gas deposited at 1 to a few reference mixing
 * ratios per layer at the envelope column and combined per member, τ_k,m = τ_k,other +
 * (u_k,m/u_k,env)·Σ_r w_r(x_k,m) τ_k,r (w linear interpolation weights, or 1 on the member's own
 * amount); continuum terms that do not read the swept gas are added once to τ_other, the others
 * per member. Notes: throws INVALID_ARGUMENT when the members'
 * layers differ in more than the swept gas (`sweepLayersDifference`). Deterministic. Memory: the
 * other gases, the references and one member's optical depths, each layers × points doubles.
 * Source: additivity of absorption coefficients over lines and the linear pressure broadening
 * γ = (296/T)ⁿ[γ_air(p − p_s) + γ_self p_s] (Rothman et al. 1998, JQSRT 60, 665, appendix;
 * from memory); linear-interpolation error bound (Burden & Faires, Numerical Analysis, thm. 3.3;
 * from memory).
 */
export function computeAdaptiveSweepOpticalDepth(
  input: AdaptiveSweepOpticalDepthInput,
  visit: SweepMemberVisitor,
): AdaptiveSweepOpticalDepthResult {
  const { memberLayers, sweptGas } = input
  if (!Array.isArray(memberLayers) || memberLayers.length === 0) {
    throw new PhysicsError('INVALID_ARGUMENT', 'a sweep needs at least one member')
  }
  if (!GAS_IDS.includes(sweptGas)) {
    throw new PhysicsError('INVALID_ARGUMENT', `unknown swept gas "${String(sweptGas)}"`, {
      sweptGas,
    })
  }
  const maxPieceWidthSpread = input.maxPieceWidthSpread ?? MAX_PIECE_WIDTH_SPREAD
  assertFiniteInRange('maxPieceWidthSpread', maxPieceWidthSpread, 0, 1)
  const difference = sweepLayersDifference(memberLayers, sweptGas)
  if (difference) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      `sweep members must differ only in ${sweptGas}: ${difference}`,
    )
  }
  const firstLayers = memberLayers[0]
  const setup = setupAdaptiveChunk({ ...input, layers: firstLayers })
  const moleculeId = MOLECULE_IDS[sweptGas]
  const n = setup.slice.length
  const sweptRowList: number[] = []
  for (let i = 0; i < n; i++) if (setup.slice.moleculeId[i] === moleculeId) sweptRowList.push(i)
  const sweptRows = Int32Array.from(sweptRowList)

  const totals: PairClassification = createPairClassification(n)
  const envelopeStates: LayerLineState[] = []
  const flags: Uint8Array[] = []
  const references: LayerReferences[] = []
  for (let k = 0; k < firstLayers.length; k++) {
    let envelopeMember = 0
    for (let m = 1; m < memberLayers.length; m++) {
      const column = memberLayers[m][k].gasColumnMoleculesPerCm2[sweptGas] ?? 0
      if (column > (memberLayers[envelopeMember][k].gasColumnMoleculesPerCm2[sweptGas] ?? 0))
        envelopeMember = m
    }
    const envelope = memberLayers[envelopeMember][k]
    const state = adaptiveLayerLineState(setup, envelope)
    const layerFlags = classifyLayerPairs(setup, state, envelope, totals)
    const layerRefs = layerReferences(
      setup,
      envelope,
      state,
      sweptGas,
      memberLayers,
      k,
      sweptRows,
      maxPieceWidthSpread,
    )
    // The grid resolves the narrowest width any reference gives a significant swept line.
    for (const refState of layerRefs.states) {
      for (const i of sweptRows)
        if (isSignificantPair(layerFlags, i)) noteSignificantPair(totals, refState, i)
    }
    envelopeStates.push(state)
    flags.push(layerFlags)
    references.push(layerRefs)
  }

  const grid = planChunkGrid(setup, totals)
  const depositor = createAdaptiveDepositor(setup, grid)
  const pointCount = grid.wavenumberCm.length
  // Continuum terms that do not read the swept gas are added once, to the other gases' part.
  const memberHooks = setup.options.continuum.filter((hook) =>
    continuumHookReadsGas(hook, sweptGas),
  )
  const sharedHooks = setup.options.continuum.filter(
    (hook) => !continuumHookReadsGas(hook, sweptGas),
  )
  const others: Float64Array[] = []
  const referenceDepths: Float64Array[][] = []
  let sweptGasLayerDeposits = 0
  let largestPieceWidthSpread = 0
  for (let k = 0; k < firstLayers.length; k++) {
    const temperatureK = firstLayers[k].meanTemperatureK
    const tau = new Float64Array(pointCount)
    depositLayerLines(
      depositor,
      envelopeStates[k],
      flags[k],
      temperatureK,
      { moleculeId, only: false },
      tau,
    )
    applyContinuumHooks(sharedHooks, grid.wavenumberCm, firstLayers[k], k, tau)
    others.push(tau)
    const refs = references[k]
    const representation = sharedRepresentation(depositor, refs.states, flags[k], sweptRows)
    referenceDepths.push(
      refs.states.map((state) => {
        const out = new Float64Array(pointCount)
        depositLayerLines(
          depositor,
          state,
          flags[k],
          temperatureK,
          { moleculeId, only: true },
          out,
          representation,
        )
        return out
      }),
    )
    sweptGasLayerDeposits += refs.states.length
    largestPieceWidthSpread = Math.max(largestPieceWidthSpread, refs.pieceSpread)
    refs.states.length = 0 // the states are no longer needed
  }
  envelopeStates.length = 0

  const shared: AdaptiveSweepOpticalDepthResult = {
    grid,
    stats: {
      ...adaptiveOpticsStats(depositor, totals),
      memberCount: memberLayers.length,
      sweptGasLayerDeposits,
      largestPieceWidthSpread,
    },
  }
  const member = firstLayers.map(() => new Float64Array(pointCount))
  for (let m = 0; m < memberLayers.length; m++) {
    for (let k = 0; k < firstLayers.length; k++) {
      const tau = member[k]
      tau.set(others[k])
      for (const { reference, coefficient } of references[k].weights[m]) {
        if (coefficient === 0) continue
        const ref = referenceDepths[k][reference]
        for (let p = 0; p < pointCount; p++) tau[p] += coefficient * ref[p]
      }
      applyContinuumHooks(memberHooks, grid.wavenumberCm, memberLayers[m][k], k, tau)
    }
    visit(m, member, shared)
  }
  return shared
}
