/**
 * The built-in catalogue as the catalogue pages and API show it: a read-only entry with its
 * bands, their sources and confidence tags, and what that means for accuracy. Computed once per
 * process from the loaded catalogue (26 479 lines, a few milliseconds).
 */
import type {
  BuiltInCatalogueInfo,
  CatalogueDetail,
  CatalogueSummary,
} from '../../shared/schemas/catalogues'
import { BUILTIN_CATALOGUE_ID, loadBuiltInCatalogue } from './builtin-catalogue'
import { LineListSummaryBuilder } from './import/line-list-summary'

/** The confidence tags of the catalogue constants tables (shared/catalogue/constants/confidence.ts). */
export const CONFIDENCE_TAGS: { tag: string; meaning: string }[] = [
  {
    tag: 'VERIFIED',
    meaning: 'Seen in published text (or in public code reproducing it), reference given.',
  },
  { tag: 'COMPUTED', meaning: 'Derived here from a stated formula and other tabulated values.' },
  { tag: 'MEMORY', meaning: 'Recalled from the cited source, not checked against it.' },
  { tag: 'MEMORY-low', meaning: 'Recalled, unsure of a digit or more: a plausibility value.' },
]

/** What the built-in catalogue is good for, and where it is not (shared/catalogue/README.md). */
export const BUILTIN_ACCURACY_NOTES: string[] = [
  'Synthesised, not measured: every line comes from published molecular constants (band origins, rotational and distortion constants, band intensities, isotopic abundances) through textbook spectroscopy. It is not a measured line list.',
  'Band intensities are normalised to adopted band totals, most of them recalled rather than checked against their source (confidence MEMORY or MEMORY-low in the band table). Some hot bands are harmonic estimates (one is uncertain by a factor of about 5), and the N2O ν₃ total rests on two recollections that differ by a factor of 2.',
  'Line positions of the asymmetric tops (H2O, O3) degrade with Ka: lines far from the band centre, such as H2O ν₂ lines below 1000 or above 2500 cm⁻¹, may be off by whole cm⁻¹.',
  'Each CH4 line stands for a whole tetrahedrally split J manifold, so CH4 line shapes are coarse even where band totals are right.',
  'Only the bands in the table are present (CO2, N2O, H2O, O3, CH4 in the thermal infrared); everything else is missing.',
  'Fluxes and forcing computed with it are indicative. For reference-grade numbers import a full line list and run with it.',
]

let summaryCache: CatalogueSummary | undefined
let detailCache: CatalogueDetail | undefined

function info(): BuiltInCatalogueInfo {
  const c = loadBuiltInCatalogue()
  return {
    generatorVersion: c.generatorVersion,
    createdFrom: c.parsed.header.createdFrom,
    bands: c.parsed.bands.map((b) => ({
      id: b.id,
      molecule: b.molecule,
      isotopologueId: b.isotopologueId,
      description: b.description,
      lineCount: b.lineCount,
      minWavenumberCm: b.minWavenumberCm,
      maxWavenumberCm: b.maxWavenumberCm,
      intensitySumCmPerMolecule: b.intensitySumCmPerMolecule,
      publishedBandIntensityCmPerMolecule: b.publishedBandIntensityCmPerMolecule,
      source: b.source,
      confidence: b.confidence,
    })),
    confidenceTags: CONFIDENCE_TAGS,
    accuracyNotes: BUILTIN_ACCURACY_NOTES,
  }
}

/** The built-in catalogue's detail: the same per-molecule summary an import gets, plus its bands. */
export function builtInCatalogueDetail(): CatalogueDetail {
  if (detailCache) return detailCache
  const c = loadBuiltInCatalogue()
  const builder = new LineListSummaryBuilder()
  for (const line of c.parsed.lines) builder.add(line)
  const summary = builder.summary()
  detailCache = {
    id: BUILTIN_CATALOGUE_ID,
    name: 'Built-in catalogue',
    description:
      'Lines synthesised from published molecular constants for CO₂, N₂O, H₂O, O₃ and CH₄. Read-only.',
    kind: 'builtin',
    readOnly: true,
    lineCount: c.lineCount,
    molecules: summary.molecules.map((m) => m.molecule),
    minWavenumberCm: summary.minWavenumberCm,
    maxWavenumberCm: summary.maxWavenumberCm,
    checksum: c.checksum,
    mergeWithBuiltIn: false,
    sourceFileName: null,
    ownerId: null,
    ownerName: 'Tauline',
    createdAt: null,
    updatedAt: null,
    builtin: info(),
    moleculeTable: summary.molecules,
    strongestBand: summary.strongestBand,
    warnings: summary.warnings.filter((w) => w.code !== 'NOT_SORTED'),
    provenance: null,
    builtInMoleculesUsed: [],
    effectiveLineCount: c.lineCount,
  }
  return detailCache
}

/** The built-in entry of the catalogue list (with bands, sources, confidence and accuracy notes). */
export function builtInCatalogueSummary(): CatalogueSummary {
  if (summaryCache) return summaryCache
  const d = builtInCatalogueDetail()
  summaryCache = {
    id: d.id,
    name: d.name,
    description: d.description,
    kind: d.kind,
    readOnly: d.readOnly,
    lineCount: d.lineCount,
    molecules: d.molecules,
    minWavenumberCm: d.minWavenumberCm,
    maxWavenumberCm: d.maxWavenumberCm,
    checksum: d.checksum,
    mergeWithBuiltIn: false,
    sourceFileName: null,
    ownerId: null,
    ownerName: d.ownerName,
    createdAt: null,
    updatedAt: null,
    builtin: d.builtin,
  }
  return summaryCache
}
