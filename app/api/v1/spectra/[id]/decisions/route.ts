import { json, route } from '@/lib/http/route';
import { decide, listDecisions } from '@/lib/services/decisions';
import { decisionBody, decisionsParams } from './schema';

export const dynamic = 'force-dynamic';

export type DecisionsResponse = Awaited<ReturnType<typeof listDecisions>>;
export type DecideResponse = Awaited<ReturnType<typeof decide>>;

/** Every decision, newest first, and where the approval rule stands. */
export const GET = route({ params: decisionsParams }, async ({ em, caller, params }): Promise<DecisionsResponse> =>
  listDecisions(em, caller, params.id),
);

/** Approve, return or reject the current revision (409: own spectrum, stale revision, wrong state, lost race). */
export const POST = route({ params: decisionsParams, body: decisionBody }, async ({ em, caller, params, body }) =>
  json(await decide(em, caller, params.id, body), 201),
);
