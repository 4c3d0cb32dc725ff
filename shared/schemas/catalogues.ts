import { z } from 'zod'

/** Largest line-list file the server accepts, bytes (512 MiB ≈ 3.3 million 160-character records). */
export const LINE_LIST_MAX_BYTES = 512 * 1024 * 1024
/** How long an uploaded, checked file waits for its commit, ms. */
export const IMPORT_TOKEN_TTL_MS = 30 * 60 * 1000
/** Errors listed in full (line number, field, value, expected); the rest are only counted. */
export const IMPORT_ERRORS_LISTED = 50
/** Reading stops after this many bad records: the file is clearly not a line list. */
export const IMPORT_ERRORS_BEFORE_STOP = 1000
/** Default number of bins of a stick spectrum. */
export const STICK_BINS_DEFAULT = 1500

/** 'builtin' or the numeric id of an imported catalogue. */
export const catalogueIdSchema = z.union([z.literal('builtin'), z.coerce.number().int().positive()])
export type CatalogueId = 'builtin' | number

/** Body of POST /api/catalogues/imports/:token/commit. */
export const commitImportSchema = z.object({
  name: z.string().trim().min(1, 'Give the catalogue a name.').max(120),
  description: z.string().trim().max(4000).default(''),
  mergeWithBuiltIn: z.boolean().default(false),
})
export type CommitImportInput = z.infer<typeof commitImportSchema>

/** ?startCm&endCm&bins of GET /api/catalogues/:id/sticks (range defaults to the whole catalogue). */
export const sticksQuerySchema = z
  .object({
    startCm: z.coerce.number().finite().min(0).max(100_000).optional(),
    endCm: z.coerce.number().finite().min(0).max(100_000).optional(),
    bins: z.coerce.number().int().min(10).max(5000).default(STICK_BINS_DEFAULT),
  })
  .refine((q) => q.startCm === undefined || q.endCm === undefined || q.startCm < q.endCm, {
    message: 'The range must start below its end.',
    path: ['endCm'],
  })
export type SticksQuery = z.infer<typeof sticksQuerySchema>

/** One problem in an uploaded line list. */
export interface LineListError {
  /** 1-based line number in the file. */
  lineNumber: number
  /** Field name ('record' for the record as a whole). */
  field: string
  /** 1-based inclusive columns of the field. */
  columnRange: [number, number]
  value: string
  expected: string
}

/** `details` of a 400 LINE_LIST_INVALID answer. */
export interface LineListInvalidDetails {
  /** The first IMPORT_ERRORS_LISTED problems, in file order. */
  errors: LineListError[]
  /** Every problem found (reading stops at IMPORT_ERRORS_BEFORE_STOP). */
  errorCount: number
  /** Non-blank records read. */
  recordCount: number
  stoppedEarly: boolean
}

export interface IsotopologueSummary {
  isotopologueId: number
  /** Short mass code such as '626', when Tauline's isotopologue table knows it. */
  code: string | null
  lineCount: number
  /** Σ S at 296 K, cm⁻¹/(molecule cm⁻²). */
  intensitySumCmPerMolecule: number
  minWavenumberCm: number
  maxWavenumberCm: number
}

export interface MoleculeSummary {
  moleculeId: number
  /** Formula for the gases Tauline models, otherwise 'molecule N'. */
  molecule: string
  /** True when runs use these lines (the gas has an amount in a profile). */
  modelled: boolean
  lineCount: number
  intensitySumCmPerMolecule: number
  minWavenumberCm: number
  maxWavenumberCm: number
  isotopologues: IsotopologueSummary[]
}

/** The (molecule, isotopologue, upper and lower global quanta) group with the largest Σ S. */
export interface StrongestBand {
  moleculeId: number
  molecule: string
  isotopologueId: number
  upperGlobalQuanta: string
  lowerGlobalQuanta: string
  lineCount: number
  intensitySumCmPerMolecule: number
  minWavenumberCm: number
  maxWavenumberCm: number
}

export interface LineListWarning {
  code:
    'MOLECULE_NOT_MODELLED' | 'ISOTOPOLOGUE_WITHOUT_DATA' | 'BAND_GROUPS_TRUNCATED' | 'NOT_SORTED'
  message: string
}

/** What a line list holds, computed while streaming through it. */
export interface LineListSummary {
  lineCount: number
  blankLineCount: number
  minWavenumberCm: number
  maxWavenumberCm: number
  /** True when the records come in non-decreasing wavenumber order. */
  sortedByWavenumber: boolean
  molecules: MoleculeSummary[]
  strongestBand: StrongestBand | null
  /** Distinct (molecule, isotopologue, global quanta) groups counted. */
  bandGroupCount: number
  warnings: LineListWarning[]
}

/** Answer of POST /api/catalogues/imports: the file passed every check and waits for its commit. */
export interface ImportPreview {
  token: string
  fileName: string
  byteSize: number
  fileSha256: string
  expiresAt: string
  summary: LineListSummary
}

export interface CatalogueProvenance {
  fileName: string
  fileSha256: string
  byteSize: number
  uploadedBy: { id: number; name: string }
  parsedAt: string
  summary: LineListSummary
}

/** A band of the built-in catalogue with its source and confidence tag. */
export interface BuiltInBand {
  id: string
  molecule: string
  isotopologueId: number | null
  description: string
  lineCount: number
  minWavenumberCm: number
  maxWavenumberCm: number
  intensitySumCmPerMolecule: number
  publishedBandIntensityCmPerMolecule: number | null
  source: string
  confidence: string | null
}

/** What the built-in catalogue is and how far to trust it. */
export interface BuiltInCatalogueInfo {
  generatorVersion: string
  createdFrom: string
  bands: BuiltInBand[]
  confidenceTags: { tag: string; meaning: string }[]
  accuracyNotes: string[]
}

export interface CatalogueSummary {
  id: CatalogueId
  name: string
  description: string
  kind: 'builtin' | 'imported'
  readOnly: boolean
  lineCount: number
  molecules: string[]
  minWavenumberCm: number
  maxWavenumberCm: number
  /** 'sha256:<hex>' of the stored line data (built-in: of the catalogue file body). */
  checksum: string
  mergeWithBuiltIn: boolean
  sourceFileName: string | null
  ownerId: number | null
  ownerName: string
  createdAt: string | null
  updatedAt: string | null
  /** Only on the built-in entry. */
  builtin?: BuiltInCatalogueInfo
}

export interface CatalogueDetail extends CatalogueSummary {
  moleculeTable: MoleculeSummary[]
  strongestBand: StrongestBand | null
  warnings: LineListWarning[]
  provenance: CatalogueProvenance | null
  /** For a merged import: the built-in molecules the runs take from the built-in catalogue. */
  builtInMoleculesUsed: string[]
  /** Lines a run uses (imported lines plus built-in lines of the other molecules when merged). */
  effectiveLineCount: number
}

/** The strongest line per bin of one molecule (empty bins left out). */
export interface StickSeries {
  moleculeId: number
  molecule: string
  /** True for built-in lines of a merged catalogue. */
  fromBuiltIn: boolean
  wavenumberCm: number[]
  intensityCmPerMolecule: number[]
}

export interface StickSpectrum {
  catalogueId: CatalogueId
  startCm: number
  endCm: number
  bins: number
  binWidthCm: number
  /** Lines inside the range (before keeping the strongest per bin). */
  lineCountInRange: number
  series: StickSeries[]
}
