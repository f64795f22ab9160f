import { z } from 'zod';

export const compareParams = z.object({ id: z.string() });

export const compareQuery = z.object({ a: z.string().min(1), b: z.string().min(1) });
