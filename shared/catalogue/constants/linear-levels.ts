/**
 * Vibrational levels of the linear molecules of the built-in catalogue (CO2 626, 636, 628 and N2O
 * 446): term values, vibrational angular momentum, inversion symmetry, rotational constants B, D
 * and l-type doubling q. Data only. Used by the band generator (line positions, lower-state
 * energies) and by the partition functions (level sums).
 *
 * Energy convention (important). The published vibrational energies G_v of these molecules are
 * quoted so that the Q branch of a perpendicular band sits at ≈ G′ − G″ (e.g. the CO2 ν₂ Q branch
 * at 667.38 cm⁻¹, the 02201–01101 and 03301–02201 Q branches at 667.75 and 668.12 cm⁻¹), that is,
 * the −B l² term of the rotational energy is absorbed into G_v:
 *   E(v, J, e/f) = G_v + B_{e/f} J(J+1) − D [J(J+1) − l²]².
 * The generator writes this as term value T_v = G_v + B l² plus the textbook rotational energy
 * F(J) = B[J(J+1) − l²] − D[J(J+1) − l²]² (Herzberg 1945, Infrared and Raman Spectra, ch. IV;
 * from memory). For Π states B_e = B − q/2 and B_f = B + q/2 (q > 0: f above e).
 *
 * Accuracy (honest): G_v of the 626 levels are quoted to 1e-4 cm⁻¹ and reproduce the published
 * band centres to ≈0.01 cm⁻¹; 01101 was confirmed against an independent listing, the others are
 * recalled. B of the Σ levels 00001, 10001, 10002, 00011 agree to ≤ 1e-5 cm⁻¹ with a
 * least-squares fit to public line positions of the 10 µm laser bands (fit done while writing this
 * table: B(00011) = 0.387142, B(10001) = 0.390181, B(10002) = 0.390470 cm⁻¹), so laser-band lines
 * are placed within ≈0.005 cm⁻¹. B and q of the Π/Δ/Φ hot-band levels and of the 636/628/N2O
 * excited levels are recalled or scaled estimates (from memory, low confidence): expect
 * line-position errors growing to ~0.05–0.5 cm⁻¹ at J ≈ 60 in those bands.
 */
import type { ConfidenceTag } from './confidence'

/** Normal-mode quantum numbers of a level (used to exclude it from the harmonic remainder). */
export interface NormalModeQuanta {
  v1: number
  v2: number
  v3: number
}

/** One vibrational level of a linear molecule. */
export interface LinearVibrationalLevel {
  /** Label: AFGL v1 v2 l v3 r for CO2 (e.g. '01101'), v1 v2 l v3 for N2O (e.g. '0110'). */
  label: string
  /** Published vibrational energy G_v, cm⁻¹ (convention in the module comment). */
  energyCm: number
  /** Vibrational angular momentum quantum number l (0 Σ, 1 Π, 2 Δ, 3 Φ). */
  l: number
  /** Inversion symmetry g/u (meaningful only for centrosymmetric isotopologues). */
  inversion: 'g' | 'u'
  /** Rotational constant B (mean of e and f for Π levels), cm⁻¹. */
  rotationalConstantCm: number
  /** Quartic centrifugal distortion constant D, cm⁻¹. */
  centrifugalDistortionCm: number
  /** l-type doubling constant q = B_f − B_e, cm⁻¹ (Π levels; 0 otherwise). */
  lDoublingCm: number
  /** The normal-mode state this level stands for in a harmonic-oscillator count. */
  quanta: NormalModeQuanta
  /** Published source of the numbers. */
  source: string
  /** Confidence of B, D, q (the energy is usually better; see source). */
  confidence: ConfidenceTag
}

/** Constants of one linear isotopologue. */
export interface LinearIsotopologueConstants {
  /** Database molecule number (2 CO2, 4 N2O). */
  moleculeId: number
  /** Isotopologue number within the molecule (as in the isotopologue table). */
  isotopologueId: number
  /** Short code, e.g. '626'. */
  code: string
  /** Molecule name, e.g. 'CO2'. */
  molecule: string
  /**
   * True when inversion exchanges two identical spin-0 nuclei (¹⁶O¹²C¹⁶O, ¹⁶O¹³C¹⁶O): only
   * rotational levels symmetric under the exchange exist (half of them).
   */
  exchangeSymmetric: boolean
  /** Harmonic fundamentals ν₁, ν₂, ν₃ for the unlisted levels (partition function), cm⁻¹. */
  harmonicFundamentalsCm: { nu1: number; nu2: number; nu3: number }
  /** Listed vibrational levels; the first one is the ground state. */
  levels: readonly LinearVibrationalLevel[]
  /** Where the numbers come from. */
  source: string
}

const ROTHMAN_1992 = 'Rothman et al. 1992, JQSRT 48, 537 (CO2 levels and constants; from memory)'

function level(
  label: string,
  energyCm: number,
  l: number,
  inversion: 'g' | 'u',
  rotationalConstantCm: number,
  centrifugalDistortionCm: number,
  lDoublingCm: number,
  quanta: [number, number, number],
  source: string,
  confidence: ConfidenceTag,
): LinearVibrationalLevel {
  return {
    label,
    energyCm,
    l,
    inversion,
    rotationalConstantCm,
    centrifugalDistortionCm,
    lDoublingCm,
    quanta: { v1: quanta[0], v2: quanta[1], v3: quanta[2] },
    source,
    confidence,
  }
}

/** ¹⁶O¹²C¹⁶O (626): the levels of the polyads 2v₁ + v₂ + 3v₃ ≤ 3 (complete set). */
export const CO2_626_LEVELS = {
  L00001: level(
    '00001',
    0,
    0,
    'g',
    0.3902189,
    1.333e-7,
    0,
    [0, 0, 0],
    `${ROTHMAN_1992}; B₀ = 0.39021 also in Herzberg 1966, Electronic Spectra and Electronic Structure of Polyatomic Molecules`,
    'MEMORY',
  ),
  L01101: level(
    '01101',
    667.3799,
    1,
    'u',
    0.3909465,
    1.35e-7,
    6.15e-4,
    [0, 1, 0],
    `G = 667.3799 (confirmed against an independent listing), B_e = 0.390639, B_f = 0.391254, D: ${ROTHMAN_1992}`,
    'MEMORY-low',
  ),
  L10002: level(
    '10002',
    1285.4087,
    0,
    'g',
    0.39048,
    1.57e-7,
    0,
    [0, 2, 0],
    `${ROTHMAN_1992}; B, D agree with a fit to public 9.4 µm laser-band line positions`,
    'MEMORY',
  ),
  L02201: level(
    '02201',
    1335.1317,
    2,
    'g',
    0.39166,
    1.36e-7,
    0,
    [0, 2, 0],
    ROTHMAN_1992,
    'MEMORY-low',
  ),
  L10001: level(
    '10001',
    1388.1845,
    0,
    'g',
    0.39019,
    1.15e-7,
    0,
    [1, 0, 0],
    `${ROTHMAN_1992}; B, D agree with a fit to public 10.4 µm laser-band line positions`,
    'MEMORY',
  ),
  L11102: level(
    '11102',
    1932.4701,
    1,
    'u',
    0.3911,
    1.5e-7,
    6.0e-4,
    [0, 3, 0],
    `G: ${ROTHMAN_1992}; B ≈ 0.3911 recalled; D and q estimates (q as 01101)`,
    'MEMORY-low',
  ),
  L03301: level(
    '03301',
    2003.2462,
    3,
    'u',
    0.3923,
    1.4e-7,
    0,
    [0, 3, 0],
    `G: ${ROTHMAN_1992}; B ≈ 0.3923 recalled; D estimate`,
    'MEMORY-low',
  ),
  L11101: level(
    '11101',
    2076.8558,
    1,
    'u',
    0.3908,
    1.2e-7,
    6.0e-4,
    [1, 1, 0],
    `G: ${ROTHMAN_1992}; B ≈ 0.3908 recalled; D and q estimates (q as 01101)`,
    'MEMORY-low',
  ),
  L00011: level(
    '00011',
    2349.1429,
    0,
    'u',
    0.38714,
    1.33e-7,
    0,
    [0, 0, 1],
    `${ROTHMAN_1992}; B, D agree with a fit to public laser-band line positions (B = 0.387142)`,
    'MEMORY',
  ),
} as const

/** ¹⁶O¹³C¹⁶O (636). Levels above 00011 that are missing are covered by the harmonic remainder. */
export const CO2_636_LEVELS = {
  L00001: level(
    '00001',
    0,
    0,
    'g',
    0.39024,
    1.33e-7,
    0,
    [0, 0, 0],
    'B₀ from memory: ¹³C sits at the centre of mass, so B₀ differs from 626 only by vibrational averaging; D as 626',
    'MEMORY-low',
  ),
  L01101: level(
    '01101',
    648.4782,
    1,
    'u',
    0.39097,
    1.35e-7,
    6.3e-4,
    [0, 1, 0],
    'G: band centre 648.478 (Rothman et al. 1992, JQSRT 48, 537; from memory); B = B₀ + the 626 α₂ shift, q scaled from 626 (estimates)',
    'MEMORY-low',
  ),
  L10002: level(
    '10002',
    1265.829,
    0,
    'g',
    0.3904,
    1.5e-7,
    0,
    [0, 2, 0],
    'G from memory (isotopologue table of shared/physics); B, D estimates',
    'MEMORY-low',
  ),
  L02201: level(
    '02201',
    1297.264,
    2,
    'g',
    0.3917,
    1.36e-7,
    0,
    [0, 2, 0],
    'G from memory (isotopologue table of shared/physics); B, D estimates',
    'MEMORY-low',
  ),
  L10001: level(
    '10001',
    1370.063,
    0,
    'g',
    0.3902,
    1.2e-7,
    0,
    [1, 0, 0],
    'G from memory (isotopologue table of shared/physics); B, D estimates',
    'MEMORY-low',
  ),
  L00011: level(
    '00011',
    2283.4872,
    0,
    'u',
    0.38725,
    1.33e-7,
    0,
    [0, 0, 1],
    'G: ν₃ of ¹³CO₂ 2283.488 cm⁻¹ (A&A 2009, article aa11812, Table 1); B, D estimates (α₃ slightly below 626)',
    'MEMORY-low',
  ),
} as const

/** ¹⁶O¹²C¹⁸O (628): no inversion symmetry, all J exist. */
export const CO2_628_LEVELS = {
  L00001: level(
    '00001',
    0,
    0,
    'g',
    0.368184,
    1.12e-7,
    0,
    [0, 0, 0],
    'B₀ from memory; D scaled from 626 as (B ratio)³ (estimate)',
    'MEMORY-low',
  ),
  L01101: level(
    '01101',
    662.3734,
    1,
    'u',
    0.368832,
    1.13e-7,
    5.5e-4,
    [0, 1, 0],
    'G from memory (isotopologue table of shared/physics); B, q scaled from 626 as (B ratio)² (estimates)',
    'MEMORY-low',
  ),
  L10002: level(
    '10002',
    1259.426,
    0,
    'g',
    0.3684,
    1.3e-7,
    0,
    [0, 2, 0],
    'G from memory; B, D estimates (partition function only)',
    'MEMORY-low',
  ),
  L02201: level(
    '02201',
    1324.75,
    2,
    'g',
    0.3694,
    1.15e-7,
    0,
    [0, 2, 0],
    'G harmonic estimate (isotopologue table of shared/physics); B, D estimates (partition function only)',
    'MEMORY-low',
  ),
  L10001: level(
    '10001',
    1365.845,
    0,
    'g',
    0.3682,
    1.0e-7,
    0,
    [1, 0, 0],
    'G from memory; B, D estimates (partition function only)',
    'MEMORY-low',
  ),
  L00011: level(
    '00011',
    2332.1125,
    0,
    'u',
    0.36527,
    1.12e-7,
    0,
    [0, 0, 1],
    'G: ν₃ of ¹⁸OCO 2332.113 cm⁻¹ (A&A 2009, article aa11812, Table 1); B, D estimates',
    'MEMORY-low',
  ),
} as const

/** ¹⁴N₂¹⁶O (446): no inversion symmetry, all J exist. Labels v1 v2 l v3. */
export const N2O_446_LEVELS = {
  L0000: level(
    '0000',
    0,
    0,
    'g',
    0.4190113,
    1.76e-7,
    0,
    [0, 0, 0],
    'B₀ = 0.419011 and D from memory',
    'MEMORY',
  ),
  L0110: level(
    '0110',
    588.7678,
    1,
    'u',
    0.4196,
    1.78e-7,
    7.92e-4,
    [0, 1, 0],
    'G: 588.768 from memory (588.78 in the NBS wavenumber tables, PMC5325172, checked against the published text); B, q, D from memory',
    'MEMORY-low',
  ),
  L0200: level(
    '0200',
    1168.132,
    0,
    'g',
    0.4202,
    1.8e-7,
    0,
    [0, 2, 0],
    'G from memory; B, D estimates (partition function only)',
    'MEMORY-low',
  ),
  L0220: level(
    '0220',
    1177.745,
    2,
    'g',
    0.4202,
    1.8e-7,
    0,
    [0, 2, 0],
    'G from memory; B, D estimates (partition function only)',
    'MEMORY-low',
  ),
  L1000: level(
    '1000',
    1284.9033,
    0,
    'g',
    0.417255,
    1.74e-7,
    0,
    [1, 0, 0],
    'G: 1284.903, B and D from memory',
    'MEMORY-low',
  ),
  L1110: level(
    '1110',
    1880.266,
    1,
    'u',
    0.4178,
    1.75e-7,
    7.9e-4,
    [1, 1, 0],
    'G from memory; B, D, q estimates (partition function only)',
    'MEMORY-low',
  ),
  L0001: level(
    '0001',
    2223.7567,
    0,
    'u',
    0.415559,
    1.75e-7,
    0,
    [0, 0, 1],
    'G: 2223.756693 (quoted in Gimmler & Havenith 2002, J. Mol. Spectrosc. 216, 315); B, D from memory',
    'MEMORY-low',
  ),
} as const

/** The linear isotopologues of the built-in catalogue. */
export const LINEAR_ISOTOPOLOGUES: readonly LinearIsotopologueConstants[] = [
  {
    moleculeId: 2,
    isotopologueId: 1,
    code: '626',
    molecule: 'CO2',
    exchangeSymmetric: true,
    harmonicFundamentalsCm: { nu1: 1336.8, nu2: 667.38, nu3: 2349.14 },
    levels: Object.values(CO2_626_LEVELS),
    source: `${ROTHMAN_1992}; ν₁ for the harmonic remainder = mean of the Fermi dyad 10001/10002`,
  },
  {
    moleculeId: 2,
    isotopologueId: 2,
    code: '636',
    molecule: 'CO2',
    exchangeSymmetric: true,
    harmonicFundamentalsCm: { nu1: 1317.9, nu2: 648.48, nu3: 2283.49 },
    levels: Object.values(CO2_636_LEVELS),
    source: 'levels as listed per row; ν₁ for the harmonic remainder = mean of the Fermi dyad',
  },
  {
    moleculeId: 2,
    isotopologueId: 3,
    code: '628',
    molecule: 'CO2',
    exchangeSymmetric: false,
    harmonicFundamentalsCm: { nu1: 1312.6, nu2: 662.37, nu3: 2332.11 },
    levels: Object.values(CO2_628_LEVELS),
    source: 'levels as listed per row; ν₁ for the harmonic remainder = mean of the Fermi dyad',
  },
  {
    moleculeId: 4,
    isotopologueId: 1,
    code: '446',
    molecule: 'N2O',
    exchangeSymmetric: false,
    harmonicFundamentalsCm: { nu1: 1284.9, nu2: 588.77, nu3: 2223.76 },
    levels: Object.values(N2O_446_LEVELS),
    source: 'levels as listed per row (mostly from memory)',
  },
]
