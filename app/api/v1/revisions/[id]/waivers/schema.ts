import { z } from 'zod';

/** Keeps one request and its transaction bounded; more findings go in several requests. */
export const maxFindingsPerWaiver = 2_000;

export const waiversBody = z
  .object({
    findingIds: z
      .array(z.string().min(1))
      .min(1, 'name at least one finding')
      .max(maxFindingsPerWaiver, `at most ${maxFindingsPerWaiver} findings at once`)
      .refine((ids) => new Set(ids).size === ids.length, 'a finding is listed twice'),
    reason: z.string().trim().min(1, 'a waiver needs a written reason').max(5_000),
  })
  .strict();
