import type { RunComparison } from '../../shared/schemas/comparisons'
import type { RunDetail, RunSummary } from '../../shared/schemas/runs'
import {
  compareResults,
  inputDifferences,
  ResultsNotComparableError,
  type ComparableResults,
  type ResultsComparison,
} from '../../shared/results/compare-results'
import { AppError } from '../errors'
import { RunResult } from '../models/index'
import { getRun } from './run.service'

/** A succeeded run, or 409 naming the run and its status. */
async function succeeded(id: number, role: 'before' | 'after'): Promise<RunDetail> {
  const run = await getRun(id)
  if (run.status !== 'succeeded') {
    throw AppError.conflict(`Run ${id} (“${run.name}”) has no results to compare (status: ${run.status}).`, { field: role })
  }
  return run
}

async function storedResults(runId: number): Promise<ComparableResults> {
  const result = await RunResult.findByPk(runId, { attributes: ['summary', 'data'] })
  if (!result) throw AppError.notFound('Run results')
  return { summary: result.summary, ...result.data } as unknown as ComparableResults
}

const summaryOf = ({ inputs: _inputs, mixtureWarnings: _warnings, ...summary }: RunDetail): RunSummary => summary

/**
 * Two succeeded runs side by side: forcing from `before` (the reference) to `after` at the top,
 * the tropopause and the surface, spectrally and level by level, and what differs in their
 * inputs. Runs with different bins or numbers of levels are refused (422) with the field named.
 */
export async function compareStoredRuns(beforeId: number, afterId: number): Promise<RunComparison> {
  const [before, after] = await Promise.all([succeeded(beforeId, 'before'), succeeded(afterId, 'after')])
  // The runs are known to have succeeded: read only their stored results.
  const [beforeResults, afterResults] = await Promise.all([storedResults(beforeId), storedResults(afterId)])
  let comparison: ResultsComparison
  try {
    comparison = compareResults(beforeResults, afterResults)
  } catch (err) {
    if (err instanceof ResultsNotComparableError) {
      throw new AppError(422, 'NOT_COMPARABLE', err.message, { field: err.field })
    }
    throw err
  }
  return {
    before: summaryOf(before),
    after: summaryOf(after),
    inputDifferences: inputDifferences(before.inputs, after.inputs),
    engineVersionsDiffer: before.engineVersion !== after.engineVersion,
    cataloguesDiffer:
      before.inputs.catalogue.id !== after.inputs.catalogue.id ||
      before.inputs.catalogue.checksum !== after.inputs.catalogue.checksum,
    comparison,
  }
}

/** The comparison as CSV rows: per bin (`spectrum`) or per level (`column`). */
export function comparisonCsvRows(c: RunComparison, table: 'spectrum' | 'column'): Record<string, number | string | null>[] {
  const s = c.comparison.spectrum
  if (table === 'spectrum') {
    return s.wavenumberCm.map((w, b) => ({
      'wavenumber_cm-1': w,
      [`olr_run${c.before.id}_W_m-2_(cm-1)-1`]: s.olrBefore[b],
      [`olr_run${c.after.id}_W_m-2_(cm-1)-1`]: s.olrAfter[b],
      'forcing_top_W_m-2_(cm-1)-1': s.toaForcing[b],
      'forcing_tropopause_W_m-2_(cm-1)-1': s.tropopauseForcing[b],
      'forcing_surface_W_m-2_(cm-1)-1': s.surfaceForcing[b],
      [`surface_down_run${c.before.id}_W_m-2_(cm-1)-1`]: s.surfaceDownBefore[b],
      [`surface_down_run${c.after.id}_W_m-2_(cm-1)-1`]: s.surfaceDownAfter[b],
    }))
  }
  const col = c.comparison.column
  return col.pressurePa.map((p, level) => ({
    level,
    pressure_Pa: p,
    'forcing_W_m-2': col.forcingWPerM2[level],
    // The layer between this level and the one above; the top level has none.
    'heating_rate_change_layer_above_K_day-1': level < col.heatingRateChangeKPerDay.length ? col.heatingRateChangeKPerDay[level] : null,
  }))
}
