import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { UTApi, UTFile } from 'uploadthing/server';
import { makeUploadToken } from './config';
import { startUploadFake, type UploadFake } from './fake';
import { API_KEY, APP_ID, textFile } from './testing/fixture';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';

// UTApi against the fake: uploads without a route (no callback) and the /v6 endpoints.

let fake: UploadFake;
let dir: string;
let utapi: UTApi;

beforeEach(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), 'fake-uploads-'));
  fake = await startUploadFake({ port: 0, dir, apiKey: API_KEY, appId: APP_ID });
  utapi = new UTApi({
    token: makeUploadToken(API_KEY, APP_ID),
    apiUrl: fake.url,
    ingestUrl: fake.url,
    ufsHost: `localhost:${fake.port}`,
    ufsAppIdLocation: 'path',
    logLevel: 'Error',
  });
});
afterEach(async () => {
  await fake.close();
  await rm(dir, { recursive: true, force: true });
});

async function upload(name: string, size: number, customId?: string) {
  const file = textFile(name, size);
  const res = await utapi.uploadFiles(new UTFile([await file.arrayBuffer()], name, { type: 'text/plain', customId }));
  if (res.error) throw new Error(res.error.message);
  return { data: res.data, bytes: Buffer.from(await file.arrayBuffer()) };
}

describe('UTApi through the fake', () => {
  it('uploadFiles stores the bytes and serves them back identically at ufsUrl, with no callback', async () => {
    const { data, bytes } = await upload('phonons.txt', 200_000, 'rev-1');
    expect(data).toMatchObject({ name: 'phonons.txt', size: 200_000, type: 'text/plain', customId: 'rev-1' });
    expect((await readFile(path.join(dir, data.key))).equals(bytes)).toBe(true);
    const served = await fetch(data.ufsUrl);
    expect(Buffer.from(await served.arrayBuffer()).equals(bytes)).toBe(true);
    expect(served.headers.get('content-disposition')).toBe("inline; filename*=UTF-8''phonons.txt");
    expect(fake.hooks).toEqual([]);
  });

  it('listFiles lists uploads (with paging), getFileUrls and getUsageInfo describe them', async () => {
    const a = (await upload('a.txt', 10)).data;
    const b = (await upload('b.txt', 20, 'custom-b')).data;
    const all = await utapi.listFiles();
    expect(all.hasMore).toBe(false);
    expect(all.files.map((f) => [f.key, f.name, f.size, f.customId, f.status])).toEqual([
      [a.key, 'a.txt', 10, null, 'Uploaded'],
      [b.key, 'b.txt', 20, 'custom-b', 'Uploaded'],
    ]);
    expect(await utapi.listFiles({ limit: 1 })).toMatchObject({ hasMore: true, files: [{ key: a.key }] });
    expect((await utapi.getFileUrls(b.key)).data).toEqual([{ key: b.key, url: `${fake.url}/f/${b.key}` }]);
    expect(await utapi.getUsageInfo()).toMatchObject({ totalBytes: 30, appTotalBytes: 30, filesUploaded: 2 });
  });

  it('deleteFiles removes files from disk, by key or by customId', async () => {
    const a = (await upload('a.txt', 10)).data;
    const b = (await upload('b.txt', 10, 'custom-b')).data;
    expect(await utapi.deleteFiles(a.key)).toEqual({ success: true, deletedCount: 1 });
    expect(await utapi.deleteFiles('custom-b', { keyType: 'customId' })).toEqual({ success: true, deletedCount: 1 });
    expect(await utapi.deleteFiles('no-such-key')).toEqual({ success: true, deletedCount: 0 });
    expect(await readdir(dir)).toEqual([]);
    expect((await fetch(`${fake.url}/f/${b.key}`)).status).toBe(404);
    expect((await utapi.listFiles()).files).toEqual([]);
  });

  it('renameFiles changes the listed name; updateACL makes a file private and signed URLs open it', async () => {
    const { data, bytes } = await upload('a.txt', 100);
    expect(await utapi.renameFiles({ fileKey: data.key, newName: 'renamed.txt' })).toEqual({ success: true });
    expect((await utapi.listFiles()).files[0].name).toBe('renamed.txt');

    expect(await utapi.updateACL(data.key, 'private')).toEqual({ success: true });
    expect((await fetch(data.ufsUrl)).status).toBe(403);

    const { ufsUrl } = await utapi.generateSignedURL(data.key, { expiresIn: 60 });
    expect(ufsUrl.startsWith(`http://localhost:${fake.port}/a/${APP_ID}/${data.key}?expires=`)).toBe(true);
    expect(Buffer.from(await (await fetch(ufsUrl)).arrayBuffer()).equals(bytes)).toBe(true);

    const access = await utapi.getSignedURL(data.key, { expiresIn: 60 });
    expect((await fetch(access.ufsUrl)).status).toBe(200);
    const tampered = access.ufsUrl.replace(/expires=\d+/, (m) => `${m}1`);
    expect((await fetch(tampered)).status).toBe(403);
  });

  it('refuses a wrong API key with 401', async () => {
    const res = await fetch(`${fake.url}/v6/listFiles`, { method: 'POST', headers: { 'x-uploadthing-api-key': 'sk_wrong' }, body: '{}' });
    expect(res.status).toBe(401);
    const wrong = new UTApi({ token: makeUploadToken('sk_wrong', APP_ID), apiUrl: fake.url, logLevel: 'Error' });
    await expect(wrong.listFiles()).rejects.toThrow();
  });
});
