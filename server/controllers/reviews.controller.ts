import type { Request, Response } from 'express'
import type { Sequelize } from 'sequelize'
import type { ListQuery } from '../../shared/schemas/paging'
import type { CreateReviewInput } from '../../shared/schemas/reviews'
import * as reviews from '../services/review.service'
import { actorOf, idParam } from './request-helpers'

export function createReviewsController(sequelize: Sequelize) {
  return {
    async queue(req: Request, res: Response) {
      res.json(await reviews.listReviewQueue(req.query as unknown as ListQuery))
    },
    async list(req: Request, res: Response) {
      res.json({ reviews: await reviews.listRunReviews(idParam(req)) })
    },
    async create(req: Request, res: Response) {
      const review = await reviews.createReview(
        sequelize,
        actorOf(req),
        idParam(req),
        req.body as CreateReviewInput,
      )
      res.status(201).json({ review })
    },
    async verify(req: Request, res: Response) {
      res.json(await reviews.verifyRunReview(idParam(req)))
    },
  }
}
