import type { Page } from '@shared/schemas/paging'
import type {
  CreateReviewInput,
  ReviewQueueItem,
  ReviewVerification,
  RunReview,
} from '@shared/schemas/reviews'
import { http, queryString } from './http'

/** A page of finished runs waiting for a sign-off, the longest waiting first. */
export function fetchReviewQueue(
  params: { page?: number; pageSize?: number; search?: string } = {},
) {
  return http.get<Page<ReviewQueueItem>>(`/reviews/queue?${queryString(params)}`)
}

/** Every review of a run, oldest first. */
export async function fetchRunReviews(runId: number): Promise<RunReview[]> {
  return (await http.get<{ reviews: RunReview[] }>(`/runs/${runId}/reviews`)).reviews
}

/** Signs a run off or asks for changes; a sign-off freezes the run. */
export async function createRunReview(runId: number, input: CreateReviewInput): Promise<RunReview> {
  return (await http.post<{ review: RunReview }>(`/runs/${runId}/reviews`, input)).review
}

/** Recomputes the signature of the run's sign-off (or latest review) from what is stored now. */
export function verifyRunReview(runId: number): Promise<ReviewVerification> {
  return http.get<ReviewVerification>(`/runs/${runId}/reviews/verify`)
}
