import { z } from 'zod';

export const revisionsParams = z.object({ id: z.string() });

/** POST /api/v1/spectra/{id}/revisions: the multipart fields besides `file`. */
export const newRevisionFields = z.object({
  note: z
    .string()
    .trim()
    .max(10_000, 'At most 10000 characters.')
    .optional()
    .transform((v) => v || null),
});
