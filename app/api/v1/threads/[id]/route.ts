import { route } from '@/lib/http/route';
import { updateThread } from '@/lib/services/threads';
import { threadParams, updateThreadBody } from './schema';

export const dynamic = 'force-dynamic';

export type UpdateThreadResponse = Awaited<ReturnType<typeof updateThread>>;

/** Resolve or reopen (`resolved`), mark or unmark blocking (`blocking`): reviewers and admins. */
export const PATCH = route({ params: threadParams, body: updateThreadBody }, async ({ em, caller, params, body }): Promise<UpdateThreadResponse> =>
  updateThread(em, caller, params.id, body),
);
