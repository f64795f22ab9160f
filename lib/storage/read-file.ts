import { MAX_BAND_FILE_BYTES } from './limits';

export class StoredFileError extends Error {
  /** false: retrying will not help (the file is gone or too large). */
  readonly retryable: boolean;
  constructor(message: string, retryable: boolean) {
    super(message);
    this.name = 'StoredFileError';
    this.retryable = retryable;
  }
}

/**
 * Reads a stored file back by its `ufsUrl`, refusing more than `maxBytes` without reading it
 * all (the declared length is checked first, the streamed count always).
 */
export async function readStoredFile(ufsUrl: string, maxBytes = MAX_BAND_FILE_BYTES): Promise<Uint8Array> {
  let res: Response;
  try {
    res = await fetch(ufsUrl);
  } catch (e) {
    throw new StoredFileError(`the file store is unreachable (${(e as Error).message})`, true);
  }
  if (res.status === 404 || res.status === 410) throw new StoredFileError('the stored file is gone', false);
  if (!res.ok || !res.body) throw new StoredFileError(`the file store answered ${res.status}`, res.status >= 500);
  const declared = Number(res.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > maxBytes) {
    await res.body.cancel();
    throw new StoredFileError(`the stored file has ${declared} bytes, more than the limit of ${maxBytes}`, false);
  }
  const out = new Uint8Array(Number.isFinite(declared) && declared > 0 ? declared : 1 << 20);
  let buf = out;
  let n = 0;
  const reader = res.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    if (n + value.length > maxBytes) {
      await reader.cancel();
      throw new StoredFileError(`the stored file is larger than the limit of ${maxBytes} bytes`, false);
    }
    if (n + value.length > buf.length) {
      const grown = new Uint8Array(Math.min(maxBytes, Math.max(buf.length * 2, n + value.length)));
      grown.set(buf.subarray(0, n));
      buf = grown;
    }
    buf.set(value, n);
    n += value.length;
  }
  return buf.subarray(0, n);
}
