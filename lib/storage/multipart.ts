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

/**
 * Reads a multipart body with one band file in `file` and text fields, streaming: a body that
 * says it is too large is refused before it is read, and one that turns out too large is cut
 * off at the limit (413). Files of other types are refused by name before they are kept.
 */
export async function readBandFileForm(req: Request): Promise<BandFileForm> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data/i.test(type)) {
    throw new AppError('invalid_input', 'Send the file as multipart/form-data with the file in the field "file".');
  }
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > MAX_BAND_FILE_BYTES + FORM_OVERHEAD) throw tooLarge();
  if (!req.body) throw new AppError('invalid_input', 'The request has no body.');

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
      const chunks: Buffer[] = [];
      let size = 0;
      stream.on('data', (c: Buffer) => {
        chunks.push(c);
        size += c.length;
      });
      stream.on('limit', () => fail(tooLarge()));
      stream.on('end', () => {
        if (failed) return;
        file = { name: info.filename ?? '', type: info.mimeType, bytes: Buffer.concat(chunks, size), size };
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
