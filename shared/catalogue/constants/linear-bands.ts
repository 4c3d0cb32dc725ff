/**
 * Vibrational bands of the linear molecules in the built-in catalogue: one row per band with its
 * upper and lower level (term values G, rotational constants B, D, l-doubling q, vibrational
 * angular momentum l — see `linear-levels.ts`), band type, band intensity at 296 K, optional
 * Herman–Wallis coefficients, broadening model, published source and confidence tag. Data only.
 *
 * Band intensity convention (public spectroscopic databases): S_band = Σ_lines S_line at 296 K, in
 * cm⁻¹/(molecule cm⁻²) = cm/molecule, INCLUDING the isotopic abundance. The generator normalises
 * the lines of each band so that they sum exactly to S_band.
 *
 * Accuracy (honest): the two strongest bands (CO2 ν₂ and ν₃) carry recalled values believed good
 * to ≈3–5 %; the laser bands are fitted to the 296 K Einstein A values of the public spectroscopic
 * database, 2020 edition (Gordon et al. 2022, JQSRT 277, 107949) (≈2 %); the first
 * hot bands are recalled or harmonic estimates (≈10–20 %); the second hot bands are
 * harmonic-oscillator estimates with an assumed Fermi mixing (factor ~2; the interference-weakened
 * 11101–10002 band uncertain by a factor ~5); isotopologue bands scale the 626 values (≈5–10 %);
 * N2O band intensities are recalled with low confidence (≈20–50 %).
 *
 * Harmonic estimates (computed here) use S_hot/S_fund = (U/2) e^{−c₂G″/T} (ν_hot/ν_fund)
 * [1 − e^{−c₂ν_hot/T}]/[1 − e^{−c₂ν_fund/T}] at T = 296 K, with U the squared bending-dipole matrix
 * elements of the 2-D harmonic oscillator summed over the lower l-components,
 * |⟨v+1, l±1|q±|v, l⟩|² ∝ (v ± l + 2)/2 (Herzberg 1945, Infrared and Raman Spectra, ch. II; from
 * memory), and for the Fermi dyads a mixing with cos²θ = 0.467 (the 02⁰0 character of 10002 implied
 * by the adopted 10002–01101/10001–01101 intensity ratio), taken equal for the 11101/11102 dyad.
 * Isotopologue rows scale the 626 band by the abundance ratio, by the G-matrix ratio of the
 * symmetry block (Crawford's isotope rule; Wilson, Decius & Cross 1955, Molecular Vibrations,
 * ch. 7; from memory), by Q_vib(626)/Q_vib(iso) and by the stimulated-emission ratio.
 */
import type { ConfidenceTag } from './confidence'
import { CO2_BROADENING, N2O_BROADENING, type LinearBroadeningModel } from './linear-broadening'
import {
  CO2_626_LEVELS as C626,
  CO2_628_LEVELS as C628,
  CO2_636_LEVELS as C636,
  N2O_446_LEVELS as N446,
  type LinearVibrationalLevel,
} from './linear-levels'

/** Herman–Wallis factor F(m) = (1 + a₁ m + a₂ m²)² applied to P and R lines (Q lines: F = 1). */
export interface HermanWallisCoefficients {
  a1: number
  a2: number
}

/** One vibrational band of a linear molecule. */
export interface LinearBandConstants {
  /** Stable identifier, e.g. 'co2-626-01101-00001'. */
  id: string
  /** Database molecule number (2 CO2, 4 N2O). */
  moleculeId: number
  /** Isotopologue number within the molecule. */
  isotopologueId: number
  /** Isotopologue code, e.g. '626'. */
  isotopologueCode: string
  /** Short description for listings. */
  description: string
  /** Upper vibrational level. */
  upper: LinearVibrationalLevel
  /** Lower vibrational level. */
  lower: LinearVibrationalLevel
  /** Parallel (Δl = 0, Σ–Σ: P and R only) or perpendicular (Δl = ±1: P, Q, R). */
  type: 'parallel' | 'perpendicular'
  /** Band intensity at 296 K including abundance, cm/molecule. */
  bandIntensityCmPerMolecule: number
  /** Herman–Wallis coefficients, when known. */
  hermanWallis?: HermanWallisCoefficients
  /** Pressure-broadening model. */
  broadening: LinearBroadeningModel
  /** Published source of the band intensity (and of any Herman–Wallis coefficients). */
  source: string
  /** Confidence of the band intensity. */
  confidence: ConfidenceTag
}

/** Band origin ν₀ = G′ − G″ in the published convention (≈ Q-branch origin), cm⁻¹. */
export function bandOriginCm(band: LinearBandConstants): number {
  return band.upper.energyCm - band.lower.energyCm
}

const HARMONIC =
  'harmonic-oscillator estimate computed here from the 626 ν₂ band (method in the module comment)'
const FERMI = `${HARMONIC}, with the assumed Fermi mixing cos²θ = 0.467 in both dyads`
const LASER =
  'computed here: S_band and Herman–Wallis a₁, a₂ fitted to the 296 K Einstein A values of the public spectroscopic database, 2020 edition (Gordon et al. 2022, JQSRT 277, 107949), for J ≤ 103, from a public data excerpt of that list; the measurements behind them: Devi, Benner, Smith, Brown & Dulick 2003, JQSRT 76, 393'
const ISOTOPE =
  'computed here: 626 band scaled by abundance, G-matrix ratio, Q_vib and stimulated emission'

function co2(
  code: '626' | '636' | '628',
  upper: LinearVibrationalLevel,
  lower: LinearVibrationalLevel,
  bandIntensityCmPerMolecule: number,
  description: string,
  source: string,
  confidence: ConfidenceTag,
  hermanWallis?: HermanWallisCoefficients,
): LinearBandConstants {
  const isotopologueId = { '626': 1, '636': 2, '628': 3 }[code]
  return {
    id: `co2-${code}-${upper.label}-${lower.label}`,
    moleculeId: 2,
    isotopologueId,
    isotopologueCode: code,
    description,
    upper,
    lower,
    type: upper.l === lower.l ? 'parallel' : 'perpendicular',
    bandIntensityCmPerMolecule,
    hermanWallis,
    broadening: CO2_BROADENING,
    source,
    confidence,
  }
}

function n2o(
  upper: LinearVibrationalLevel,
  lower: LinearVibrationalLevel,
  bandIntensityCmPerMolecule: number,
  description: string,
  source: string,
  confidence: ConfidenceTag,
): LinearBandConstants {
  return {
    id: `n2o-446-${upper.label}-${lower.label}`,
    moleculeId: 4,
    isotopologueId: 1,
    isotopologueCode: '446',
    description,
    upper,
    lower,
    type: upper.l === lower.l ? 'parallel' : 'perpendicular',
    bandIntensityCmPerMolecule,
    broadening: N2O_BROADENING,
    source,
    confidence,
  }
}

/** The linear-molecule bands of the built-in catalogue, in a fixed order. */
export const LINEAR_BANDS: readonly LinearBandConstants[] = [
  co2(
    '626',
    C626.L01101,
    C626.L00001,
    7.9e-18,
    'CO2 ν₂ fundamental (15 µm)',
    'from memory (≈48 km/mol); the Einstein A it implies, 1.52 s⁻¹ (computed here), is close to the 1.3–1.5 s⁻¹ quoted in the literature (from memory)',
    'MEMORY',
  ),
  co2(
    '626',
    C626.L02201,
    C626.L01101,
    6.2e-19,
    'CO2 first hot band 02201–01101',
    `from memory; ${HARMONIC} gives 6.17e-19`,
    'MEMORY',
  ),
  co2(
    '626',
    C626.L10002,
    C626.L01101,
    1.4e-19,
    'CO2 hot band 10002–01101 (618 cm⁻¹)',
    'from memory, low confidence; harmonic sum of the two Fermi partners 3.1e-19',
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L10001,
    C626.L01101,
    1.9e-19,
    'CO2 hot band 10001–01101 (721 cm⁻¹)',
    'from memory, low confidence; harmonic sum of the two Fermi partners 3.1e-19',
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L03301,
    C626.L02201,
    3.6e-20,
    'CO2 second hot band 03301–02201',
    `${HARMONIC} gives 3.60e-20`,
    'COMPUTED',
  ),
  co2(
    '626',
    C626.L11102,
    C626.L02201,
    4.94e-21,
    'CO2 second hot band 11102–02201 (597 cm⁻¹)',
    FERMI,
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L11101,
    C626.L02201,
    7.19e-21,
    'CO2 second hot band 11101–02201 (742 cm⁻¹)',
    FERMI,
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L11102,
    C626.L10002,
    2.1e-20,
    'CO2 second hot band 11102–10002 (647 cm⁻¹)',
    FERMI,
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L11101,
    C626.L10001,
    1.43e-20,
    'CO2 second hot band 11101–10001 (689 cm⁻¹)',
    FERMI,
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L11101,
    C626.L10002,
    7.9e-22,
    'CO2 second hot band 11101–10002 (791 cm⁻¹)',
    `${FERMI}; destructive interference makes this value uncertain by a factor ~5 (~5e-21 from memory)`,
    'MEMORY-low',
  ),
  co2(
    '626',
    C626.L00011,
    C626.L10001,
    5.84e-22,
    'CO2 10.4 µm laser band 00011–10001',
    LASER,
    'COMPUTED',
    { a1: -6.71e-4, a2: -1.34e-5 },
  ),
  co2(
    '626',
    C626.L00011,
    C626.L10002,
    9.01e-22,
    'CO2 9.4 µm laser band 00011–10002',
    LASER,
    'COMPUTED',
    { a1: -3.04e-4, a2: 1.34e-5 },
  ),
  co2(
    '626',
    C626.L00011,
    C626.L00001,
    9.6e-17,
    'CO2 ν₃ fundamental (4.3 µm)',
    'from memory (9.5–9.7e-17, ≈550 km/mol)',
    'MEMORY',
  ),
  co2(
    '636',
    C636.L01101,
    C636.L00001,
    8.28e-20,
    '¹³CO₂ ν₂ fundamental',
    `${ISOTOPE} (G ratio 0.944); scaling by abundance alone gives ≈8.8e-20`,
    'COMPUTED',
  ),
  co2(
    '636',
    C636.L00011,
    C636.L00001,
    1.01e-18,
    '¹³CO₂ ν₃ fundamental',
    `${ISOTOPE} (G ratio 0.944) from the 626 ν₃ value 9.6e-17`,
    'COMPUTED',
  ),
  co2(
    '628',
    C628.L01101,
    C628.L00001,
    3.11e-20,
    '¹⁶O¹²C¹⁸O ν₂ fundamental',
    `${ISOTOPE} (G ratio 0.985)`,
    'COMPUTED',
  ),
  n2o(
    N446.L0110,
    N446.L0000,
    9.0e-19,
    'N2O ν₂ fundamental (17 µm)',
    'from memory (≈24 cm⁻² atm⁻¹ at STP, i.e. ≈5.6 km/mol; another recollection gives 5–10e-19, low confidence); primary: Toth 1984, Appl. Opt. 23, 1825 and Landolt–Börnstein II/20 B3 (not at hand)',
    'MEMORY-low',
  ),
  n2o(
    N446.L1000,
    N446.L0000,
    9.0e-18,
    'N2O ν₁ fundamental (7.8 µm)',
    'from memory (≈240 cm⁻² atm⁻¹ at STP, ≈50–58 km/mol; another recollection gives ≈1e-17, low confidence); primary: Toth 1984, Appl. Opt. 23, 1825 (not at hand)',
    'MEMORY-low',
  ),
  n2o(
    N446.L0001,
    N446.L0000,
    5.0e-17,
    'N2O ν₃ fundamental (4.5 µm)',
    'from memory (≈275 km/mol; strongest lines ≈1e-18; another recollection gives ≈1e-16, low confidence — the two recollections differ by 2×); primary: Landolt–Börnstein II/20 B3 (not at hand)',
    'MEMORY-low',
  ),
]
