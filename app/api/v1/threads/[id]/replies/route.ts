import { json, route } from '@/lib/http/route';
import { replyToThread, type ReplyDto } from '@/lib/services/threads';
import { repliesParams, replyBody } from './schema';

export const dynamic = 'force-dynamic';

export type ReplyResponse = ReplyDto;

/** A reply; `@name` mentions of group members notify them. */
export const POST = route({ params: repliesParams, body: replyBody }, async ({ em, caller, params, body }) =>
  json(await replyToThread(em, caller, params.id, body), 201),
);
