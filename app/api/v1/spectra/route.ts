import { json, route } from '@/lib/http/route';
import { invalidInput } from '@/lib/http/to-app-error';
import { createSpectrumWithFile, assertCanCreateSpectrum, type CreatedSpectrum } from '@/lib/services/revisions';
import { listSpectra, type SpectrumListItem } from '@/lib/services/spectra';
import { readBandFileForm } from '@/lib/storage/multipart';
import { deleteStoredFiles, storeFile } from '@/lib/storage/ut-api';
import { timed } from '@/lib/timing';
import { createSpectrumFields, listSpectraQuery } from './schema';

export const dynamic = 'force-dynamic';
// Parsing is not done here: the worker screens the stored file (docs/api.md).
export const maxDuration = 300;

export type ListSpectraResponse = { items: SpectrumListItem[]; total: number };
export type CreateSpectrumResponse = CreatedSpectrum;

/** The group's spectra: filtered, searched, sorted and paginated in the database. */
export const GET = route({ query: listSpectraQuery }, async ({ em, caller, query }): Promise<ListSpectraResponse> => {
  const { sort, ...rest } = query;
  return listSpectra(em, caller, { ...rest, sort: sort.sort, direction: sort.direction });
});

/**
 * A new spectrum from a multipart body (`file` + metadata fields), stored through the upload
 * service and queued for screening like a file uploaded in the browser. 201 at once; the
 * revision's screening endpoint says when it is done (or where the file did not parse).
 */
export const POST = route({}, async ({ em, caller, req }) => {
  // The caller's right to the group is looked up while the file is still arriving (fields sent
  // before the file, as curl -F and FormData do in the order given, arrive first); its answer
  // is awaited after the form is read, so a malformed form is still a 400 first.
  const early: { slug?: string; allowed?: Promise<unknown> } = {};
  const form = await timed('upload.multipart', () =>
    readBandFileForm(req, {
      onField: (name, value) => {
        if (name !== 'group' || early.allowed) return;
        const slug = createSpectrumFields.shape.group.safeParse(value);
        if (!slug.success) return;
        early.slug = slug.data;
        early.allowed = timed('upload.authorize', () => assertCanCreateSpectrum(em, caller, { slug: slug.data }));
        early.allowed.catch(() => {}); // awaited below; until then a refusal is not unhandled
      },
    }),
  );
  const parsed = createSpectrumFields.safeParse(form.fields);
  if (!parsed.success) throw invalidInput(parsed.error, 'form');
  const { group, ...meta } = parsed.data;
  // Refuse before storing anything.
  await (early.allowed && early.slug === group ? early.allowed : timed('upload.authorize', () => assertCanCreateSpectrum(em, caller, { slug: group })));
  const stored = await timed('upload.store', () => storeFile(form.file.bytes, form.file.name, form.file.type));
  try {
    const created = await timed('upload.rows', () => createSpectrumWithFile(em, caller, { group: { slug: group }, meta, file: stored }));
    return json(created satisfies CreateSpectrumResponse, 201);
  } catch (e) {
    await deleteStoredFiles([stored.key]);
    throw e;
  }
});
