/**
 * The upload service's file router: band files go straight from the browser to the upload
 * service; this route decides who may upload (before any bytes move) and, when the service
 * calls back (signature verified by the SDK), records the revision and queues its screening.
 */
import { createUploadthing, type FileRouter } from 'uploadthing/next';
import { UploadThingError } from 'uploadthing/server';
import { User } from '@/entities';
import { callerFromUser, type Caller } from '@/lib/auth/caller';
import { getRequestUser } from '@/lib/auth/session';
import { authenticateApiToken, bearerFrom } from '@/lib/auth/tokens';
import { getEm, type Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { toAppError } from '@/lib/http/to-app-error';
import {
  addRevisionWithFile,
  assertCanAddRevision,
  assertCanCreateSpectrum,
  createSpectrumWithFile,
  type UploadedFileRef,
} from '@/lib/services/revisions';
import type { SpectrumMetaFields } from '../v1/spectra/schema';
import { bandFileProblem, MAX_BAND_FILE_SIZE } from '@/lib/storage/limits';
import { deleteStoredFiles } from '@/lib/storage/ut-api';
import { bandFileInput } from './schema';

const f = createUploadthing();

const utCode = {
  invalid_input: 'BAD_REQUEST',
  unauthenticated: 'FORBIDDEN',
  forbidden: 'FORBIDDEN',
  not_found: 'NOT_FOUND',
  conflict: 'BAD_REQUEST',
  too_large: 'TOO_LARGE',
  unparsable: 'BAD_REQUEST',
  internal: 'INTERNAL_SERVER_ERROR',
  unavailable: 'INTERNAL_SERVER_ERROR',
} as const;

function refuse(e: unknown): UploadThingError {
  const app = toAppError(e, 'upload middleware');
  const message = app.code === 'internal' ? 'Something went wrong on our side.' : app.message;
  return new UploadThingError({ code: utCode[app.code], message });
}

/** The signed-in person (session cookie), or the holder of an API token. */
async function callerOf(em: Em, req: Request): Promise<Caller> {
  const bearer = bearerFrom(req);
  if (bearer) return authenticateApiToken(em, bearer);
  const user = await getRequestUser(em, req);
  if (!user) throw new AppError('unauthenticated', 'Sign in to upload.');
  return callerFromUser(user);
}

/** What travels with the file through the upload service to onUploadComplete. */
type UploadMetadata =
  | { kind: 'spectrum'; userId: string; tokenGroupId: string | null; group: string; meta: SpectrumMetaFields }
  | { kind: 'revision'; userId: string; tokenGroupId: string | null; spectrumId: string; note: string | null };

export type BandFileServerData =
  | { spectrumId: string; revisionId: string; revisionNumber: number }
  | { error: { code: string; message: string } };

async function callerById(em: Em, userId: string, tokenGroupId: string | null): Promise<Caller> {
  const user = await em.findOne(User, { id: userId });
  if (!user) throw new AppError('forbidden', 'The uploading account no longer exists.');
  return { ...callerFromUser({ id: user.id, email: user.email, name: user.name ?? null }), ...(tokenGroupId ? { via: 'token', tokenGroupId } : {}) };
}

export const uploadRouter = {
  bandFile: f({ blob: { maxFileSize: MAX_BAND_FILE_SIZE, maxFileCount: 1, minFileCount: 1 } })
    .input(bandFileInput)
    .middleware(async ({ req, input, files }): Promise<UploadMetadata> => {
      try {
        // Type and size are judged here, before a presigned URL exists (the SDK checks size again).
        for (const file of files) {
          const problem = bandFileProblem(file);
          if (problem) throw new AppError(problem.code === 'too_large' ? 'too_large' : 'invalid_input', problem.message);
        }
        const em = await getEm();
        const caller = await callerOf(em, req);
        const tokenGroupId = caller.tokenGroupId ?? null;
        if ('spectrumId' in input) {
          await assertCanAddRevision(em, caller, input.spectrumId);
          return { kind: 'revision', userId: caller.userId, tokenGroupId, spectrumId: input.spectrumId, note: input.note ?? null };
        }
        const { group, ...meta } = input;
        await assertCanCreateSpectrum(em, caller, { slug: group });
        return { kind: 'spectrum', userId: caller.userId, tokenGroupId, group, meta };
      } catch (e) {
        throw refuse(e);
      }
    })
    .onUploadError(({ error, fileKey }) => {
      console.error(`[branchwise] upload ${fileKey} failed: ${error.message}`);
    })
    .onUploadComplete(async ({ file, metadata: raw }): Promise<BandFileServerData> => {
      // The SDK's type flattens the union; the value is what the middleware returned.
      const metadata = raw as UploadMetadata;
      // Never throw here: the SDK would not answer the upload service and the browser would wait.
      const ref: UploadedFileRef = { key: file.key, ufsUrl: file.ufsUrl, name: file.name, size: file.size };
      try {
        const em = await getEm();
        const caller = await callerById(em, metadata.userId, metadata.tokenGroupId);
        if (metadata.kind === 'revision') {
          const r = await addRevisionWithFile(em, caller, { spectrumId: metadata.spectrumId, note: metadata.note, file: ref });
          return { spectrumId: r.spectrumId, revisionId: r.id, revisionNumber: r.number };
        }
        const s = await createSpectrumWithFile(em, caller, { group: { slug: metadata.group }, meta: metadata.meta, file: ref });
        return { spectrumId: s.id, revisionId: s.revision.id, revisionNumber: s.revision.number };
      } catch (e) {
        const app = toAppError(e, 'upload callback');
        // Rights or state changed while the file was in flight: keep nothing.
        await deleteStoredFiles([file.key]);
        return { error: { code: app.code, message: app.code === 'internal' ? 'Something went wrong on our side.' : app.message } };
      }
    }),
} satisfies FileRouter;

export type UploadRouter = typeof uploadRouter;
