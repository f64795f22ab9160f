import { z } from 'zod';

export const groupAuditParams = z.object({ slug: z.string() });

export const groupAuditQuery = z.object({
  action: z.string().max(64).optional(),
  actor: z.string().uuid().optional(),
  target: z.string().max(200).optional(),
  from: z.coerce.date().optional(),
  to: z.coerce.date().optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
