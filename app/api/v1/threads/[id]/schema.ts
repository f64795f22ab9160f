import { z } from 'zod';

export const threadParams = z.object({ id: z.string() });

export const updateThreadBody = z
  .object({ resolved: z.boolean().optional(), blocking: z.boolean().optional() })
  .strict()
  .refine((b) => b.resolved !== undefined || b.blocking !== undefined, { message: 'Send "resolved" or "blocking".' });
