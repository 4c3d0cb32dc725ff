/**
 * Spectral line records: a plain-object record per line (`SpectralLine`) for parsing, storage and
 * display, and a struct-of-arrays table (`LineTable`) sorted by wavenumber for the hot loops.
 *
 * Units follow the public spectroscopic databases: wavenumber cm⁻¹, intensity at 296 K in
 * cm⁻¹/(molecule cm⁻²) including the isotopic abundance, half widths cm⁻¹ atm⁻¹ at 296 K,
 * pressure shift cm⁻¹ atm⁻¹, lower-state energy cm⁻¹.
 */
import { PhysicsError } from '../errors'

/** Molecule numbers used by the public spectroscopic databases for the gases Tauline knows. */
export const MOLECULE_IDS = { H2O: 1, CO2: 2, O3: 3, N2O: 4, CH4: 6 } as const

/** One spectral line (plain object). */
export interface SpectralLine {
  /** Database molecule number (1 H2O, 2 CO2, 3 O3, 4 N2O, 6 CH4, …). */
  moleculeId: number
  /** Isotopologue number within the molecule, 1 = most abundant. */
  isotopologueId: number
  /** Vacuum line position, cm⁻¹. */
  wavenumberCm: number
  /** Line intensity at 296 K, cm⁻¹/(molecule cm⁻²), including the isotopic abundance. */
  intensityCmPerMolecule: number
  /** Einstein A coefficient, s⁻¹. */
  einsteinAPerS: number
  /** Air-broadened Lorentz half width (HWHM) at 296 K, cm⁻¹ atm⁻¹. */
  airHalfWidthCmPerAtm: number
  /** Self-broadened Lorentz half width (HWHM) at 296 K, cm⁻¹ atm⁻¹. */
  selfHalfWidthCmPerAtm: number
  /** Lower-state energy E″, cm⁻¹. */
  lowerStateEnergyCm: number
  /** Exponent n of the temperature dependence γ(T) = γ(296 K)(296/T)ⁿ (dimensionless). */
  temperatureExponentAir: number
  /** Air pressure shift of the line position at 296 K, cm⁻¹ atm⁻¹. */
  pressureShiftCmPerAtm: number
  /** Upper-state global quanta label (raw, as in the source record). */
  upperGlobalQuanta?: string
  /** Lower-state global quanta label (raw). */
  lowerGlobalQuanta?: string
  /** Upper-state local quanta label (raw). */
  upperLocalQuanta?: string
  /** Lower-state local quanta label (raw). */
  lowerLocalQuanta?: string
  /** Uncertainty indices of the record (six digits), when read from a database record. */
  uncertaintyIndices?: readonly number[]
  /** Reference indices of the record (six numbers), when read from a database record. */
  referenceIndices?: readonly number[]
  /** Line-mixing flag character of the record ('' when blank). */
  lineMixingFlag?: string
  /** Upper-state statistical weight g′. */
  upperStatisticalWeight?: number
  /** Lower-state statistical weight g″. */
  lowerStatisticalWeight?: number
}

/**
 * Struct-of-arrays line table, sorted by ascending wavenumber. Every column has at least `length`
 * entries; entries past `length` are ignored. `sourceIndex[i]` is the index of row i in the array
 * the table was built from (for looking up quantum labels after sorting).
 */
export interface LineTable {
  length: number
  moleculeId: Int32Array
  isotopologueId: Int32Array
  wavenumberCm: Float64Array
  intensityCmPerMolecule: Float64Array
  einsteinAPerS: Float64Array
  airHalfWidthCmPerAtm: Float64Array
  selfHalfWidthCmPerAtm: Float64Array
  lowerStateEnergyCm: Float64Array
  temperatureExponentAir: Float64Array
  pressureShiftCmPerAtm: Float64Array
  sourceIndex: Int32Array
}

/** Allocates an empty (zero-filled) line table with room for `length` lines. */
export function createLineTable(length: number): LineTable {
  if (!Number.isInteger(length) || length < 0) {
    throw new PhysicsError('INVALID_ARGUMENT', `line table length must be a non-negative integer`, {
      length,
    })
  }
  return {
    length,
    moleculeId: new Int32Array(length),
    isotopologueId: new Int32Array(length),
    wavenumberCm: new Float64Array(length),
    intensityCmPerMolecule: new Float64Array(length),
    einsteinAPerS: new Float64Array(length),
    airHalfWidthCmPerAtm: new Float64Array(length),
    selfHalfWidthCmPerAtm: new Float64Array(length),
    lowerStateEnergyCm: new Float64Array(length),
    temperatureExponentAir: new Float64Array(length),
    pressureShiftCmPerAtm: new Float64Array(length),
    sourceIndex: new Int32Array(length),
  }
}

/**
 * The floating-point columns of a line table in a fixed order (stored line blocks keep their
 * columns in this order, so it must not change).
 */
export const LINE_FLOAT_COLUMNS = [
  'wavenumberCm',
  'intensityCmPerMolecule',
  'einsteinAPerS',
  'airHalfWidthCmPerAtm',
  'selfHalfWidthCmPerAtm',
  'lowerStateEnergyCm',
  'temperatureExponentAir',
  'pressureShiftCmPerAtm',
] as const

/** Throws INVALID_ARGUMENT / OUT_OF_RANGE unless the line is physically usable. */
export function validateSpectralLine(line: SpectralLine, index = 0): void {
  for (const field of ['moleculeId', 'isotopologueId'] as const) {
    const value = line[field]
    if (!Number.isInteger(value) || value < 1) {
      throw new PhysicsError('INVALID_ARGUMENT', `line ${index}: ${field} must be an integer ≥ 1`, {
        index,
        field,
        value,
      })
    }
  }
  for (const field of LINE_FLOAT_COLUMNS) {
    const value = line[field]
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new PhysicsError(
        'INVALID_ARGUMENT',
        `line ${index}: ${field} must be a finite number`,
        {
          index,
          field,
          value,
        },
      )
    }
  }
  const nonNegative = [
    'intensityCmPerMolecule',
    'einsteinAPerS',
    'airHalfWidthCmPerAtm',
    'selfHalfWidthCmPerAtm',
    'lowerStateEnergyCm',
  ] as const
  for (const field of nonNegative) {
    if (line[field] < 0) {
      throw new PhysicsError('OUT_OF_RANGE', `line ${index}: ${field} must be ≥ 0`, {
        index,
        field,
        value: line[field],
      })
    }
  }
  if (line.wavenumberCm <= 0) {
    throw new PhysicsError('OUT_OF_RANGE', `line ${index}: wavenumberCm must be > 0`, {
      index,
      field: 'wavenumberCm',
      value: line.wavenumberCm,
    })
  }
}

/**
 * Builds a struct-of-arrays table from line records, sorted by ascending wavenumber (stable:
 * lines at equal wavenumber keep their input order). Validates every line first.
 */
export function toLineTable(lines: readonly SpectralLine[]): LineTable {
  lines.forEach((line, index) => validateSpectralLine(line, index))
  const order = lines.map((_, index) => index)
  order.sort((a, b) => lines[a].wavenumberCm - lines[b].wavenumberCm || a - b)
  const table = createLineTable(lines.length)
  for (let i = 0; i < order.length; i++) {
    const line = lines[order[i]]
    table.moleculeId[i] = line.moleculeId
    table.isotopologueId[i] = line.isotopologueId
    table.wavenumberCm[i] = line.wavenumberCm
    table.intensityCmPerMolecule[i] = line.intensityCmPerMolecule
    table.einsteinAPerS[i] = line.einsteinAPerS
    table.airHalfWidthCmPerAtm[i] = line.airHalfWidthCmPerAtm
    table.selfHalfWidthCmPerAtm[i] = line.selfHalfWidthCmPerAtm
    table.lowerStateEnergyCm[i] = line.lowerStateEnergyCm
    table.temperatureExponentAir[i] = line.temperatureExponentAir
    table.pressureShiftCmPerAtm[i] = line.pressureShiftCmPerAtm
    table.sourceIndex[i] = order[i]
  }
  return table
}

/** Throws unless every column holds `length` entries and wavenumbers are finite and ascending. */
export function validateLineTable(table: LineTable): void {
  const columns = [
    table.moleculeId,
    table.isotopologueId,
    table.wavenumberCm,
    table.intensityCmPerMolecule,
    table.einsteinAPerS,
    table.airHalfWidthCmPerAtm,
    table.selfHalfWidthCmPerAtm,
    table.lowerStateEnergyCm,
    table.temperatureExponentAir,
    table.pressureShiftCmPerAtm,
    table.sourceIndex,
  ]
  if (!Number.isInteger(table.length) || table.length < 0) {
    throw new PhysicsError('INVALID_ARGUMENT', 'line table length must be a non-negative integer')
  }
  for (const column of columns) {
    if (column.length < table.length) {
      throw new PhysicsError('INVALID_ARGUMENT', 'line table column shorter than its length', {
        length: table.length,
        columnLength: column.length,
      })
    }
  }
  const nu = table.wavenumberCm
  for (let i = 0; i < table.length; i++) {
    if (!Number.isFinite(nu[i]) || (i > 0 && nu[i] < nu[i - 1])) {
      throw new PhysicsError('NOT_MONOTONIC', `line table not sorted by wavenumber at row ${i}`, {
        row: i,
        wavenumberCm: nu[i],
      })
    }
  }
}

/**
 * Index of the first row whose wavenumber is ≥ `wavenumberCm` (table.length when none), by
 * binary search. The table must be sorted (as built by `toLineTable`).
 */
export function lowerBoundIndex(table: LineTable, wavenumberCm: number): number {
  if (Number.isNaN(wavenumberCm)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'wavenumberCm is NaN')
  }
  const nu = table.wavenumberCm
  let lo = 0
  let hi = table.length
  while (lo < hi) {
    const mid = (lo + hi) >>> 1
    if (nu[mid] < wavenumberCm) lo = mid + 1
    else hi = mid
  }
  return lo
}

/**
 * The rows with minCm ≤ ν < maxCm (half-open, so adjacent spectral chunks never share a line)
 * as a table whose columns are views (`subarray`) of the input: no copy.
 * `range.start` is the row of the first line in the input table.
 */
export function sliceLineTableByWavenumber(
  table: LineTable,
  minCm: number,
  maxCm: number,
): LineTable & { start: number } {
  if (Number.isNaN(minCm) || Number.isNaN(maxCm) || maxCm < minCm) {
    throw new PhysicsError('INVALID_ARGUMENT', `invalid wavenumber range [${minCm}, ${maxCm})`, {
      minCm,
      maxCm,
    })
  }
  const start = lowerBoundIndex(table, minCm)
  const end = lowerBoundIndex(table, maxCm)
  return {
    start,
    length: end - start,
    moleculeId: table.moleculeId.subarray(start, end),
    isotopologueId: table.isotopologueId.subarray(start, end),
    wavenumberCm: table.wavenumberCm.subarray(start, end),
    intensityCmPerMolecule: table.intensityCmPerMolecule.subarray(start, end),
    einsteinAPerS: table.einsteinAPerS.subarray(start, end),
    airHalfWidthCmPerAtm: table.airHalfWidthCmPerAtm.subarray(start, end),
    selfHalfWidthCmPerAtm: table.selfHalfWidthCmPerAtm.subarray(start, end),
    lowerStateEnergyCm: table.lowerStateEnergyCm.subarray(start, end),
    temperatureExponentAir: table.temperatureExponentAir.subarray(start, end),
    pressureShiftCmPerAtm: table.pressureShiftCmPerAtm.subarray(start, end),
    sourceIndex: table.sourceIndex.subarray(start, end),
  }
}
