import { Readable } from 'node:stream';
import busboy from 'busboy';
import { AppError } from '@/lib/errors';
import { bandFileProblem, MAX_BAND_FILE_BYTES } from './limits';

export interface BandFileForm {
  file: { name: string; type: string; bytes: Uint8Array; size: number };
  fields: Record<string, string>;
}

// Room for the text fields and the multipart boundaries around a file at the limit.
const FORM_OVERHEAD = 1024 * 1024;
const tooLarge = () => new AppError('too_large', 'The file is larger than the limit of 64 MiB.');

/** The file's bytes, copied chunk by chunk as they arrive into one buffer grown by doubling. */
class Collector {
  private buf: Buffer;
  size = 0;
  constructor(expected: number) {
    this.buf = Buffer.allocUnsafe(Math.max(1, Math.min(expected, MAX_BAND_FILE_BYTES)));
  }
  add(chunk: Buffer): void {
    if (this.size + chunk.length > this.buf.length) {
      const grown = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.size + chunk.length));
      this.buf.copy(grown, 0, 0, this.size);
      this.buf = grown;
    }
    chunk.copy(this.buf, this.size);
    this.size += chunk.length;
  }
  bytes(): Buffer {
    return this.buf.subarray(0, this.size);
  }
}

export interface ReadFormOptions {
  /** Called for each text field as it arrives (fields sent before the file arrive before it). */
  onField?: (name: string, value: string) => void;
}

/**
 * Reads a multipart body with one band file in `file` and text fields, streaming: a body that
 * says it is too large is refused before it is read, and one that turns out too large is cut
 * off at the limit (413). Files of other types are refused by name before they are kept.
 */
export async function readBandFileForm(req: Request, options: ReadFormOptions = {}): Promise<BandFileForm> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data/i.test(type)) {
    throw new AppError('invalid_input', 'Send the file as multipart/form-data with the file in the field "file".');
  }
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > MAX_BAND_FILE_BYTES + FORM_OVERHEAD) throw tooLarge();
  if (!req.body) throw new AppError('invalid_input', 'The request has no body.');
  // The body is at most the file plus a little: a buffer of its declared length is not grown.
  const expected = Number.isFinite(declared) && declared > 0 ? declared : 1024 * 1024;

  return new Promise<BandFileForm>((resolve, reject) => {
    let bb: busboy.Busboy;
    try {
      bb = busboy({
        headers: { 'content-type': type },
        limits: { files: 1, fileSize: MAX_BAND_FILE_BYTES, fields: 50, fieldSize: 64 * 1024 },
      });
    } catch {
      reject(new AppError('invalid_input', 'The multipart body is malformed (no boundary).'));
      return;
    }
    const fields: Record<string, string> = {};
    let file: BandFileForm['file'] | null = null;
    let failed: AppError | null = null;
    const source = Readable.fromWeb(req.body as import('node:stream/web').ReadableStream);
    const fail = (e: AppError) => {
      if (failed) return;
      failed = e;
      source.unpipe(bb);
      source.destroy();
      reject(e);
    };
    bb.on('field', (name, value) => {
      fields[name] = value;
      options.onField?.(name, value);
    });
    bb.on('file', (name, stream, info) => {
      if (name !== 'file') {
        stream.resume();
        return;
      }
      const problem = bandFileProblem({ name: info.filename ?? '', size: 1 });
      if (problem) {
        stream.resume();
        fail(new AppError('invalid_input', problem.message));
        return;
      }
      // Copied as the chunks arrive, while the rest is still on its way, rather than all at
      // once at the end (for a file of tens of megabytes that copy was a visible pause).
      const bytes = new Collector(expected);
      stream.on('data', (c: Buffer) => bytes.add(c));
      stream.on('limit', () => fail(tooLarge()));
      stream.on('end', () => {
        if (failed) return;
        file = { name: info.filename ?? '', type: info.mimeType, bytes: bytes.bytes(), size: bytes.size };
      });
    });
    bb.on('error', () => fail(new AppError('invalid_input', 'The multipart body is malformed.')));
    bb.on('close', () => {
      if (failed) return;
      if (!file) return reject(new AppError('invalid_input', 'Attach the band file in the multipart field "file".', { fieldErrors: { file: ['A file is required.'] } }));
      if (file.size === 0) return reject(new AppError('invalid_input', `"${file.name}" is empty.`, { fieldErrors: { file: ['The file is empty.'] } }));
      resolve({ file, fields });
    });
    source.on('error', () => fail(new AppError('invalid_input', 'The request body ended early.')));
    source.pipe(bb);
  });
}
