import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { genUploader } from 'uploadthing/client';
import { startUploadFake, type UploadFake } from '../fake';
import type { UploadFakeOptions } from '../config';
import { startTestApp, type TestApp, type TestAppOptions, type TestRouter } from './app-server';

export const API_KEY = 'sk_fake_uploads_test_key';
export const APP_ID = 'fake-uploads-test-app';

export interface Fixture {
  fake: UploadFake;
  app: TestApp;
  dir: string;
  /** The real browser client, bound to the test app. */
  uploader: ReturnType<typeof genUploader<TestRouter>>;
  /** The fake's log lines, in order. */
  logs: string[];
  /** Names in the storage folder (to prove nothing half-written stays). */
  filesOnDisk(): Promise<string[]>;
  close(): Promise<void>;
}

export async function startFixture(
  app: Omit<TestAppOptions, 'fakeUrl' | 'apiKey' | 'appId'>,
  fake: Partial<UploadFakeOptions> = {},
): Promise<Fixture> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'fake-uploads-'));
  const logs: string[] = [];
  const f = await startUploadFake({ port: 0, dir, apiKey: API_KEY, appId: APP_ID, log: (line) => logs.push(line), ...fake });
  const a = await startTestApp({ ...app, fakeUrl: f.url, apiKey: API_KEY, appId: APP_ID });
  return {
    fake: f,
    app: a,
    dir,
    logs,
    uploader: genUploader<TestRouter>({ url: a.endpoint, package: 'fake-uploads-test', fetch: globalThis.fetch }),
    filesOnDisk: async () => (await readdir(dir)).sort(),
    close: async () => {
      await a.close();
      await f.close();
      await rm(dir, { recursive: true, force: true });
    },
  };
}

/** A text file of `size` bytes with varied content (so byte-identity is a real check). */
export function textFile(name: string, size: number): File {
  const bytes = Buffer.alloc(size);
  for (let i = 0; i < size; i++) bytes[i] = 32 + ((i * 7919) % 95);
  return new File([bytes], name, { type: 'text/plain' });
}

/** Asks the app for presigned URLs exactly as the browser client does. */
export async function presign(app: TestApp, files: File[], headers: Record<string, string> = {}) {
  const res = await fetch(`${app.endpoint}?actionType=upload&slug=bandFile`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...headers },
    body: JSON.stringify({ files: files.map((f) => ({ name: f.name, size: f.size, type: f.type, lastModified: f.lastModified })), input: null }),
  });
  if (!res.ok) throw new Error(`presign failed: ${res.status} ${await res.text()}`);
  return (await res.json()) as { url: string; key: string; name: string; customId: string | null }[];
}

/** A multipart PUT like the browser's. */
export function putFile(url: string, file: Blob, headers: Record<string, string> = {}): Promise<Response> {
  const form = new FormData();
  form.append('file', file);
  return fetch(url, { method: 'PUT', body: form, headers: { range: 'bytes=0-', ...headers } });
}
