import { z } from 'zod';

export const threadsParams = z.object({ id: z.string() });

const text = (max: number) => z.string().trim().min(1, 'must not be empty').max(max);

export const anchorSchema = z.union([
  z.object({ revision: z.string(), index: z.number().int().min(0), branch: z.number().int().min(0) }).strict(),
  z.object({ finding: z.string() }).strict(),
  z.null(),
]);

export const openThreadBody = z
  .object({
    anchor: anchorSchema.default(null),
    body: text(10_000),
    blocking: z.boolean().default(false),
  })
  .strict();
export type OpenThreadBody = z.input<typeof openThreadBody>;
