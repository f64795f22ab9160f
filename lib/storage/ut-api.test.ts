import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fetchForUploads } from './ut-api';

// The transport of the upload SDK: its file PUT (multipart) is sent once and never redirected;
// every other request is plain fetch.

let server: http.Server;
let base = '';
const received: { method: string; url: string; bytes: number }[] = [];

beforeAll(async () => {
  server = http.createServer((req, res) => {
    let bytes = 0;
    req.on('data', (c: Buffer) => (bytes += c.length));
    req.on('end', () => {
      received.push({ method: req.method ?? '', url: req.url ?? '', bytes });
      if (req.url?.startsWith('/moved')) return void res.writeHead(307, { location: `${base}/target` }).end();
      res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify({ url: req.url, bytes }));
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

const form = (n: number) => {
  const f = new FormData();
  f.append('file', new Blob([new Uint8Array(n).fill(0x31)]), 'bands.txt');
  return f;
};

describe('fetchForUploads', () => {
  it('sends a multipart PUT once, the whole body', async () => {
    received.length = 0;
    const res = await fetchForUploads(`${base}/key?signature=x`, { method: 'PUT', body: form(2_000_000) });
    expect(res.status).toBe(200);
    const answer = (await res.json()) as { bytes: number };
    expect(answer.bytes).toBeGreaterThan(2_000_000);
    expect(received).toEqual([{ method: 'PUT', url: '/key?signature=x', bytes: answer.bytes }]);
  });

  it('does not follow a redirect of the multipart PUT: the upload fails and nothing is sent elsewhere', async () => {
    received.length = 0;
    await expect(fetchForUploads(`${base}/moved`, { method: 'PUT', body: form(1000) })).rejects.toThrow();
    expect(received.map((r) => r.url)).toEqual(['/moved']);
  });

  it('leaves other requests to fetch as they are (redirects followed)', async () => {
    received.length = 0;
    const res = await fetchForUploads(`${base}/moved`, { method: 'POST', body: JSON.stringify({ fileKeys: ['k'] }), headers: { 'content-type': 'application/json' } });
    expect(res.status).toBe(200);
    expect(received.map((r) => r.url)).toEqual(['/moved', '/target']);
  });
});
