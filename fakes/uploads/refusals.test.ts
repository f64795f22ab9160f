import http from 'node:http';
import { afterEach, describe, expect, it } from 'vitest';
import { signUrl } from './presigned';
import { API_KEY, APP_ID, presign, putFile, startFixture, textFile, type Fixture } from './testing/fixture';

// Refused uploads: nothing stays on disk, the client gets a clear status and message.

let fx: Fixture;
afterEach(async () => fx?.close());

describe('presigned PUT refusals', () => {
  it('refuses a tampered signature with 403 and stores nothing', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 500);
    const [p] = await presign(fx.app, [file]);
    const tampered = p.url.replace(/signature=hmac-sha256%3D(.)/, (_m, c: string) => `signature=hmac-sha256%3D${c === '0' ? '1' : '0'}`);
    expect(tampered).not.toBe(p.url);
    const res = await putFile(tampered, file);
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: 'invalid signature' });
    expect(await fx.filesOnDisk()).toEqual([]);
    expect(fx.app.completed).toEqual([]);
  });

  it('refuses a URL whose signed size was changed (the signature covers every parameter)', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 500);
    const [p] = await presign(fx.app, [file]);
    const res = await putFile(p.url.replace('x-ut-file-size=500', 'x-ut-file-size=5000'), file);
    expect(res.status).toBe(403);
    expect(await fx.filesOnDisk()).toEqual([]);
  });

  it('refuses an expired URL with 403 and stores nothing', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 500);
    const url = signUrl(`${fx.fake.url}/XkBYG4F9KMzcexpired0000000000000000000000000000`, API_KEY, 60, {
      'x-ut-identifier': APP_ID,
      'x-ut-file-name': 'a.txt',
      'x-ut-file-size': 500,
      'x-ut-file-type': 'text/plain',
    }, Date.now() - 120_000);
    const res = await putFile(url, file);
    expect(res.status).toBe(403);
    expect((await res.json()).error).toMatch(/^URL expired at /);
    expect(await fx.filesOnDisk()).toEqual([]);
  });

  it('refuses a URL signed with another key or for another app', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 10);
    const data = { 'x-ut-identifier': APP_ID, 'x-ut-file-name': 'a.txt', 'x-ut-file-size': 10, 'x-ut-file-type': 'text/plain' };
    const otherKey = signUrl(`${fx.fake.url}/k1`, 'sk_someone_else', 60, data);
    expect((await putFile(otherKey, file)).status).toBe(403);
    const otherApp = signUrl(`${fx.fake.url}/k2`, API_KEY, 60, { ...data, 'x-ut-identifier': 'another-app' });
    const res = await putFile(otherApp, file);
    expect(res.status).toBe(403);
    expect((await res.json()).error).toMatch(/x-ut-identifier/);
    expect(await fx.filesOnDisk()).toEqual([]);
  });

  it('refuses a file larger than the presigned size (413), leaves no part file, tells the app through the error hook', async () => {
    fx = await startFixture({ isDev: false });
    const announced = textFile('small.txt', 1000);
    const [p] = await presign(fx.app, [announced]);
    const res = await putFile(p.url, textFile('small.txt', 1_500_000));
    expect(res.status).toBe(413);
    expect((await res.json()).error).toBe('file is larger than the presigned size 1000 bytes');
    expect(await fx.filesOnDisk()).toEqual([]);
    expect(fx.app.completed).toEqual([]);
    await expect.poll(() => fx.app.errors).toEqual([{ fileKey: p.key, message: expect.stringContaining('larger than the presigned size') }]);
  });

  it('refuses a file smaller than announced, and a body without the field "file"', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 1000);
    const [p1, p2] = await presign(fx.app, [file, textFile('b.txt', 1000)]);
    const short = await putFile(p1.url, textFile('a.txt', 999));
    expect(short.status).toBe(413);
    expect((await short.json()).error).toBe('file has 999 bytes, presigned size is 1000');
    const form = new FormData();
    form.append('other', file);
    const noField = await fetch(p2.url, { method: 'PUT', body: form });
    expect(noField.status).toBe(400);
    expect((await noField.json()).error).toBe('multipart body has no field "file"');
    expect(await fx.filesOnDisk()).toEqual([]);
  });

  it('leaves nothing when the client goes away mid-file, and tells the app through the error hook', async () => {
    fx = await startFixture({ isDev: false });
    const [p] = await presign(fx.app, [textFile('big.txt', 2_000_000)]);
    const boundary = 'cut-short-boundary';
    const req = http.request(p.url, { method: 'PUT', headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': 2_000_200 } });
    req.on('error', () => {});
    req.write(`--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="big.txt"\r\ncontent-type: text/plain\r\n\r\n`);
    req.write(Buffer.alloc(500_000, 'a'));
    await expect.poll(() => fx.filesOnDisk()).toEqual([`${p.key}.part`]);
    req.destroy();
    await expect.poll(() => fx.filesOnDisk()).toEqual([]);
    await expect.poll(() => fx.app.errors.map((e) => e.message)).toEqual([expect.stringContaining('client closed the connection')]);
  });

  it('refuses a second PUT of the same presigned URL (409) and keeps the first file', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 100);
    const [p] = await presign(fx.app, [file]);
    expect((await putFile(p.url, file)).status).toBe(200);
    const again = await putFile(p.url, textFile('a.txt', 5));
    expect(again.status).toBe(409);
    expect((await fetch(`${fx.fake.url}/f/${p.key}`).then((r) => r.arrayBuffer())).byteLength).toBe(100);
    expect(fx.app.completed).toHaveLength(1);
  });

  it('refuses a resume offset it never offered (416)', async () => {
    fx = await startFixture({ isDev: false });
    const file = textFile('a.txt', 100);
    const [p] = await presign(fx.app, [file]);
    const res = await putFile(p.url, file, { range: 'bytes=50-' });
    expect(res.status).toBe(416);
  });

  it('answers 409 when no /route-metadata registration arrives for a route upload', async () => {
    fx = await startFixture({ isDev: false }, { registrationTimeoutMs: 200 });
    const url = signUrl(`${fx.fake.url}/unregisteredkey`, API_KEY, 60, {
      'x-ut-identifier': APP_ID, 'x-ut-file-name': 'a.txt', 'x-ut-file-size': 10, 'x-ut-file-type': 'text/plain', 'x-ut-slug': 'bandFile',
    });
    const res = await putFile(url, textFile('a.txt', 10));
    expect(res.status).toBe(409);
    expect(await fx.filesOnDisk()).toEqual([]);
  });
});

describe('when the app does not complete the callback', () => {
  it('fails the held PUT after the callback timeout, removes the file and sends the error hook', async () => {
    fx = await startFixture(
      { isDev: false, onComplete: async () => { throw new Error('database down'); } },
      { callbackTimeoutMs: 1500 },
    );
    const file = textFile('a.txt', 2000);
    const [p] = await presign(fx.app, [file]);
    const res = await putFile(p.url, file);
    expect(res.status).toBe(504);
    expect((await res.json()).error).toMatch(/no \/callback-result from the app within 1500 ms/);
    expect(await fx.filesOnDisk()).toEqual([]);
    await expect.poll(() => fx.app.errors.map((e) => e.fileKey)).toEqual([p.key]);
  });

  it('the real client reports the failure instead of hanging', async () => {
    const { installXhrShim } = await import('./testing/xhr-shim');
    const uninstall = installXhrShim();
    try {
      fx = await startFixture({ isDev: true, onComplete: async () => { throw new Error('boom'); } }, { callbackTimeoutMs: 1500 });
      await expect(fx.uploader.uploadFiles('bandFile', { files: [textFile('a.txt', 10)] })).rejects.toThrow(/XHR failed 504/);
      expect(await fx.filesOnDisk()).toEqual([]);
    } finally {
      uninstall();
    }
  });
});
