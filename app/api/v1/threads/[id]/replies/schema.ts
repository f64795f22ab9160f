import { z } from 'zod';

export const repliesParams = z.object({ id: z.string() });

export const replyBody = z.object({ body: z.string().trim().min(1, 'must not be empty').max(10_000) }).strict();
