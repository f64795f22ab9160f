import { route } from '@/lib/http/route';
import { getReviewers, setReviewers, type ReviewersDto } from '@/lib/services/reviewers';
import { reviewersBody, reviewersParams } from './schema';

export const dynamic = 'force-dynamic';

export type ReviewersResponse = ReviewersDto;

/** The assigned reviewers (and, for admins, who may be assigned). */
export const GET = route({ params: reviewersParams }, async ({ em, caller, params }): Promise<ReviewersResponse> =>
  getReviewers(em, caller, params.id),
);

/** Replace the assigned reviewers (admins); newly assigned people are notified. */
export const PUT = route({ params: reviewersParams, body: reviewersBody }, async ({ em, caller, params, body }): Promise<ReviewersResponse> =>
  setReviewers(em, caller, params.id, body),
);
