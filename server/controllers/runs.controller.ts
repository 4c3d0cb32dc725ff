import type { Request, Response } from 'express'
import type { Sequelize } from 'sequelize'
import { TERMINAL_RUN_STATUSES, type CreateRunInput, type RunListQuery } from '../../shared/schemas/runs'
import { AppError } from '../errors'
import { CSV_TABLES, detailCsv, resultsCsv, type CsvTable } from '../runs/results-csv'
import type { RunQueue } from '../runs/run-queue'
import * as runs from '../runs/run.service'
import { actorOf, idParam } from './request-helpers'

export function createRunsController(sequelize: Sequelize, getQueue: () => RunQueue | undefined) {
  const queue = () => {
    const q = getQueue()
    if (!q) throw new AppError(503, 'QUEUE_UNAVAILABLE', 'The run queue is not running on this server.')
    return q
  }
  return {
    async create(req: Request, res: Response) {
      res.status(202).json({ run: await runs.createRun(sequelize, queue(), actorOf(req), req.body as CreateRunInput) })
    },
    async list(req: Request, res: Response) {
      res.json(await runs.listRuns(actorOf(req), req.query as unknown as RunListQuery))
    },
    async get(req: Request, res: Response) {
      res.json({ run: await runs.getRun(idParam(req)) })
    },
    async cancel(req: Request, res: Response) {
      res.json({ run: await runs.cancelRun(sequelize, queue(), actorOf(req), idParam(req)) })
    },
    async remove(req: Request, res: Response) {
      await runs.deleteRun(sequelize, queue(), actorOf(req), idParam(req))
      res.status(204).end()
    },
    async results(req: Request, res: Response) {
      res.type('application/json').send(await runs.getRunResultsJsonText(idParam(req)))
    },
    async detail(req: Request, res: Response) {
      res.type('application/json').send(await runs.getRunDetailJsonText(idParam(req)))
    },
    async resultsCsv(req: Request, res: Response) {
      const table = String(req.query.table ?? 'spectrum') as CsvTable
      if (!CSV_TABLES.includes(table)) throw AppError.badRequest(`table must be one of ${CSV_TABLES.join(', ')}.`, { field: 'table' })
      const id = idParam(req)
      const csv =
        table === 'detail'
          ? detailCsv(await runs.getRunDetailSpectrum(id))
          : resultsCsv(await runs.getRunResults(id), table)
      res.setHeader('Content-Type', 'text/csv; charset=utf-8')
      res.setHeader('Content-Disposition', `attachment; filename="tauline-run-${id}-${table}.csv"`)
      res.send(csv)
    },
    /** Server-sent events: progress every second until the run ends. Works wherever workers run. */
    async events(req: Request, res: Response) {
      const id = idParam(req)
      await runs.getRunProgress(id) // 404 before the stream opens
      res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache', Connection: 'keep-alive' })
      let closed = false
      req.on('close', () => {
        closed = true
      })
      while (!closed) {
        const progress = await runs.getRunProgress(id)
        res.write(`event: progress\ndata: ${JSON.stringify(progress)}\n\n`)
        if (TERMINAL_RUN_STATUSES.includes(progress.status)) {
          res.write(`event: end\ndata: ${JSON.stringify({ status: progress.status })}\n\n`)
          break
        }
        await new Promise((r) => setTimeout(r, 1000))
      }
      res.end()
    },
  }
}
