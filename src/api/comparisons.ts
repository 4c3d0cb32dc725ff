import type { RunComparison } from '@shared/schemas/comparisons'
import { http } from './http'

/** Two succeeded runs compared: forcing from `before` (the reference) to `after`. */
export async function fetchComparison(before: number, after: number): Promise<RunComparison> {
  return (await http.get<{ comparison: RunComparison }>(`/comparisons?before=${before}&after=${after}`)).comparison
}

/** Where the comparison's whole table downloads as CSV (per bin, or per level of the column). */
export const comparisonCsvUrl = (before: number, after: number, table: 'spectrum' | 'column') =>
  `/api/comparisons/csv?before=${before}&after=${after}&table=${table}`
