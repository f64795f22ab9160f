import { z } from 'zod';

export const waiverParams = z.object({ id: z.string() });

export const waiverBody = z.object({ reason: z.string().trim().min(1, 'a waiver needs a written reason').max(5_000) }).strict();
