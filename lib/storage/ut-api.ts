import { UTApi, UTFile } from 'uploadthing/server';
import { AppError } from '@/lib/errors';
import { rememberStored } from './handoff';

/**
 * The one UTApi of the process. The SDK reads UPLOADTHING_TOKEN, UPLOADTHING_API_URL and
 * UPLOADTHING_INGEST_URL from the environment (scripts/env.sh), so the same code talks to the
 * hosted service or to the local fake.
 */
const holder = globalThis as typeof globalThis & { __branchwiseUtApi?: UTApi };

export function utApi(): UTApi {
  holder.__branchwiseUtApi ??= new UTApi({ logLevel: 'Error' });
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
