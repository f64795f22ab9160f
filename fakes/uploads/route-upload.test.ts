import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { signUrl } from './presigned';
import { API_KEY, APP_ID, putFile, startFixture, textFile, type Fixture } from './testing/fixture';
import { installXhrShim } from './testing/xhr-shim';

// The full route flow through the real SDK: genUploader (browser client, XHR over fetch) →
// app's createRouteHandler → fake's /route-metadata, HEAD, PUT → signed callback →
// onUploadComplete → /callback-result → PUT answer with serverData.

let uninstall: () => void;
beforeAll(() => {
  uninstall = installXhrShim();
});
afterAll(() => uninstall());

describe.each([
  { mode: 'production', isDev: false },
  { mode: 'dev (JSON-lines stream)', isDev: true },
])('route upload, $mode', ({ isDev }) => {
  let fx: Fixture;
  afterEach(async () => fx?.close());

  it('stores the file, runs onUploadComplete once with the metadata, answers serverData, serves the bytes back', async () => {
    fx = await startFixture({ isDev });
    const file = textFile('silicon-bands.txt', 300_000);
    const [result] = await fx.uploader.uploadFiles('bandFile', { files: [file], headers: { 'x-test-submitter': 'ada' } });

    expect(result.serverData).toEqual({ storedAs: result.key, submitter: 'ada' });
    expect(fx.app.completed).toHaveLength(1);
    expect(fx.app.completed[0].metadata).toEqual({ submitter: 'ada' });
    expect(fx.app.completed[0].file).toMatchObject({ key: result.key, name: 'silicon-bands.txt', size: 300_000, type: 'text/plain' });

    const original = Buffer.from(await file.arrayBuffer());
    const md5 = createHash('md5').update(original).digest('hex');
    expect(result.fileHash).toBe(md5);
    expect(fx.app.completed[0].file.fileHash).toBe(md5);
    expect((await readFile(path.join(fx.dir, result.key))).equals(original)).toBe(true);
    expect(await fx.filesOnDisk()).toEqual([result.key, `${result.key}.json`].sort());

    const served = await fetch(result.ufsUrl);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('text/plain');
    expect(Buffer.from(await served.arrayBuffer()).equals(original)).toBe(true);
    // Dev mode: the JSON-lines answer to /route-metadata ends once its file is done.
    if (isDev) expect(fx.logs).toContain(`dev stream closed: ${result.key}`);
  });

  it('uploads two files in one request concurrently, each with its own callback', async () => {
    fx = await startFixture({ isDev });
    const files = [textFile('a.txt', 1000), textFile('b.txt', 2000)];
    const results = await fx.uploader.uploadFiles('bandFile', { files });
    expect(results.map((r) => r.serverData?.storedAs)).toEqual(results.map((r) => r.key));
    expect(fx.app.completed.map((c) => c.file.name).sort()).toEqual(['a.txt', 'b.txt']);
  });
});

describe('ordering', () => {
  let fx: Fixture;
  afterEach(async () => fx?.close());

  it('holds a PUT that arrives before its /route-metadata registration, then completes it', async () => {
    fx = await startFixture({ isDev: false });
    const key = 'earlyPutKey0000000000000000000000000000000000000';
    const url = signUrl(`${fx.fake.url}/${key}`, API_KEY, 60, {
      'x-ut-identifier': APP_ID, 'x-ut-file-name': 'early.txt', 'x-ut-file-size': 50, 'x-ut-file-type': 'text/plain', 'x-ut-slug': 'bandFile',
    });
    const put = putFile(url, textFile('early.txt', 50));
    await new Promise((r) => setTimeout(r, 300));
    expect(fx.app.completed).toEqual([]);
    const registered = await fetch(`${fx.fake.url}/route-metadata`, {
      method: 'POST',
      headers: { 'x-uploadthing-api-key': API_KEY, 'content-type': 'application/json' },
      body: JSON.stringify({ fileKeys: [key], metadata: { submitter: 'late' }, isDev: false, callbackUrl: fx.app.endpoint, callbackSlug: 'bandFile', awaitServerData: true }),
    });
    expect(await registered.json()).toEqual({ ok: true });
    const res = await put;
    expect(res.status).toBe(200);
    expect((await res.json()).serverData).toEqual({ storedAs: key, submitter: 'late' });
    expect(fx.app.completed.map((c) => c.metadata)).toEqual([{ submitter: 'late' }]);
  });
});
