import type { Request, Response } from 'express'
import Papa from 'papaparse'
import type { ComparisonCsvQuery, ComparisonQuery } from '../../shared/schemas/comparisons'
import { compareStoredRuns, comparisonCsvRows } from '../runs/comparison.service'

export function createComparisonsController() {
  return {
    async get(req: Request, res: Response) {
      const { before, after } = req.query as unknown as ComparisonQuery
      res.json({ comparison: await compareStoredRuns(before, after) })
    },
    async csv(req: Request, res: Response) {
      const { before, after, table } = req.query as unknown as ComparisonCsvQuery
      const comparison = await compareStoredRuns(before, after)
      const forcing = comparison.comparison.forcing.map((f) => `${f.level} ${f.forcingWPerM2.toPrecision(6)}`).join(', ')
      const head = [
        `# Tauline comparison: run ${before} (reference) → run ${after}; forcing = reduction of net upward flux, W m-2: ${forcing}`,
        '# Clear sky, local thermodynamic equilibrium, instantaneous; defer to peer-reviewed assessments for policy figures.',
      ].join('\n')
      res.setHeader('Content-Type', 'text/csv; charset=utf-8')
      res.setHeader('Content-Disposition', `attachment; filename="tauline-compare-${before}-${after}-${table}.csv"`)
      res.send(`${head}\n${Papa.unparse(comparisonCsvRows(comparison, table), { newline: '\n' })}\n`)
    },
  }
}
