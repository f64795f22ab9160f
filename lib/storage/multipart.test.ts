import { describe, expect, it } from 'vitest';
import { readBandFileForm } from './multipart';

// The multipart reader on its own: the file's bytes exactly as sent, however the body arrives.

const BOUNDARY = 'test-boundary-4f1c';

function body(fields: [string, string][], file: { name: string; bytes: Uint8Array } | null, fieldsAfter: [string, string][] = []): Uint8Array {
  const parts: Uint8Array[] = [];
  const text = (s: string) => parts.push(new TextEncoder().encode(s));
  const field = ([name, value]: [string, string]) => text(`--${BOUNDARY}\r\ncontent-disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`);
  fields.forEach(field);
  if (file) {
    text(`--${BOUNDARY}\r\ncontent-disposition: form-data; name="file"; filename="${file.name}"\r\ncontent-type: text/plain\r\n\r\n`);
    parts.push(file.bytes);
    text('\r\n');
  }
  fieldsAfter.forEach(field);
  text(`--${BOUNDARY}--\r\n`);
  return Buffer.concat(parts);
}

/** A request whose body arrives in chunks of `chunk` bytes, with or without a declared length. */
function request(bytes: Uint8Array, options: { chunk: number; declareLength: boolean }): Request {
  let at = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(c) {
      if (at >= bytes.length) return c.close();
      c.enqueue(bytes.slice(at, at + options.chunk));
      at += options.chunk;
    },
  });
  const headers: Record<string, string> = { 'content-type': `multipart/form-data; boundary=${BOUNDARY}` };
  if (options.declareLength) headers['content-length'] = String(bytes.length);
  return new Request('http://127.0.0.1/api/v1/spectra', { method: 'POST', headers, body: stream, duplex: 'half' } as RequestInit);
}

/** Bytes that are not all alike, so a misplaced chunk would show. */
function fileBytes(n: number): Uint8Array {
  const b = new Uint8Array(n);
  for (let i = 0; i < n; i++) b[i] = 32 + ((i * 7919) % 95);
  return b;
}

describe('readBandFileForm', () => {
  it('returns the file byte for byte when the body declares its length', async () => {
    const bytes = fileBytes(300_000);
    const form = await readBandFileForm(request(body([['group', 'lab']], { name: 'bands.txt', bytes }), { chunk: 65_536, declareLength: true }));
    expect(form.file).toMatchObject({ name: 'bands.txt', type: 'text/plain', size: bytes.length });
    expect(Buffer.compare(Buffer.from(form.file.bytes), Buffer.from(bytes))).toBe(0);
    expect(form.fields).toEqual({ group: 'lab' });
  });

  it('returns the file byte for byte when the length is not declared (the buffer grows as it arrives)', async () => {
    const bytes = fileBytes(3 * 1024 * 1024 + 17);
    const form = await readBandFileForm(request(body([], { name: 'big.dat', bytes }), { chunk: 40_000, declareLength: false }));
    expect(form.file.size).toBe(bytes.length);
    expect(form.file.bytes.byteLength).toBe(bytes.length);
    expect(Buffer.compare(Buffer.from(form.file.bytes), Buffer.from(bytes))).toBe(0);
  });

  it('tells about each field as it arrives: fields sent before the file, before the file is read', async () => {
    const seen: string[] = [];
    const bytes = fileBytes(200_000);
    let fileReadWhenGroupSeen: boolean | null = null;
    let pulled = 0;
    const full = body([['group', 'lab'], ['title', 'T']], { name: 'a.txt', bytes }, [['notes', 'after']]);
    const stream = new ReadableStream<Uint8Array>({
      pull(c) {
        if (pulled >= full.length) return c.close();
        c.enqueue(full.slice(pulled, pulled + 1024));
        pulled += 1024;
      },
    });
    const req = new Request('http://127.0.0.1/x', {
      method: 'POST',
      headers: { 'content-type': `multipart/form-data; boundary=${BOUNDARY}` },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    const form = await readBandFileForm(req, {
      onField: (name, value) => {
        seen.push(`${name}=${value}`);
        if (name === 'group') fileReadWhenGroupSeen = pulled >= full.length;
      },
    });
    expect(seen).toEqual(['group=lab', 'title=T', 'notes=after']);
    expect(fileReadWhenGroupSeen).toBe(false);
    expect(form.fields).toEqual({ group: 'lab', title: 'T', notes: 'after' });
  });

  it('refuses a body without the file, and an empty file', async () => {
    await expect(readBandFileForm(request(body([['group', 'lab']], null), { chunk: 1000, declareLength: true }))).rejects.toMatchObject({ code: 'invalid_input' });
    await expect(
      readBandFileForm(request(body([], { name: 'empty.txt', bytes: new Uint8Array(0) }), { chunk: 1000, declareLength: true })),
    ).rejects.toMatchObject({ code: 'invalid_input', message: expect.stringMatching(/empty/) });
  });
});
