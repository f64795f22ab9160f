import { z } from 'zod';
import { screeningStatuses, spectrumStatuses, verdicts } from '@/entities';
import { slugField } from '@/lib/http/fields';
import { sortKeys } from '@/lib/services/spectra';

const text = (label: string, max: number) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .min(1, `${label} is required.`)
    .max(max, `At most ${max} characters.`);

/** An optional text field: absent, empty or blank all mean "not given". */
const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters.`)
    .optional()
    .nullable()
    .transform((v) => (v ? v : null));

/** A spectrum's metadata, as multipart fields (API) or as the upload route's input (pages). */
export const spectrumMetaFields = z.object({
  title: text('A title', 200),
  material: text('The material', 200),
  formula: optionalText(100),
  method: optionalText(200),
  code: optionalText(200),
  supercell: optionalText(100),
  qmesh: optionalText(100),
  notes: optionalText(10_000),
});
export type SpectrumMetaFields = z.output<typeof spectrumMetaFields>;

/** POST /api/v1/spectra: the multipart fields besides `file`. */
export const createSpectrumFields = spectrumMetaFields.extend({ group: slugField });
export type CreateSpectrumFields = z.output<typeof createSpectrumFields>;

/** A comma-separated list of allowed values, e.g. `status=in-review,returned`. */
function csv<T extends string>(values: readonly [T, ...T[]], what: string) {
  return z
    .string()
    .optional()
    .transform((s) => (s ? s.split(',').map((x) => x.trim()).filter(Boolean) : []))
    .pipe(z.array(z.enum(values, { error: `Each ${what} must be one of: ${values.join(', ')}.` })));
}

const sortField = z
  .string()
  .optional()
  .transform((s) => s || '-updated')
  .pipe(
    z
      .string()
      .regex(new RegExp(`^-?(${sortKeys.join('|')})$`), `sort is one of ${sortKeys.join(', ')}, with a leading "-" for descending.`),
  )
  .transform((s) => ({
    sort: s.replace(/^-/, '') as (typeof sortKeys)[number],
    direction: (s.startsWith('-') ? 'desc' : 'asc') as 'asc' | 'desc',
  }));

/** GET /api/v1/spectra */
export const listSpectraQuery = z.object({
  group: slugField.optional(),
  status: csv(spectrumStatuses, 'status'),
  verdict: csv([...verdicts, 'none'] as const, 'verdict'),
  /** The current revision's screening status, e.g. `error`: its file did not parse. */
  screening: csv(screeningStatuses, 'screening status'),
  q: z.string().trim().max(200, 'At most 200 characters.').optional(),
  /** `me`: spectra the caller is assigned to review. */
  assigned: z.enum(['me'], { error: 'assigned takes only "me".' }).optional(),
  /** `me`: spectra in review the caller may decide on and has not approved yet (not their own). */
  waiting: z.enum(['me'], { error: 'waiting takes only "me".' }).optional(),
  sort: sortField,
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type ListSpectraQuery = z.output<typeof listSpectraQuery>;
