import { json, route } from '@/lib/http/route';
import { listThreads, openThread, type ThreadDto } from '@/lib/services/threads';
import { openThreadBody, threadsParams } from './schema';

export const dynamic = 'force-dynamic';

export type ThreadsResponse = { items: ThreadDto[] };
export type ThreadResponse = ThreadDto;

/** The spectrum's threads, oldest first, each with its replies, anchor and whether it moved since. */
export const GET = route({ params: threadsParams }, async ({ em, caller, params }): Promise<ThreadsResponse> =>
  listThreads(em, caller, params.id),
);

/** A new thread on a point `{revision, index, branch}`, a finding `{finding}` or the spectrum (null). */
export const POST = route({ params: threadsParams, body: openThreadBody }, async ({ em, caller, params, body }) =>
  json(await openThread(em, caller, params.id, body), 201),
);
