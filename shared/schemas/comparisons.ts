import { z } from 'zod'
import type { InputDifference, ResultsComparison } from '../results/compare-results'
import type { RunSummary } from './runs'

/** Two succeeded runs to compare: `before` is the reference, forcing is taken from it to `after`. */
export const comparisonQuerySchema = z
  .object({
    before: z.coerce.number().int().positive(),
    after: z.coerce.number().int().positive(),
  })
  .refine((q) => q.before !== q.after, { message: 'Choose two different runs.', path: ['after'] })
export type ComparisonQuery = z.infer<typeof comparisonQuerySchema>

export const comparisonCsvQuerySchema = z
  .object({
    before: z.coerce.number().int().positive(),
    after: z.coerce.number().int().positive(),
    table: z.enum(['spectrum', 'column']),
  })
  .refine((q) => q.before !== q.after, { message: 'Choose two different runs.', path: ['after'] })
export type ComparisonCsvQuery = z.infer<typeof comparisonCsvQuerySchema>

export interface RunComparison {
  before: RunSummary
  after: RunSummary
  /** What differs in the frozen inputs (at most 30 entries). */
  inputDifferences: InputDifference[]
  /** The runs' engine versions differ: some of the difference may be the engine's. */
  engineVersionsDiffer: boolean
  /** The runs used different line catalogues (id or checksum). */
  cataloguesDiffer: boolean
  comparison: ResultsComparison
}
