import {
  Op,
  UniqueConstraintError,
  literal,
  type Sequelize,
  type Transaction,
  type WhereOptions,
} from 'sequelize'
import type { ListQuery, Page } from '../../shared/schemas/paging'
import type {
  CreateReviewInput,
  ReviewQueueItem,
  ReviewVerification,
  RunReview,
} from '../../shared/schemas/reviews'
import { AppError } from '../errors'
import { Review, Run, RunResult, User } from '../models/index'
import { resultsDigest, reviewSignature } from '../runs/review-signature'
import { runInputHash } from '../runs/run-inputs'
import type { Actor } from './access'

/** Who signed a run off and when; absent while the run is not signed off. */
export interface SignOffInfo {
  reviewId: number
  reviewerName: string
  signedAt: Date
}

const withReviewer = { model: User, as: 'reviewer', attributes: ['displayName'] }

function toRunReview(r: Review): RunReview {
  return {
    id: r.id,
    runId: r.runId,
    reviewerId: r.reviewerId,
    reviewerName: r.reviewer?.displayName ?? '',
    state: r.state,
    comment: r.comment,
    signature: r.signature,
    resultsDigest: r.resultsDigest,
    signedAt: r.createdAt.toISOString(),
  }
}

/** The sign-off of each of the given runs that has one. */
export async function signOffsOf(
  runIds: number[],
  transaction?: Transaction,
): Promise<Map<number, SignOffInfo>> {
  if (runIds.length === 0) return new Map()
  const rows = await Review.findAll({
    where: { runId: runIds, state: 'signed-off' },
    include: [withReviewer],
    transaction,
  })
  return new Map(
    rows.map((r) => [
      r.runId,
      { reviewId: r.id, reviewerName: r.reviewer?.displayName ?? '', signedAt: r.createdAt },
    ]),
  )
}

function signedOffError(runId: number, s: SignOffInfo, refused: string): AppError {
  return new AppError(
    409,
    'RUN_SIGNED_OFF',
    `Run #${runId} was signed off by ${s.reviewerName} on ${s.signedAt.toISOString().slice(0, 10)}; signed runs are frozen, so ${refused}.`,
    { reviewId: s.reviewId, signedOffBy: s.reviewerName, signedOffAt: s.signedAt.toISOString() },
  )
}

/** 409 RUN_SIGNED_OFF when the run is signed off; call it inside the transaction that changes it. */
export async function assertNotSignedOff(
  runId: number,
  refused: string,
  transaction?: Transaction,
): Promise<void> {
  const signOff = (await signOffsOf([runId], transaction)).get(runId)
  if (signOff) throw signedOffError(runId, signOff, refused)
}

async function runOrFail(id: number, transaction?: Transaction): Promise<Run> {
  const run = await Run.findByPk(id, {
    transaction,
    lock: transaction ? transaction.LOCK.UPDATE : undefined,
  })
  if (!run) throw AppError.notFound('Run')
  return run
}

/** Every review of a run, oldest first. */
export async function listRunReviews(runId: number): Promise<RunReview[]> {
  await runOrFail(runId)
  const rows = await Review.findAll({
    where: { runId },
    include: [withReviewer],
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  })
  return rows.map(toRunReview)
}

/**
 * Records a review of a finished run, signed over its inputs, engine and stored results. The run
 * row stays locked meanwhile, so a sign-off and a delete of the same run cannot interleave.
 */
export async function createReview(
  sequelize: Sequelize,
  actor: Actor,
  runId: number,
  input: CreateReviewInput,
): Promise<RunReview> {
  if (actor.role !== 'reviewer' && actor.role !== 'admin') {
    throw AppError.forbidden('Only reviewers and administrators review runs.')
  }
  try {
    const id = await sequelize.transaction(async (tx) => {
      const run = await runOrFail(runId, tx)
      if (run.ownerId === actor.id) {
        throw AppError.forbidden('You cannot review your own run: ask another reviewer.')
      }
      if (run.status !== 'succeeded') {
        throw AppError.conflict(
          `Only runs that finished with results can be reviewed (this one is ${run.status}).`,
        )
      }
      await assertNotSignedOff(runId, 'it takes no further reviews', tx)
      const result = await RunResult.findByPk(runId, { transaction: tx })
      if (!result) throw AppError.conflict('The run has no stored results to review.')
      const signedAt = new Date()
      const digest = resultsDigest(result)
      const signature = reviewSignature({
        runId,
        inputHash: run.inputHash,
        engineVersion: run.engineVersion,
        resultsDigest: digest,
        reviewerId: actor.id,
        state: input.state,
        comment: input.comment,
        signedAt,
      })
      const review = await Review.create(
        {
          runId,
          reviewerId: actor.id,
          state: input.state,
          comment: input.comment,
          signature,
          resultsDigest: digest,
          createdAt: signedAt,
        },
        { transaction: tx },
      )
      return review.id
    })
    const created = await Review.findByPk(id, { include: [withReviewer] })
    return toRunReview(created!)
  } catch (err) {
    // The one-sign-off-per-run index: a concurrent sign-off won the race.
    if (err instanceof UniqueConstraintError) {
      const signOff = (await signOffsOf([runId])).get(runId)
      if (signOff) throw signedOffError(runId, signOff, 'it takes no further reviews')
    }
    throw err
  }
}

/**
 * Recomputes the signature of the run's sign-off (or, without one, its latest review) from what
 * is stored now: its input hash from the frozen inputs and the digest of its results.
 */
export async function verifyRunReview(runId: number): Promise<ReviewVerification> {
  const run = await runOrFail(runId)
  const review =
    (await Review.findOne({ where: { runId, state: 'signed-off' } })) ??
    (await Review.findOne({
      where: { runId },
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
    }))
  if (!review) throw AppError.notFound('Review of this run')
  const result = await RunResult.findByPk(runId)
  const recomputedResultsDigest = result ? resultsDigest(result) : ''
  const recomputedInputHash = runInputHash(run.inputs)
  const recomputedSignature = reviewSignature({
    runId,
    inputHash: recomputedInputHash,
    engineVersion: run.engineVersion,
    resultsDigest: recomputedResultsDigest,
    reviewerId: review.reviewerId,
    state: review.state,
    comment: review.comment,
    signedAt: review.createdAt,
  })
  return {
    runId,
    reviewId: review.id,
    state: review.state,
    valid: recomputedSignature === review.signature,
    signature: review.signature,
    recomputedSignature,
    resultsDigest: review.resultsDigest,
    recomputedResultsDigest,
    inputHash: run.inputHash,
    recomputedInputHash,
  }
}

/** Finished runs without a sign-off, the longest waiting first. */
export async function listReviewQueue(query: ListQuery): Promise<Page<ReviewQueueItem>> {
  const where: WhereOptions = {
    status: 'succeeded',
    [Op.and]: [
      literal(
        `NOT EXISTS (SELECT 1 FROM reviews WHERE reviews.run_id = "Run"."id" AND reviews.state = 'signed-off')`,
      ),
    ],
  }
  if (query.search) Object.assign(where, { name: { [Op.iLike]: `%${query.search}%` } })
  const { rows, count } = await Run.findAndCountAll({
    where,
    include: [
      { model: User, as: 'owner', attributes: ['displayName'] },
      { model: RunResult, as: 'result', attributes: ['summary'] },
    ],
    order: [
      ['finishedAt', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  })
  const reviews = await Review.findAll({
    where: { runId: rows.map((r) => r.id) },
    include: [withReviewer],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  })
  const items = rows.map((run): ReviewQueueItem => {
    const ofRun = reviews.filter((r) => r.runId === run.id)
    const latest = ofRun[0]
    const summary = (run as unknown as { result?: RunResult }).result?.summary
    return {
      runId: run.id,
      name: run.name,
      profileName: run.inputs.profile.name,
      mixtureName: run.inputs.mixture?.name ?? null,
      ownerId: run.ownerId,
      ownerName: run.owner?.displayName ?? '',
      finishedAt: run.finishedAt?.toISOString() ?? null,
      olrWPerM2: (summary?.olrWPerM2 as number | undefined) ?? null,
      inputHash: run.inputHash,
      reviewCount: ofRun.length,
      latestReview: latest
        ? {
            state: latest.state,
            reviewerName: latest.reviewer?.displayName ?? '',
            signedAt: latest.createdAt.toISOString(),
          }
        : null,
    }
  })
  return { items, total: count, page: query.page, pageSize: query.pageSize }
}
