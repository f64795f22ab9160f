import { route } from '@/lib/http/route';
import { withdraw, type ReviewStateDto } from '@/lib/services/decisions';
import { moveBody, moveParams } from './schema';

export const dynamic = 'force-dynamic';

export type WithdrawResponse = ReviewStateDto;

/** Its submitter withdraws the spectrum from any open state. */
export const POST = route({ params: moveParams, body: moveBody }, async ({ em, caller, params, body }): Promise<WithdrawResponse> =>
  withdraw(em, caller, params.id, body),
);
