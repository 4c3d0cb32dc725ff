import { z } from 'zod'

/** A reviewer either signs a run off (it is then frozen) or asks its owner for changes. */
export const REVIEW_STATES = ['signed-off', 'changes-requested'] as const
export type ReviewState = (typeof REVIEW_STATES)[number]

export const REVIEW_STATE_TITLES: Record<ReviewState, string> = {
  'signed-off': 'Signed off',
  'changes-requested': 'Changes requested',
}

export const REVIEW_COMMENT_MAX_CHARS = 4000

export const createReviewSchema = z
  .object({
    state: z.enum(REVIEW_STATES, 'Choose a verdict: signed-off or changes-requested.'),
    comment: z
      .string('Write the comment as text.')
      .trim()
      .max(REVIEW_COMMENT_MAX_CHARS, `At most ${REVIEW_COMMENT_MAX_CHARS} characters.`)
      .default(''),
  })
  .refine((r) => r.state !== 'changes-requested' || r.comment.length > 0, {
    message: 'Say what should change.',
    path: ['comment'],
  })
export type CreateReviewInput = z.infer<typeof createReviewSchema>

/** One review of a run, as the API shows it. */
export interface RunReview {
  id: number
  runId: number
  reviewerId: number
  reviewerName: string
  state: ReviewState
  comment: string
  /** Hex SHA-256 over the canonical review record (see server/runs/review-signature.ts). */
  signature: string
  /** Hex SHA-256 of the stored results when the review was made. */
  resultsDigest: string
  signedAt: string
}

/** A finished run waiting for a sign-off. */
export interface ReviewQueueItem {
  runId: number
  name: string
  profileName: string
  mixtureName: string | null
  ownerId: number
  ownerName: string
  finishedAt: string | null
  olrWPerM2: number | null
  inputHash: string
  reviewCount: number
  latestReview: { state: ReviewState; reviewerName: string; signedAt: string } | null
}

/** The tamper check: the signature recomputed from what is stored now. */
export interface ReviewVerification {
  runId: number
  reviewId: number
  state: ReviewState
  /** True when the recomputed signature equals the stored one. */
  valid: boolean
  signature: string
  recomputedSignature: string
  resultsDigest: string
  recomputedResultsDigest: string
  inputHash: string
  recomputedInputHash: string
}
