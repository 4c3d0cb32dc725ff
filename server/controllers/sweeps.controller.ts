import type { Request, Response } from 'express'
import type { Sequelize } from 'sequelize'
import Papa from 'papaparse'
import type { ListQuery } from '../../shared/schemas/paging'
import type { CreateSweepInput } from '../../shared/schemas/sweeps'
import { AppError } from '../errors'
import type { RunQueue } from '../runs/run-queue'
import * as sweeps from '../runs/sweep.service'
import { actorOf, idParam } from './request-helpers'

export function createSweepsController(sequelize: Sequelize, getQueue: () => RunQueue | undefined) {
  const queue = () => {
    const q = getQueue()
    if (!q)
      throw new AppError(503, 'QUEUE_UNAVAILABLE', 'The run queue is not running on this server.')
    return q
  }
  return {
    async create(req: Request, res: Response) {
      res
        .status(202)
        .json({
          sweep: await sweeps.createSweep(
            sequelize,
            queue(),
            actorOf(req),
            req.body as CreateSweepInput,
          ),
        })
    },
    async list(req: Request, res: Response) {
      res.json(await sweeps.listSweeps(req.query as unknown as ListQuery))
    },
    async get(req: Request, res: Response) {
      res.json({ sweep: await sweeps.getSweep(idParam(req)) })
    },
    async forcingCsv(req: Request, res: Response) {
      const sweep = await sweeps.getSweep(idParam(req))
      res.setHeader('Content-Type', 'text/csv; charset=utf-8')
      res.setHeader(
        'Content-Disposition',
        `attachment; filename="tauline-sweep-${sweep.id}-forcing.csv"`,
      )
      res.send(Papa.unparse(sweeps.sweepForcingCsvRows(sweep), { newline: '\n' }) + '\n')
    },
  }
}
