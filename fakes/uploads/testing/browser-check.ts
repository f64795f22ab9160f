// Manual check in a real browser (Debian chromium): a static page on loopback uploads with the
// real `genUploader` (real XMLHttpRequest, real CORS) to the fake through the test app, in
// production and dev mode. Run: `npx tsx fakes/uploads/testing/browser-check.ts`.
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { build } from 'esbuild';
import { chromium } from 'playwright';
import { startUploadFake } from '../fake';
import { startTestApp } from './app-server';

const API_KEY = 'sk_browser_check';
const APP_ID = 'browser-check-app';

const clientSource = `
import { genUploader } from 'uploadthing/client';
const { uploadFiles } = genUploader({ url: '/api/uploadthing', package: 'browser-check' });
window.runUpload = async (size) => {
  const bytes = new Uint8Array(size).map((_, i) => 32 + ((i * 7919) % 95));
  const file = new File([bytes], 'browser-bands.txt', { type: 'text/plain' });
  const steps = [];
  try {
    const [r] = await uploadFiles('bandFile', { files: [file], uploadProgressGranularity: 'fine', onUploadProgress: (p) => steps.push(p.progress) });
    const back = new Uint8Array(await (await fetch(r.ufsUrl)).arrayBuffer());
    return { ok: true, key: r.key, serverData: r.serverData, identical: back.length === size && back.every((b, i) => b === bytes[i]), steps: steps.length };
  } catch (e) {
    return { ok: false, error: String(e && e.message), data: JSON.stringify(e && e.data) };
  }
};
`;

async function main() {
  const bundle = await build({
    stdin: { contents: clientSource, resolveDir: process.cwd(), loader: 'js' },
    bundle: true, format: 'esm', platform: 'browser', write: false, define: { 'process.env.NODE_ENV': '"production"' },
  });
  const script = bundle.outputFiles[0].text;
  const page = '<!doctype html><meta charset="utf-8"><title>upload check</title><script type="module" src="/client.js"></script>';
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium' });
  let failed = false;
  for (const isDev of [false, true]) {
    const dir = await mkdtemp(path.join(os.tmpdir(), 'fake-uploads-browser-'));
    const fake = await startUploadFake({ port: 0, dir, apiKey: API_KEY, appId: APP_ID });
    const app = await startTestApp({
      fakeUrl: fake.url, apiKey: API_KEY, appId: APP_ID, isDev,
      extraRoutes: { '/': { type: 'text/html', body: page }, '/client.js': { type: 'text/javascript', body: script }, '/favicon.ico': { type: 'image/x-icon', body: '' } },
    });
    const tab = await browser.newPage();
    const consoleErrors: string[] = [];
    tab.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    await tab.goto(app.url + '/');
    await tab.waitForFunction(() => 'runUpload' in window);
    const result = await tab.evaluate((size) => (window as unknown as { runUpload(n: number): Promise<unknown> }).runUpload(size), 3_500_001);
    const res = result as { ok: boolean; key?: string; identical?: boolean };
    const onDisk = res.key ? (await readFile(path.join(dir, res.key))).length : 0;
    console.log(isDev ? 'dev' : 'production', JSON.stringify(result), `onDisk=${onDisk}`, `completed=${app.completed.length}`, consoleErrors.length ? `console errors: ${consoleErrors.join(' | ')}` : '');
    if (!res.ok || !res.identical || app.completed.length !== 1) failed = true;
    await tab.close();
    await app.close();
    await fake.close();
    await rm(dir, { recursive: true, force: true });
  }
  await browser.close();
  process.exit(failed ? 1 : 0);
}

await main();
