import { describe, expect, it } from 'vitest';
import * as Micro from 'effect/Micro';
import * as Redacted from 'effect/Redacted';
import { generateSignedURL, signPayload, verifySignature as sdkVerify } from '@uploadthing/shared';
import { parsePresignedUpload, signUrl, UrlRefused, verifySignedUrl } from './presigned';
import { sign, verifySignature } from './signing';
import { makeUploadToken, parseUploadToken } from './config';

// Compatibility with the SDK's own signing code (@uploadthing/shared, the version installed).
const KEY = 'sk_presigned_test';
const sdkSignedUrl = (data: Record<string, string | number>, ttl = 60) =>
  Micro.runPromise(generateSignedURL('http://127.0.0.1:4000/Abc123key', Redacted.make(KEY), { ttlInSeconds: ttl, data }));

describe('signing', () => {
  it('matches the SDK both ways', async () => {
    const body = '{"status":"uploaded","file":{"name":"ä b.txt"}}';
    expect(sign(body, KEY)).toBe(await Micro.runPromise(signPayload(body, Redacted.make(KEY))));
    expect(await Micro.runPromise(sdkVerify(body, sign(body, KEY), Redacted.make(KEY)))).toBe(true);
    expect(verifySignature(body, sign(body, KEY), KEY)).toBe(true);
    expect(verifySignature(body, sign(body, 'sk_other'), KEY)).toBe(false);
    expect(verifySignature(body + ' ', sign(body, KEY), KEY)).toBe(false);
    expect(verifySignature(body, null, KEY)).toBe(false);
  });
});

describe('presigned URLs', () => {
  it('reads an SDK-made URL, decoding the doubly encoded values', async () => {
    const url = await sdkSignedUrl({
      'x-ut-identifier': 'app-1',
      'x-ut-file-name': 'Si phonons & more (v2).txt',
      'x-ut-file-size': 1234,
      'x-ut-file-type': 'text/plain',
      'x-ut-slug': 'bandFile',
      'x-ut-content-disposition': 'inline',
    });
    expect(parsePresignedUpload(url, KEY, 'app-1')).toMatchObject({
      key: 'Abc123key',
      fileName: 'Si phonons & more (v2).txt',
      fileSize: 1234,
      fileType: 'text/plain',
      slug: 'bandFile',
      customId: null,
      acl: 'public-read',
    });
  });

  it('has no slug for UTApi-style URLs', async () => {
    const url = await sdkSignedUrl({ 'x-ut-identifier': 'app-1', 'x-ut-file-name': 'a', 'x-ut-file-size': 1, 'x-ut-file-type': 'text/plain' });
    expect(parsePresignedUpload(url, KEY, 'app-1').slug).toBeNull();
  });

  it('refuses expired, unsigned, tampered and foreign URLs with a reason', async () => {
    const data = { 'x-ut-identifier': 'app-1', 'x-ut-file-name': 'a', 'x-ut-file-size': 1, 'x-ut-file-type': 'text/plain' };
    const url = await sdkSignedUrl(data);
    const refusal = (u: string, now?: number) => {
      try {
        parsePresignedUpload(u, KEY, 'app-1', now);
      } catch (err) {
        return err instanceof UrlRefused ? `${err.status} ${err.message}` : String(err);
      }
      return 'accepted';
    };
    expect(refusal(url, Date.now() + 61_000)).toMatch(/^403 URL expired at /);
    expect(refusal(url.slice(0, url.indexOf('&signature=')))).toBe('403 missing signature');
    expect(refusal(url.replace('x-ut-file-size=1', 'x-ut-file-size=2'))).toBe('403 invalid signature');
    expect(refusal(url.replace('127.0.0.1:4000', 'localhost:4000'))).toBe('403 invalid signature');
    expect(refusal(signUrl('http://127.0.0.1:4000/k', KEY, 60, { ...data, 'x-ut-identifier': 'app-2' }))).toMatch(/^403 x-ut-identifier/);
    expect(refusal(signUrl('http://127.0.0.1:4000/..%2Fetc', KEY, 60, data))).toMatch(/^400 invalid file key/);
  });

  it('verifies file links made by UTApi.generateSignedURL-style signing', () => {
    const link = signUrl('http://localhost:4000/a/app-1/k', KEY, 60);
    expect(verifySignedUrl(link, KEY).pathname).toBe('/a/app-1/k');
  });
});

describe('token', () => {
  it('round-trips and explains what is wrong', () => {
    expect(parseUploadToken(makeUploadToken('sk_a', 'app'))).toEqual({ apiKey: 'sk_a', appId: 'app', regions: ['local'] });
    expect(() => parseUploadToken(makeUploadToken('pk_a', 'app'))).toThrow('apiKey must be a string starting with "sk_"');
    expect(() => parseUploadToken('%%%')).toThrow(/UPLOADTHING_TOKEN/);
  });
});
