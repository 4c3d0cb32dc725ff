/**
 * Registry of the built-in line catalogue: the band generators, and the function that runs them
 * into one sorted line list with a per-band summary.
 *
 * The catalogue holds the linear-molecule bands (CO2 626/636/628, N2O 446; `linear/`) and the
 * asymmetric-top and CH4 bands (H2O rotation and ν₂, O3 ν₃ and ν₁, CH4 ν₄; `asymmetric/`). Other
 * generators can be passed to `buildBuiltInCatalogue` as a list.
 */
import { PhysicsError } from '../physics/errors'
import { validateSpectralLine, type SpectralLine } from '../physics/spectroscopy/line'
import {
  METHANE_NU4,
  OZONE_BANDS,
  WATER_BANDS,
  generateMethaneLines,
  generateOzoneLines,
  generateWaterLines,
} from './asymmetric'
import type { ConfidenceTag } from './constants/confidence'
import { LINEAR_BANDS, type LinearBandConstants } from './constants/linear-bands'
import { generateLinearBandLines } from './linear/band-generator'

/**
 * Version of the catalogue generators; bump whenever any generated number may change (it is
 * written into the catalogue file header).
 */
export const CATALOGUE_GENERATOR_VERSION = '2.0.0'

/** One band (or group of bands) of the built-in catalogue. */
export interface BandGenerator {
  /** Stable unique identifier, e.g. 'co2-626-01101-00001'. */
  id: string
  /** Molecule name, e.g. 'CO2'. */
  molecule: string
  /** Database molecule number. */
  moleculeId: number
  /** Isotopologue number, when the generator covers one isotopologue. */
  isotopologueId?: number
  /** Short description for listings. */
  description: string
  /** Published source of the band intensity and constants. */
  source: string
  /** Confidence of the band intensity. */
  confidence?: ConfidenceTag
  /** Published/adopted band intensity the lines are normalised to, cm/molecule (if any). */
  bandIntensityCmPerMolecule?: number
  /** Synthesises the lines (any order). Must be deterministic. */
  generate(): SpectralLine[]
}

/** Summary of one band in a built catalogue. */
export interface CatalogueBandSummary {
  id: string
  molecule: string
  moleculeId: number
  /** Isotopologue number, or null when the generator spans several. */
  isotopologueId: number | null
  description: string
  lineCount: number
  /** Smallest line position, cm⁻¹. */
  minWavenumberCm: number
  /** Largest line position, cm⁻¹. */
  maxWavenumberCm: number
  /** Σ S_i of the generated lines at 296 K, cm/molecule. */
  intensitySumCmPerMolecule: number
  /** Published/adopted band intensity, cm/molecule, or null. */
  publishedBandIntensityCmPerMolecule: number | null
  source: string
  confidence: ConfidenceTag | null
}

/** A built catalogue: lines sorted by wavenumber, the band of each line, and band summaries. */
export interface BuiltInCatalogue {
  /** Lines sorted by ascending wavenumber (ties: band order, then generator order). */
  lines: SpectralLine[]
  /** lineBandIndex[i] = index in `bands` of the generator that produced lines[i]. */
  lineBandIndex: number[]
  /** One summary per generator, in generator order. */
  bands: CatalogueBandSummary[]
  /** `CATALOGUE_GENERATOR_VERSION` at build time. */
  generatorVersion: string
}

/** A band generator for one row of the linear-band table. */
export function linearBandGenerator(band: LinearBandConstants): BandGenerator {
  return {
    id: band.id,
    molecule: band.moleculeId === 2 ? 'CO2' : band.moleculeId === 4 ? 'N2O' : `${band.moleculeId}`,
    moleculeId: band.moleculeId,
    isotopologueId: band.isotopologueId,
    description: band.description,
    source: band.source,
    confidence: band.confidence,
    bandIntensityCmPerMolecule: band.bandIntensityCmPerMolecule,
    generate: () => generateLinearBandLines(band),
  }
}

/** Generators of the linear molecules (CO2 626/636/628, N2O 446), in table order. */
export const LINEAR_BAND_GENERATORS: readonly BandGenerator[] =
  LINEAR_BANDS.map(linearBandGenerator)

/**
 * Removes non-integer statistical weights from generated lines (returns the same array).
 *
 * Method: a line whose g′ or g″ is not an integer loses that (optional) field; every other field,
 * Einstein A included, is kept.
 * Notes: the catalogue file stores statistical weights as integers, the database convention (0 =
 * absent). The CH4 generator merges each tetrahedrally split J manifold into one line and gives it
 * the average spin-weighted degeneracy (4/3)(2J′+1)², which is not an integer for most J′; its
 * A was computed with that average, so dropping the weight loses nothing the optics use.
 * Source: common practice (line-list file conventions).
 * @param lines generated lines (modified in place)
 */
export function dropNonIntegerStatisticalWeights(lines: SpectralLine[]): SpectralLine[] {
  for (const line of lines) {
    if (line.upperStatisticalWeight !== undefined && !Number.isInteger(line.upperStatisticalWeight))
      delete line.upperStatisticalWeight
    if (line.lowerStatisticalWeight !== undefined && !Number.isInteger(line.lowerStatisticalWeight))
      delete line.lowerStatisticalWeight
  }
  return lines
}

/**
 * Generators of H2O 161 (pure rotation; ν₂) and O3 666 (ν₃; ν₁), one per band, each running the
 * molecule's generator with default options restricted to its band, then CH4 211 ν₄.
 */
export const ASYMMETRIC_BAND_GENERATORS: readonly BandGenerator[] = [
  ...WATER_BANDS.map((band): BandGenerator => ({
    id: band.id,
    molecule: 'H2O',
    moleculeId: band.moleculeId,
    isotopologueId: band.isotopologueId,
    description: band.title,
    source: band.source,
    confidence: band.confidence,
    bandIntensityCmPerMolecule: band.bandIntensityCmPerMolecule ?? undefined,
    generate: () => generateWaterLines({ bandIds: [band.id] }),
  })),
  ...OZONE_BANDS.map((band): BandGenerator => ({
    id: band.id,
    molecule: 'O3',
    moleculeId: band.moleculeId,
    isotopologueId: band.isotopologueId,
    description: band.title,
    source: band.source,
    confidence: band.confidence,
    bandIntensityCmPerMolecule: band.bandIntensityCmPerMolecule ?? undefined,
    generate: () => generateOzoneLines({ bandIds: [band.id] }),
  })),
  {
    id: METHANE_NU4.id,
    molecule: 'CH4',
    moleculeId: METHANE_NU4.moleculeId,
    isotopologueId: METHANE_NU4.isotopologueId,
    description: METHANE_NU4.title,
    source: METHANE_NU4.source,
    confidence: METHANE_NU4.confidence,
    bandIntensityCmPerMolecule: METHANE_NU4.bandIntensityCmPerMolecule,
    generate: () => dropNonIntegerStatisticalWeights(generateMethaneLines()),
  },
]

/**
 * All generators of the built-in catalogue: the linear bands in table order, then H2O, O3, CH4.
 * The H2O pure-rotation band has no published band intensity (its lines are absolute, from the
 * dipole moment), so its summary carries `publishedBandIntensityCmPerMolecule: null`.
 */
export const BUILT_IN_BAND_GENERATORS: readonly BandGenerator[] = [
  ...LINEAR_BAND_GENERATORS,
  ...ASYMMETRIC_BAND_GENERATORS,
]

/**
 * Runs the generators and assembles the built-in catalogue.
 *
 * Method: generate every band, validate every line (`validateSpectralLine`), sort all lines by
 * wavenumber (stable: ties keep band order, then generator order) and summarise each band.
 * Notes: deterministic for deterministic generators; throws INVALID_ARGUMENT on duplicate ids or
 * invalid lines. Intensities in cm/molecule at 296 K.
 * Source: common practice (catalogue assembly).
 * @param generators band generators (default: `BUILT_IN_BAND_GENERATORS`)
 */
export function buildBuiltInCatalogue(
  generators: readonly BandGenerator[] = BUILT_IN_BAND_GENERATORS,
): BuiltInCatalogue {
  const ids = new Set<string>()
  const entries: { line: SpectralLine; band: number; order: number }[] = []
  const bands: CatalogueBandSummary[] = []
  generators.forEach((generator, bandIndex) => {
    if (ids.has(generator.id)) {
      throw new PhysicsError('INVALID_ARGUMENT', `duplicate band generator id ${generator.id}`, {
        id: generator.id,
      })
    }
    ids.add(generator.id)
    const lines = generator.generate()
    let sum = 0
    let min = Infinity
    let max = -Infinity
    lines.forEach((line, order) => {
      validateSpectralLine(line, order)
      sum += line.intensityCmPerMolecule
      min = Math.min(min, line.wavenumberCm)
      max = Math.max(max, line.wavenumberCm)
      entries.push({ line, band: bandIndex, order })
    })
    bands.push({
      id: generator.id,
      molecule: generator.molecule,
      moleculeId: generator.moleculeId,
      isotopologueId: generator.isotopologueId ?? null,
      description: generator.description,
      lineCount: lines.length,
      minWavenumberCm: lines.length > 0 ? min : 0,
      maxWavenumberCm: lines.length > 0 ? max : 0,
      intensitySumCmPerMolecule: sum,
      publishedBandIntensityCmPerMolecule: generator.bandIntensityCmPerMolecule ?? null,
      source: generator.source,
      confidence: generator.confidence ?? null,
    })
  })
  entries.sort(
    (a, b) => a.line.wavenumberCm - b.line.wavenumberCm || a.band - b.band || a.order - b.order,
  )
  return {
    lines: entries.map((e) => e.line),
    lineBandIndex: entries.map((e) => e.band),
    bands,
    generatorVersion: CATALOGUE_GENERATOR_VERSION,
  }
}
