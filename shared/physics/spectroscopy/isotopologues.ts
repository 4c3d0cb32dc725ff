/**
 * Main isotopologues of the gases Tauline knows: abundance, molar mass, total internal partition
 * function at 296 K and a short list of low vibrational levels. Data only.
 *
 * Sources:
 * - Rows marked `tableVerified`: the isotopologue table of the public spectroscopic database,
 *   Gordon et al. 2022, JQSRT 277, 107949 (abundance, molar mass, Q(296), g_i).
 * - H2O 181, 171, 162: abundance, Q(296) and g_i from the same table, recalled from memory;
 *   molar masses computed from the atomic masses of the 2016 Atomic Mass Evaluation (Wang et al.
 *   2017, Chinese Phys. C 41, 030003; values from memory).
 * - Vibrational levels: band origins from the literature as named per row, from memory unless
 *   stated; "harmonic estimate" marks levels placed at a multiple of the fundamental.
 */

/** One vibrational level (or a lumped manifold) of an isotopologue. */
export interface VibrationalLevel {
  /** Term value above the ground state, cm⁻¹. */
  energyCm: number
  /** Vibrational degeneracy (number of states). */
  degeneracy: number
}

/** One isotopologue of a molecule. */
export interface IsotopologueRecord {
  /** Database molecule number (1 H2O, 2 CO2, 3 O3, 4 N2O, 6 CH4). */
  moleculeId: number
  /** Isotopologue number within the molecule (1 = most abundant), as in the database table. */
  isotopologueId: number
  /** Short code: last digit of each atom's mass number, e.g. '626' for ¹⁶O¹²C¹⁶O. */
  code: string
  /** Formula with mass numbers, e.g. '(12C)(16O)2'. */
  formula: string
  /** Terrestrial natural abundance (fraction) used by the database intensities. */
  abundance: number
  /** Molar mass, g mol⁻¹. */
  molarMassGPerMol: number
  /** Total internal partition function at 296 K, including the state-independent degeneracy g_i. */
  partitionFunction296: number
  /** State-independent (nuclear-spin) degeneracy factor g_i of the database convention. */
  stateIndependentDegeneracy: number
  /** True for linear molecules (rotational Q ∝ T), false for nonlinear ones (Q ∝ T^1.5). */
  linear: boolean
  /** Low vibrational levels used for the approximate vibrational partition function. */
  vibrationalLevels: readonly VibrationalLevel[]
  /** Where the numbers come from. */
  source: string
}

const GORDON_2022 =
  'abundance, molar mass, Q(296), g_i: Gordon et al. 2022, JQSRT 277, 107949 (isotopologue table)'

/** The isotopologue table. Ordered by molecule then isotopologue number. */
export const ISOTOPOLOGUES: readonly IsotopologueRecord[] = [
  {
    moleculeId: 1,
    isotopologueId: 1,
    code: '161',
    formula: 'H2(16O)',
    abundance: 0.997317,
    molarMassGPerMol: 18.010565,
    partitionFunction296: 174.58,
    stateIndependentDegeneracy: 1,
    linear: false,
    vibrationalLevels: [
      { energyCm: 1594.746, degeneracy: 1 },
      { energyCm: 3151.63, degeneracy: 1 },
      { energyCm: 3657.053, degeneracy: 1 },
      { energyCm: 3755.929, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; levels (010), (020), (100), (001): Tennyson et al. 2001, J. Phys. Chem. Ref. Data 30, 735 (from memory)`,
  },
  {
    moleculeId: 1,
    isotopologueId: 2,
    code: '181',
    formula: 'H2(18O)',
    abundance: 1.99983e-3,
    molarMassGPerMol: 20.01481,
    partitionFunction296: 176.05,
    stateIndependentDegeneracy: 1,
    linear: false,
    vibrationalLevels: [
      { energyCm: 1588.276, degeneracy: 1 },
      { energyCm: 3649.685, degeneracy: 1 },
      { energyCm: 3741.567, degeneracy: 1 },
    ],
    source:
      'abundance, Q(296), g_i: Gordon et al. 2022 table (from memory); molar mass computed from AME 2016 atomic masses; levels (010), (100), (001) from memory',
  },
  {
    moleculeId: 1,
    isotopologueId: 3,
    code: '171',
    formula: 'H2(17O)',
    abundance: 3.71884e-4,
    molarMassGPerMol: 19.014782,
    partitionFunction296: 1052.14,
    stateIndependentDegeneracy: 6,
    linear: false,
    vibrationalLevels: [
      { energyCm: 1591.326, degeneracy: 1 },
      { energyCm: 3653.142, degeneracy: 1 },
      { energyCm: 3748.318, degeneracy: 1 },
    ],
    source:
      'abundance, Q(296), g_i: Gordon et al. 2022 table (from memory); molar mass computed from AME 2016 atomic masses; levels (010), (100), (001) from memory',
  },
  {
    moleculeId: 1,
    isotopologueId: 4,
    code: '162',
    formula: 'HD(16O)',
    abundance: 3.10693e-4,
    molarMassGPerMol: 19.016841,
    partitionFunction296: 864.74,
    stateIndependentDegeneracy: 6,
    linear: false,
    vibrationalLevels: [
      { energyCm: 1403.484, degeneracy: 1 },
      { energyCm: 2723.68, degeneracy: 1 },
      { energyCm: 2782.01, degeneracy: 1 },
      { energyCm: 3707.467, degeneracy: 1 },
    ],
    source:
      'abundance, Q(296), g_i: Gordon et al. 2022 table (from memory); molar mass computed from AME 2016 atomic masses; levels (010), (100) OD stretch, (020), (001) from memory',
  },
  {
    moleculeId: 2,
    isotopologueId: 1,
    code: '626',
    formula: '(12C)(16O)2',
    abundance: 0.984204,
    molarMassGPerMol: 43.98983,
    partitionFunction296: 286.09,
    stateIndependentDegeneracy: 1,
    linear: true,
    vibrationalLevels: [
      { energyCm: 667.3799, degeneracy: 2 },
      { energyCm: 1285.4087, degeneracy: 1 },
      { energyCm: 1335.1317, degeneracy: 2 },
      { energyCm: 1388.1845, degeneracy: 1 },
      { energyCm: 1932.4701, degeneracy: 2 },
      { energyCm: 2003.2462, degeneracy: 2 },
      { energyCm: 2076.8558, degeneracy: 2 },
      { energyCm: 2349.1429, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; levels 01101 … 00011: Rothman et al. 1992, JQSRT 48, 537 (from memory; 01101 seen in published code)`,
  },
  {
    moleculeId: 2,
    isotopologueId: 2,
    code: '636',
    formula: '(13C)(16O)2',
    abundance: 0.011057,
    molarMassGPerMol: 44.993185,
    partitionFunction296: 576.64,
    stateIndependentDegeneracy: 2,
    linear: true,
    vibrationalLevels: [
      { energyCm: 648.4782, degeneracy: 2 },
      { energyCm: 1265.829, degeneracy: 1 },
      { energyCm: 1297.264, degeneracy: 2 },
      { energyCm: 1370.063, degeneracy: 1 },
      { energyCm: 2283.4872, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; levels 01101, 10002, 02201, 10001, 00011 from memory`,
  },
  {
    moleculeId: 2,
    isotopologueId: 3,
    code: '628',
    formula: '(16O)(12C)(18O)',
    abundance: 0.003947,
    molarMassGPerMol: 45.994076,
    partitionFunction296: 607.81,
    stateIndependentDegeneracy: 1,
    linear: true,
    vibrationalLevels: [
      { energyCm: 662.3734, degeneracy: 2 },
      { energyCm: 1324.75, degeneracy: 3 },
      { energyCm: 1987.12, degeneracy: 4 },
      { energyCm: 2332.1125, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; ν₂ and ν₃ origins from memory; 2ν₂ and 3ν₂ manifolds harmonic estimates`,
  },
  {
    moleculeId: 2,
    isotopologueId: 4,
    code: '627',
    formula: '(16O)(12C)(17O)',
    abundance: 7.33989e-4,
    molarMassGPerMol: 44.994045,
    partitionFunction296: 3542.61,
    stateIndependentDegeneracy: 6,
    linear: true,
    vibrationalLevels: [
      { energyCm: 664.729, degeneracy: 2 },
      { energyCm: 1329.46, degeneracy: 3 },
      { energyCm: 1994.19, degeneracy: 4 },
      { energyCm: 2340.014, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; ν₂ and ν₃ origins from memory; 2ν₂ and 3ν₂ manifolds harmonic estimates`,
  },
  {
    moleculeId: 2,
    isotopologueId: 5,
    code: '638',
    formula: '(16O)(13C)(18O)',
    abundance: 4.43446e-5,
    molarMassGPerMol: 46.997431,
    partitionFunction296: 1225.46,
    stateIndependentDegeneracy: 2,
    linear: true,
    vibrationalLevels: [
      { energyCm: 643.33, degeneracy: 2 },
      { energyCm: 1286.66, degeneracy: 3 },
      { energyCm: 1929.99, degeneracy: 4 },
      { energyCm: 2265.97, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; ν₂ and ν₃ origins from memory (low confidence); 2ν₂ and 3ν₂ harmonic estimates`,
  },
  {
    moleculeId: 3,
    isotopologueId: 1,
    code: '666',
    formula: '(16O)3',
    abundance: 0.992901,
    molarMassGPerMol: 47.984745,
    partitionFunction296: 3483.71,
    stateIndependentDegeneracy: 1,
    linear: false,
    vibrationalLevels: [
      { energyCm: 700.931, degeneracy: 1 },
      { energyCm: 1042.084, degeneracy: 1 },
      { energyCm: 1103.137, degeneracy: 1 },
      { energyCm: 1399.273, degeneracy: 1 },
      { energyCm: 1726.522, degeneracy: 1 },
      { energyCm: 1796.262, degeneracy: 1 },
    ],
    source: `${GORDON_2022}; levels ν₂, ν₃, ν₁, 2ν₂, ν₂+ν₃, ν₁+ν₂ from memory (Flaud & Bacis 1998 review)`,
  },
  {
    moleculeId: 4,
    isotopologueId: 1,
    code: '446',
    formula: '(14N)2(16O)',
    abundance: 0.990333,
    molarMassGPerMol: 44.001062,
    partitionFunction296: 4984.9,
    stateIndependentDegeneracy: 9,
    linear: true,
    vibrationalLevels: [
      { energyCm: 588.768, degeneracy: 2 },
      { energyCm: 1168.132, degeneracy: 1 },
      { energyCm: 1177.745, degeneracy: 2 },
      { energyCm: 1284.903, degeneracy: 1 },
      { energyCm: 1750.0, degeneracy: 4 },
      { energyCm: 1880.266, degeneracy: 2 },
      { energyCm: 2223.757, degeneracy: 1 },
    ],
    source: `${GORDON_2022} (g_i from memory); ν₂ 588.768 (NBS, PMC5325172 gives 588.78), 2ν₂ pair, ν₁, ν₁+ν₂, ν₃ from memory; 3ν₂ manifold at 1750 a harmonic-style estimate`,
  },
  {
    moleculeId: 6,
    isotopologueId: 1,
    code: '211',
    formula: '(12C)H4',
    abundance: 0.988274,
    molarMassGPerMol: 16.0313,
    partitionFunction296: 590.48,
    stateIndependentDegeneracy: 1,
    linear: false,
    vibrationalLevels: [
      { energyCm: 1310.761, degeneracy: 3 },
      { energyCm: 1533.333, degeneracy: 2 },
      { energyCm: 2600.0, degeneracy: 6 },
      { energyCm: 2830.0, degeneracy: 6 },
      { energyCm: 2916.481, degeneracy: 1 },
      { energyCm: 3019.493, degeneracy: 3 },
    ],
    source: `${GORDON_2022} (g_i from memory); ν₄, ν₂, ν₁, ν₃ origins from memory; 2ν₄ and ν₂+ν₄ polyads lumped at 2600 and 2830 cm⁻¹ (estimates)`,
  },
]
