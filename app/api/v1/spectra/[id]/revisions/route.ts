import { json, route } from '@/lib/http/route';
import { invalidInput } from '@/lib/http/to-app-error';
import { addRevisionWithFile, assertCanAddRevision } from '@/lib/services/revisions';
import type { RevisionDto } from '@/lib/services/spectra';
import { readBandFileForm } from '@/lib/storage/multipart';
import { deleteStoredFiles, storeFile } from '@/lib/storage/ut-api';
import { timed } from '@/lib/timing';
import { newRevisionFields, revisionsParams } from './schema';

export const dynamic = 'force-dynamic';
export const maxDuration = 300;

export type NewRevisionResponse = RevisionDto;

/** A new revision of the caller's own spectrum (in review or returned), queued for screening. */
export const POST = route({ params: revisionsParams }, async ({ em, caller, params, req }) => {
  // Looked up while the file arrives; awaited after the form, so a malformed form is still a 400 first.
  const allowed = timed('upload.authorize', () => assertCanAddRevision(em, caller, params.id));
  allowed.catch(() => {}); // awaited below; until then a refusal is not unhandled
  const form = await timed('upload.multipart', () => readBandFileForm(req));
  const parsed = newRevisionFields.safeParse(form.fields);
  if (!parsed.success) throw invalidInput(parsed.error, 'form');
  // Refuse before storing anything.
  await allowed;
  const stored = await timed('upload.store', () => storeFile(form.file.bytes, form.file.name, form.file.type));
  try {
    const revision = await timed('upload.rows', () => addRevisionWithFile(em, caller, { spectrumId: params.id, note: parsed.data.note, file: stored }));
    return json(revision satisfies NewRevisionResponse, 201);
  } catch (e) {
    await deleteStoredFiles([stored.key]);
    throw e;
  }
});
