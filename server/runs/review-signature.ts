import { createHash } from 'node:crypto'
import type { ReviewState } from '../../shared/schemas/reviews'
import { canonicalJson } from './canonical-json'

/** Everything a review vouches for; the signature is the hash of exactly these fields. */
export interface SignedReviewRecord {
  runId: number
  inputHash: string
  engineVersion: string
  resultsDigest: string
  reviewerId: number
  state: ReviewState
  comment: string
  signedAt: Date
}

function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex')
}

/**
 * SHA-256 of a run's stored results (summary and data, plus the full-resolution window when the
 * run has one) as canonical JSON, so the same numbers give the same digest whatever order
 * PostgreSQL returns the JSONB keys in.
 */
export function resultsDigest(result: {
  summary: unknown
  data: unknown
  detail?: unknown
}): string {
  const { summary, data, detail } = result
  return sha256Hex(canonicalJson(detail == null ? { summary, data } : { summary, data, detail }))
}

/**
 * Hex SHA-256 over the canonical review record. It is a fingerprint without a secret key: it
 * shows whether the run, its results or the review changed since signing, not who signed.
 */
export function reviewSignature(record: SignedReviewRecord): string {
  return sha256Hex(canonicalJson({ ...record, signedAt: record.signedAt.toISOString() }))
}
