import { z } from 'zod';

export const spectrumAuditParams = z.object({ id: z.string() });
