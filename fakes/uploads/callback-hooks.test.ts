import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { startFixture, textFile, type Fixture } from './testing/fixture';
import { installXhrShim } from './testing/xhr-shim';

// The test hooks issue 4 builds on: replay a callback (the app must be idempotent) and send a
// forged one (the real SDK handler must refuse it).

let uninstall: () => void;
beforeAll(() => {
  uninstall = installXhrShim();
});
afterAll(() => uninstall());

let fx: Fixture;
afterEach(async () => fx?.close());

describe.each([{ isDev: false }, { isDev: true }])('callback hooks (isDev: $isDev)', ({ isDev }) => {
  it('sends the callback signed, with the fields the SDK expects', async () => {
    fx = await startFixture({ isDev });
    const [result] = await fx.uploader.uploadFiles('bandFile', { files: [textFile('a.txt', 64)], headers: { 'x-test-submitter': 'ben' } });
    const last = fx.fake.lastCallback()!;
    expect(last.url).toBe(`${fx.app.endpoint}?slug=bandFile`);
    expect(last.signature).toMatch(/^hmac-sha256=[0-9a-f]{64}$/);
    expect(JSON.parse(last.body)).toEqual({
      status: 'uploaded',
      file: { name: 'a.txt', size: 64, type: 'text/plain', customId: null, key: result.key, url: result.ufsUrl, appUrl: expect.stringContaining(`/a/`), ufsUrl: result.ufsUrl, fileHash: result.fileHash },
      origin: fx.fake.url,
      metadata: { submitter: 'ben' },
    });
  });

  it('replays the last callback: the app receives it again (idempotency is the app\'s job)', async () => {
    fx = await startFixture({ isDev });
    await fx.uploader.uploadFiles('bandFile', { files: [textFile('a.txt', 64)] });
    expect(fx.app.completed).toHaveLength(1);
    const answer = await fx.fake.replayLastCallback();
    expect(answer.status).toBe(200);
    await expect.poll(() => fx.app.completed.length).toBe(2);
    const key = fx.app.completed[0].file.key;
    expect(fx.app.completed[1].file.key).toBe(key);
    // The app answers the replay with a second /callback-result; no upload waits for it any more.
    await expect.poll(() => fx.logs).toContain(`callback-result for ${key}: no upload waiting`);
  });

  it('a forged callback is refused by the real SDK handler and never reaches onUploadComplete', async () => {
    fx = await startFixture({ isDev });
    await fx.uploader.uploadFiles('bandFile', { files: [textFile('a.txt', 64)] });
    const answer = await fx.fake.sendForgedCallback();
    expect(answer.status).toBe(400);
    expect(JSON.parse(answer.body)).toEqual({ message: 'Invalid signature' });
    await new Promise((r) => setTimeout(r, 100));
    expect(fx.app.completed).toHaveLength(1);
  });
});
