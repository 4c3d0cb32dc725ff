/**
 * Line-by-line synthesis of one vibration–rotation band of a linear molecule from its constants.
 */
import { C2_CM_K, LINE_REFERENCE_TEMPERATURE_K } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import { getIsotopologue } from '../../physics/spectroscopy/isotopologue-lookup'
import type { SpectralLine } from '../../physics/spectroscopy/line'
import { evaluateBroadening } from '../constants/linear-broadening'
import type { LinearBandConstants } from '../constants/linear-bands'
import { einsteinAFromIntensity } from './einstein-a'
import { honlLondonFactor, type BranchDeltaJ } from './honl-london'
import { findLinearIsotopologue, linearPartitionFunction } from './partition-function'
import { rovibrationalEnergyCm, sublevelParities, type RotationalParity } from './rotational-energy'
import { nuclearSpinWeight } from './spin-statistics'

/** Options of the band synthesis. */
export interface LinearBandOptions {
  /** Largest lower-state J″ considered (default 120). */
  maxLowerJ?: number
  /** Lines weaker than this fraction of the band's strongest line are dropped (default 1e-6). */
  relativeIntensityCutoff?: number
}

/** Default options of the band synthesis. */
export const LINEAR_BAND_DEFAULTS = { maxLowerJ: 120, relativeIntensityCutoff: 1e-6 } as const

/** One synthesised transition with its quantum numbers. */
export interface LinearTransition {
  /** J″. */
  lowerJ: number
  /** J′. */
  upperJ: number
  /** Branch ΔJ = J′ − J″ (−1 P, 0 Q, +1 R). */
  deltaJ: BranchDeltaJ
  /** e/f parity of the lower level. */
  lowerParity: RotationalParity
  /** e/f parity of the upper level. */
  upperParity: RotationalParity
  /** Hönl–London factor used (pair factor times the e/f share). */
  honlLondon: number
  /** The line record. */
  line: SpectralLine
}

const BRANCH_LETTER: Record<BranchDeltaJ, string> = { [-1]: 'P', 0: 'Q', 1: 'R' }

interface Candidate {
  lowerJ: number
  upperJ: number
  deltaJ: BranchDeltaJ
  lowerParity: RotationalParity
  upperParity: RotationalParity
  honlLondon: number
  wavenumberCm: number
  lowerStateEnergyCm: number
  weight: number
}

/**
 * Synthesises the lines of one band of a linear molecule, normalised to its band intensity.
 *
 * Method:
 * - Levels (`rovibrationalEnergyCm`): E = G_v + B_p l² + F(J),
 *   F(J) = B_p[J(J+1) − l²] − D[J(J+1) − l²]²;
 *   ν = E′ − E″.
 * - Selection rules: ΔJ = 0, ±1 (no J = 0 → 0); P and R keep the e/f label, Q changes it (parity
 *   + ↔ −); Σ⁺ levels have only e sublevels; nuclear-spin weights of `nuclearSpinWeight` remove
 *   the missing levels of ¹⁶O¹²C¹⁶O and ¹⁶O¹³C¹⁶O (odd J of the Σg⁺ ground state, etc.).
 * - Relative intensity at T = 296 K:
 *   w = L(J″) s exp(−c₂E″/T) ν [1 − exp(−c₂ν/T)] F(m),
 *   L the Hönl–London factor of the (e + f) pair (`honlLondonFactor`), s = 1/2 when both levels
 *   have l > 0 (the pair factor is shared by the e→e/f and f→f/e paths) and 1 otherwise,
 *   F(m) = (1 + a₁m + a₂m²)² the Herman–Wallis factor of P and R lines (m = J″ + 1 for R, −J″ for
 *   P; none for Q). Lines with w below `relativeIntensityCutoff` × max w, or J″ > `maxLowerJ`, are
 *   dropped.
 * - Normalisation: S_i = S_band w_i / Σ w, so Σ S_i = S_band (to rounding, ~1e-15 relative).
 * - Einstein A from S (`einsteinAFromIntensity`) with g′ = g_i (2J′+1), Q(296) from
 *   `linearPartitionFunction`; lower-state energy E″ in cm⁻¹ above the ground level.
 * - Broadening: γ_air, γ_self, n from the band's model at |m| (J″ + 1 for R, J″ for P and Q).
 * Notes: the rotational distribution is that of the rigid-rotor-with-distortion levels in LTE at
 * 296 K; the absolute scale comes only from S_band. Position accuracy is that of the constants
 * (≤ 0.01 cm⁻¹ for the CO2 626 fundamentals and laser bands at low J, see the level table);
 * intensity accuracy of individual lines ≈ that of S_band plus ≲ 5 % from missing Herman–Wallis
 * factors (bands without coefficients).
 * Source: line-intensity synthesis from band intensities as in Rothman et al. 1992, JQSRT 48, 537
 * (from memory) and Toth 1984, Appl. Opt. 23, 1825 (F-factor form checked against the published
 * abstract).
 * @param band band constants
 * @param options J″ limit and relative cutoff
 */
export function generateLinearBandTransitions(
  band: LinearBandConstants,
  options: LinearBandOptions = {},
): LinearTransition[] {
  const maxLowerJ = options.maxLowerJ ?? LINEAR_BAND_DEFAULTS.maxLowerJ
  const cutoff = options.relativeIntensityCutoff ?? LINEAR_BAND_DEFAULTS.relativeIntensityCutoff
  assertFiniteInRange('maxLowerJ', maxLowerJ, 0, 500)
  assertFiniteInRange('relativeIntensityCutoff', cutoff, 0, 1)
  assertFiniteInRange(
    'bandIntensityCmPerMolecule',
    band.bandIntensityCmPerMolecule,
    Number.MIN_VALUE,
    1e-10,
  )
  const isotopologue = findLinearIsotopologue(band.moleculeId, band.isotopologueId)
  if (!isotopologue) {
    throw new PhysicsError('UNSUPPORTED', `no linear-molecule constants for band ${band.id}`, {
      moleculeId: band.moleculeId,
      isotopologueId: band.isotopologueId,
    })
  }
  const { lower, upper } = band
  const deltaL = upper.l - lower.l
  if (Math.abs(deltaL) > 1 || (band.type === 'parallel') !== (deltaL === 0)) {
    throw new PhysicsError(
      'UNSUPPORTED',
      `band ${band.id}: Δl = ${deltaL} with type ${band.type}`,
      {
        id: band.id,
        deltaL,
      },
    )
  }
  const temperatureK = LINE_REFERENCE_TEMPERATURE_K
  const c2OverT = C2_CM_K / temperatureK
  const share = lower.l > 0 && upper.l > 0 ? 0.5 : 1
  const upperHasF = upper.l > 0

  const candidates: Candidate[] = []
  for (let lowerJ = lower.l; lowerJ <= maxLowerJ; lowerJ++) {
    for (const lowerParity of sublevelParities(lower)) {
      if (nuclearSpinWeight(isotopologue, lower, lowerJ, lowerParity) === 0) continue
      const lowerStateEnergyCm = rovibrationalEnergyCm(lower, lowerJ, lowerParity)
      for (const deltaJ of [-1, 0, 1] as const) {
        const upperJ = lowerJ + deltaJ
        if (upperJ < upper.l || (deltaJ === 0 && lowerJ === 0)) continue
        const upperParity: RotationalParity =
          deltaJ === 0 ? (lowerParity === 'e' ? 'f' : 'e') : lowerParity
        if (upperParity === 'f' && !upperHasF) continue
        if (nuclearSpinWeight(isotopologue, upper, upperJ, upperParity) === 0) continue
        const honlLondon = honlLondonFactor(deltaJ, lowerJ, lower.l, deltaL) * share
        if (honlLondon <= 0) continue
        const wavenumberCm = rovibrationalEnergyCm(upper, upperJ, upperParity) - lowerStateEnergyCm
        if (!(wavenumberCm > 0)) {
          throw new PhysicsError('OUT_OF_RANGE', `band ${band.id}: non-positive line position`, {
            lowerJ,
            deltaJ,
            wavenumberCm,
          })
        }
        const m = deltaJ === 1 ? lowerJ + 1 : -lowerJ
        const hw = band.hermanWallis
        const hermanWallis = hw && deltaJ !== 0 ? (1 + hw.a1 * m + hw.a2 * m * m) ** 2 : 1
        const weight =
          honlLondon *
          Math.exp(-c2OverT * (lowerStateEnergyCm - lower.energyCm)) *
          wavenumberCm *
          -Math.expm1(-c2OverT * wavenumberCm) *
          hermanWallis
        candidates.push({
          lowerJ,
          upperJ,
          deltaJ,
          lowerParity,
          upperParity,
          honlLondon,
          wavenumberCm,
          lowerStateEnergyCm,
          weight,
        })
      }
    }
  }
  let maxWeight = 0
  for (const c of candidates) maxWeight = Math.max(maxWeight, c.weight)
  const kept = candidates.filter((c) => c.weight >= cutoff * maxWeight && c.weight > 0)
  if (kept.length === 0) {
    throw new PhysicsError('OUT_OF_RANGE', `band ${band.id} produced no lines`, { id: band.id })
  }
  let weightSum = 0
  for (const c of kept) weightSum += c.weight

  const record = getIsotopologue(band.moleculeId, band.isotopologueId)
  const gi = record.stateIndependentDegeneracy
  const q296 = linearPartitionFunction(isotopologue)(temperatureK)
  const transitions = kept.map((c): LinearTransition => {
    const intensity = (band.bandIntensityCmPerMolecule * c.weight) / weightSum
    const upperWeight = gi * (2 * c.upperJ + 1)
    const absM = c.deltaJ === 1 ? c.lowerJ + 1 : c.lowerJ
    const widths = evaluateBroadening(band.broadening, absM)
    const branch = BRANCH_LETTER[c.deltaJ]
    const line: SpectralLine = {
      moleculeId: band.moleculeId,
      isotopologueId: band.isotopologueId,
      wavenumberCm: c.wavenumberCm,
      intensityCmPerMolecule: intensity,
      einsteinAPerS: einsteinAFromIntensity(
        intensity,
        c.wavenumberCm,
        c.lowerStateEnergyCm,
        upperWeight,
        record.abundance,
        q296,
        temperatureK,
      ),
      airHalfWidthCmPerAtm: widths.airHalfWidthCmPerAtm,
      selfHalfWidthCmPerAtm: widths.selfHalfWidthCmPerAtm,
      lowerStateEnergyCm: c.lowerStateEnergyCm,
      temperatureExponentAir: widths.temperatureExponentAir,
      pressureShiftCmPerAtm: band.broadening.pressureShiftCmPerAtm,
      upperGlobalQuanta: upper.label,
      lowerGlobalQuanta: lower.label,
      upperLocalQuanta: `${c.upperJ}${c.upperParity}`,
      lowerLocalQuanta: `${branch}${c.lowerJ}${c.lowerParity}`,
      upperStatisticalWeight: upperWeight,
      lowerStatisticalWeight: gi * (2 * c.lowerJ + 1),
    }
    return {
      lowerJ: c.lowerJ,
      upperJ: c.upperJ,
      deltaJ: c.deltaJ,
      lowerParity: c.lowerParity,
      upperParity: c.upperParity,
      honlLondon: c.honlLondon,
      line,
    }
  })
  transitions.sort(
    (a, b) =>
      a.line.wavenumberCm - b.line.wavenumberCm || a.lowerJ - b.lowerJ || a.deltaJ - b.deltaJ,
  )
  return transitions
}

/** The line records of `generateLinearBandTransitions` (sorted by wavenumber). */
export function generateLinearBandLines(
  band: LinearBandConstants,
  options: LinearBandOptions = {},
): SpectralLine[] {
  return generateLinearBandTransitions(band, options).map((t) => t.line)
}
