import { z } from 'zod';

export const decisionsParams = z.object({ id: z.string() });

export const decisionBody = z
  .object({
    verdict: z.enum(['approve', 'return', 'reject']),
    note: z.string().trim().min(1, 'a decision needs a note').max(10_000),
    /** The revision decided on: must be the current one. */
    revision: z.string(),
    /** Optional: the spectrum version the page loaded. */
    version: z.number().int().optional(),
  })
  .strict();
