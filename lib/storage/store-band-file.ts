/**
 * A band file received by our own API: stored with the upload service from a worker thread
 * while this thread parses it, when the screening worker runs in this process and will pick the
 * parse up (lib/storage/handoff). Nothing is kept unless the file was stored: the revision is
 * made after this returns, and screened (`done`) only from a stored file.
 */
import { screeningWorkerHere } from '@/lib/jobs/screening-queue';
import { parseBandFile, ParseError } from '@/lib/parsers';
import { rememberStored, type ParsedAhead } from './handoff';
import { MAX_BAND_FILE_BYTES } from './limits';
import { storeFileOffThread, warmStoreThread } from './store-thread';
import { storeFile, type StoredFile } from './ut-api';

export { warmStoreThread };

export async function storeBandFile(file: { bytes: Uint8Array; name: string; type: string }): Promise<StoredFile> {
  if (!screeningWorkerHere()) return storeFile(file.bytes, file.name, file.type);
  const storing = storeFileOffThread(file.bytes, file.name, file.type);
  let parsed: ParsedAhead | null = null;
  try {
    parsed = { dispersion: parseBandFile(file.bytes, { filename: file.name, maxBytes: MAX_BAND_FILE_BYTES }) };
  } catch (e) {
    // Anything but a parse error is left to the worker, which retries.
    if (e instanceof ParseError) parsed = { error: e };
  }
  const stored = await storing;
  rememberStored(stored.key, file.bytes, parsed);
  return stored;
}
