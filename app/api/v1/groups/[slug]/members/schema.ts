import { z } from 'zod';

export const membersParams = z.object({ slug: z.string() });
