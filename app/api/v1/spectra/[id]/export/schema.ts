import { z } from 'zod';
import { exportFormats } from '@/lib/services/export';

export const exportParams = z.object({ id: z.string() });

/** `format` is required; `units` applies to csv and svg; `width`/`height` (px) to svg. */
export const exportQuery = z.object({
  format: z.enum(exportFormats),
  units: z.enum(['THz', 'cm-1', 'meV']).optional(),
  width: z.coerce.number().int().min(200).max(4000).optional(),
  height: z.coerce.number().int().min(150).max(3000).optional(),
});
