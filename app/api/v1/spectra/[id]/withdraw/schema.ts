import { z } from 'zod';

export const moveParams = z.object({ id: z.string() });

export const moveBody = z
  .object({ note: z.string().trim().max(5_000).optional(), version: z.number().int().optional() })
  .strict();
