/**
 * Running summary of a line list: per-molecule and per-isotopologue counts, intensity sums and
 * ranges, and the strongest band group. State grows with the number of distinct molecules,
 * isotopologues and band groups, never with the number of lines.
 */
import { findIsotopologue } from '../../../shared/physics/spectroscopy/isotopologue-lookup'
import { MOLECULE_IDS, type SpectralLine } from '../../../shared/physics/spectroscopy/line'
import type {
  IsotopologueSummary,
  LineListSummary,
  LineListWarning,
  MoleculeSummary,
  StrongestBand,
} from '../../../shared/schemas/catalogues'

/** Band groups tracked at most; a file with more reports the strongest among the first ones. */
export const MAX_BAND_GROUPS = 100_000

const FORMULA_BY_MOLECULE_ID = new Map<number, string>(
  Object.entries(MOLECULE_IDS).map(([formula, id]) => [id, formula]),
)

/** Formula of a molecule Tauline models, otherwise 'molecule N' (database molecule number). */
export function moleculeName(moleculeId: number): string {
  return FORMULA_BY_MOLECULE_ID.get(moleculeId) ?? `molecule ${moleculeId}`
}

/** True for the molecules whose amounts a profile can hold (their lines enter runs). */
export function isModelledMolecule(moleculeId: number): boolean {
  return FORMULA_BY_MOLECULE_ID.has(moleculeId)
}

interface Tally {
  lineCount: number
  intensitySum: number
  minCm: number
  maxCm: number
}

const lines = (n: number) => `${n.toLocaleString('en')} line${n === 1 ? '' : 's'}`

const newTally = (): Tally => ({ lineCount: 0, intensitySum: 0, minCm: Infinity, maxCm: -Infinity })

function count(t: Tally, line: SpectralLine): void {
  t.lineCount++
  t.intensitySum += line.intensityCmPerMolecule
  if (line.wavenumberCm < t.minCm) t.minCm = line.wavenumberCm
  if (line.wavenumberCm > t.maxCm) t.maxCm = line.wavenumberCm
}

interface BandTally extends Tally {
  moleculeId: number
  isotopologueId: number
  upper: string
  lower: string
}

/** Accumulates a LineListSummary one line at a time. */
export class LineListSummaryBuilder {
  private readonly molecules = new Map<number, Tally & { isotopologues: Map<number, Tally> }>()
  private readonly bands = new Map<string, BandTally>()
  private bandsTruncated = false
  private lineCount = 0
  private blankLineCount = 0
  private lastCm = -Infinity
  private sorted = true
  private minCm = Infinity
  private maxCm = -Infinity

  addBlankLine(): void {
    this.blankLineCount++
  }

  add(line: SpectralLine): void {
    this.lineCount++
    const nu = line.wavenumberCm
    if (nu < this.lastCm) this.sorted = false
    this.lastCm = nu
    if (nu < this.minCm) this.minCm = nu
    if (nu > this.maxCm) this.maxCm = nu
    let molecule = this.molecules.get(line.moleculeId)
    if (!molecule) {
      molecule = { ...newTally(), isotopologues: new Map() }
      this.molecules.set(line.moleculeId, molecule)
    }
    count(molecule, line)
    let iso = molecule.isotopologues.get(line.isotopologueId)
    if (!iso) {
      iso = newTally()
      molecule.isotopologues.set(line.isotopologueId, iso)
    }
    count(iso, line)
    const upper = (line.upperGlobalQuanta ?? '').trim()
    const lower = (line.lowerGlobalQuanta ?? '').trim()
    const key = `${line.moleculeId}|${line.isotopologueId}|${upper}|${lower}`
    let band = this.bands.get(key)
    if (!band) {
      if (this.bands.size >= MAX_BAND_GROUPS) {
        this.bandsTruncated = true
        return
      }
      band = {
        ...newTally(),
        moleculeId: line.moleculeId,
        isotopologueId: line.isotopologueId,
        upper,
        lower,
      }
      this.bands.set(key, band)
    }
    count(band, line)
  }

  summary(): LineListSummary {
    const molecules: MoleculeSummary[] = [...this.molecules.entries()]
      .sort(([a], [b]) => a - b)
      .map(([moleculeId, m]) => ({
        moleculeId,
        molecule: moleculeName(moleculeId),
        modelled: isModelledMolecule(moleculeId),
        lineCount: m.lineCount,
        intensitySumCmPerMolecule: m.intensitySum,
        minWavenumberCm: m.minCm,
        maxWavenumberCm: m.maxCm,
        isotopologues: [...m.isotopologues.entries()]
          .sort(([a], [b]) => a - b)
          .map(([isotopologueId, t]): IsotopologueSummary => ({
            isotopologueId,
            code: findIsotopologue(moleculeId, isotopologueId)?.code ?? null,
            lineCount: t.lineCount,
            intensitySumCmPerMolecule: t.intensitySum,
            minWavenumberCm: t.minCm,
            maxWavenumberCm: t.maxCm,
          })),
      }))
    let strongest: BandTally | undefined
    for (const band of this.bands.values())
      if (!strongest || band.intensitySum > strongest.intensitySum) strongest = band
    const strongestBand: StrongestBand | null = strongest
      ? {
          moleculeId: strongest.moleculeId,
          molecule: moleculeName(strongest.moleculeId),
          isotopologueId: strongest.isotopologueId,
          upperGlobalQuanta: strongest.upper,
          lowerGlobalQuanta: strongest.lower,
          lineCount: strongest.lineCount,
          intensitySumCmPerMolecule: strongest.intensitySum,
          minWavenumberCm: strongest.minCm,
          maxWavenumberCm: strongest.maxCm,
        }
      : null
    return {
      lineCount: this.lineCount,
      blankLineCount: this.blankLineCount,
      minWavenumberCm: this.lineCount ? this.minCm : 0,
      maxWavenumberCm: this.lineCount ? this.maxCm : 0,
      sortedByWavenumber: this.sorted,
      molecules,
      strongestBand,
      bandGroupCount: this.bands.size,
      warnings: this.warnings(molecules),
    }
  }

  private warnings(molecules: MoleculeSummary[]): LineListWarning[] {
    const warnings: LineListWarning[] = []
    for (const m of molecules) {
      if (!m.modelled) {
        warnings.push({
          code: 'MOLECULE_NOT_MODELLED',
          message: `${lines(m.lineCount)} of ${m.molecule}: Tauline holds no amount of this gas in a profile, so runs store but do not use them.`,
        })
        continue
      }
      const unknown = m.isotopologues.filter((i) => i.code === null)
      if (unknown.length) {
        const count = unknown.reduce((s, i) => s + i.lineCount, 0)
        warnings.push({
          code: 'ISOTOPOLOGUE_WITHOUT_DATA',
          message: `${lines(count)} of ${m.molecule} isotopologue${unknown.length > 1 ? 's' : ''} ${unknown.map((i) => i.isotopologueId).join(', ')}: Tauline has no partition function or molar mass for ${unknown.length > 1 ? 'them' : 'it'}, so a run that includes ${m.molecule} will fail. Remove those lines before importing if you want to compute with this file.`,
        })
      }
    }
    if (this.bandsTruncated) {
      warnings.push({
        code: 'BAND_GROUPS_TRUNCATED',
        message: `More than ${MAX_BAND_GROUPS.toLocaleString('en')} distinct band labels: the strongest band is the strongest among the first ${MAX_BAND_GROUPS.toLocaleString('en')}.`,
      })
    }
    if (!this.sorted) {
      warnings.push({
        code: 'NOT_SORTED',
        message:
          'The records are not in wavenumber order; runs sort them when they load the catalogue.',
      })
    }
    return warnings
  }
}
