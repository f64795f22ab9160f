import { UTApi, UTFile } from 'uploadthing/server';
import { AppError } from '@/lib/errors';
import { rememberStored } from './handoff';

/**
 * The one UTApi of the process. The SDK reads UPLOADTHING_TOKEN, UPLOADTHING_API_URL and
 * UPLOADTHING_INGEST_URL from the environment (scripts/env.sh), so the same code talks to the
 * hosted service or to the local fake.
 */
const holder = globalThis as typeof globalThis & { __branchwiseUtApi?: UTApi };

/**
 * The SDK's fetch, except for its file PUT (the one request with a multipart body). fetch keeps
 * a second copy of a streamed body for following a redirect (it tees the stream, copying every
 * chunk: the whole file once more, tens of megabytes for a large band file, measured in
 * bench:upload). The upload service answers the presigned PUT itself, so a redirect there is
 * refused instead (the upload fails as the service being unreachable does: 503, nothing kept),
 * and the body is sent once.
 */
export const fetchForUploads: typeof fetch = (input, init) =>
  init?.body instanceof FormData ? fetch(input, { ...init, redirect: 'error', window: null }) : fetch(input, init);

export function utApi(): UTApi {
  holder.__branchwiseUtApi ??= new UTApi({ logLevel: 'Error', fetch: fetchForUploads });
  return holder.__branchwiseUtApi;
}

export interface StoredFile {
  key: string;
  ufsUrl: string;
  name: string;
  size: number;
}

/** Stores a file received by our own API (multipart) with the upload service. */
export async function storeFile(bytes: Uint8Array, name: string, type = 'text/plain'): Promise<StoredFile> {
  const upload = new UTFile([bytes as Uint8Array<ArrayBuffer>], name, { type: type || 'text/plain' });
  const result = await utApi().uploadFiles(upload);
  if (result.error || !result.data) {
    console.error('[branchwise] upload service refused a file:', result.error);
    throw new AppError('unavailable', 'The file store did not accept the file; try again shortly.');
  }
  rememberStored(result.data.key, bytes);
  return { key: result.data.key, ufsUrl: result.data.ufsUrl, name: result.data.name, size: result.data.size };
}

/** Best effort: a file whose database rows were not written is removed again. */
export async function deleteStoredFiles(keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  try {
    await utApi().deleteFiles(keys);
  } catch (e) {
    console.error('[branchwise] could not delete stored files', keys, e);
  }
}
