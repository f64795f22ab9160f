import { route } from '@/lib/http/route';
import { reopen, type ReviewStateDto } from '@/lib/services/decisions';
import { moveBody, moveParams } from './schema';

export const dynamic = 'force-dynamic';

export type ReopenResponse = ReviewStateDto;

/** An admin puts a rejected spectrum back in review; earlier approvals no longer count. */
export const POST = route({ params: moveParams, body: moveBody }, async ({ em, caller, params, body }): Promise<ReopenResponse> =>
  reopen(em, caller, params.id, body),
);
