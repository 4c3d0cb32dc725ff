import type { CatalogueSummary } from '@shared/schemas/catalogues'

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
}

/** 3.93 × 10⁻¹⁸ style, for line intensities. */
export function formatIntensity(value: number, digits = 3): string {
  if (!(value > 0)) return '0'
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e')
  const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c)
  return `${mantissa} × 10${power}`
}

/** A wavenumber range in cm⁻¹ with sensible decimals. */
export function formatRangeCm(minCm: number, maxCm: number): string {
  if (minCm === maxCm) return `${Number(minCm.toFixed(4))} cm⁻¹`
  const digits = maxCm - minCm < 10 ? 2 : maxCm - minCm < 100 ? 1 : 0
  return `${minCm.toFixed(digits)}–${maxCm.toFixed(digits)} cm⁻¹`
}

/** Bytes as KiB/MiB. */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`
  return `${(bytes / 1024 / 1024).toFixed(1)} MiB`
}

/** '1 line', '26 479 lines'. */
export function formatLines(n: number): string {
  return `${formatCount(n)} ${n === 1 ? 'line' : 'lines'}`
}

/** Molecule numbers in the order of the chart colours, so a molecule keeps its colour everywhere. */
const COLOUR_ORDER = [1, 2, 3, 4, 6]

/** Index into the chart series colours for a molecule. */
export function moleculeColourIndex(moleculeId: number): number {
  const k = COLOUR_ORDER.indexOf(moleculeId)
  return k >= 0 ? k : COLOUR_ORDER.length + (moleculeId % 2)
}

/** Counts with thin spaces between thousands. */
export function formatCount(n: number): string {
  return n.toLocaleString('en-GB').replace(/,/g, ' ')
}

/** Subscript digits in a formula: CO2 → CO₂. */
export function formulaText(molecule: string): string {
  return /^[A-Z][A-Za-z0-9]*$/.test(molecule)
    ? molecule.replace(/\d/g, (d) => String.fromCharCode(0x2080 + Number(d)))
    : molecule
}

/** How a catalogue is labelled in lists and headers. */
export function kindLabel(c: Pick<CatalogueSummary, 'kind' | 'mergeWithBuiltIn'>): string {
  if (c.kind === 'builtin') return 'Built-in'
  return c.mergeWithBuiltIn ? 'Imported + built-in' : 'Imported'
}

/** Tag colour of a confidence tag of the built-in catalogue. */
export function confidenceTagType(
  tag: string | null,
): 'success' | 'info' | 'warning' | 'error' | 'default' {
  if (tag === 'VERIFIED') return 'success'
  if (tag === 'COMPUTED') return 'info'
  if (tag === 'MEMORY') return 'warning'
  if (tag === 'MEMORY-low') return 'error'
  return 'default'
}

/** Words for the record fields named in import errors. */
export const RECORD_FIELD_LABELS: Record<string, string> = {
  record: 'Whole record',
  moleculeId: 'Molecule number',
  isotopologueId: 'Isotopologue',
  wavenumberCm: 'Wavenumber',
  intensityCmPerMolecule: 'Intensity',
  einsteinAPerS: 'Einstein A',
  airHalfWidthCmPerAtm: 'Air half width',
  selfHalfWidthCmPerAtm: 'Self half width',
  lowerStateEnergyCm: 'Lower-state energy',
  temperatureExponentAir: 'Temperature exponent',
  pressureShiftCmPerAtm: 'Pressure shift',
  uncertaintyIndices: 'Uncertainty indices',
  referenceIndices: 'Reference indices',
  upperStatisticalWeight: 'Upper statistical weight',
  lowerStatisticalWeight: 'Lower statistical weight',
}
