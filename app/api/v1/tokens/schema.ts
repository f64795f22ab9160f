import { z } from 'zod';
import { slugField } from '@/lib/http/fields';

export const createTokenBody = z.object({
  group: slugField,
  name: z.string({ error: 'Name the token.' }).trim().min(1, 'Name the token.').max(80, 'At most 80 characters.'),
});
export type CreateTokenBody = z.infer<typeof createTokenBody>;
