import { z } from 'zod';
import { slugField, uuidField } from '@/lib/http/fields';
import { spectrumMetaFields } from '../v1/spectra/schema';

/** A new spectrum: the group and its metadata (the new-spectrum form). */
export const newSpectrumInput = spectrumMetaFields.extend({ group: slugField }).strict();

/** A new revision of one's own spectrum. */
export const newRevisionInput = z
  .object({
    spectrumId: uuidField,
    note: z.string().trim().max(10_000).optional().nullable().transform((v) => v || null),
  })
  .strict();

/** The band-file route's input: `{group, title, material, …}` or `{spectrumId, note}`. */
export const bandFileInput = z.union([newRevisionInput, newSpectrumInput]);
export type BandFileInput = z.input<typeof bandFileInput>;
