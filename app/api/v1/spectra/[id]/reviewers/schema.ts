import { z } from 'zod';

export const reviewersParams = z.object({ id: z.string() });

export const reviewersBody = z
  .object({ reviewers: z.array(z.string().uuid()).max(50), version: z.number().int().optional() })
  .strict();
