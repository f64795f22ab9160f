/**
 * Stores a file with the upload service from a worker thread, so that the main thread can parse
 * the same bytes meanwhile (the upload is mostly waiting on the network; parsing is CPU). The
 * thread runs the same SDK call as `storeFile` (UTApi.uploadFiles) with the process's live
 * environment. If the thread cannot start or dies, the upload runs on the main thread instead.
 */
import { SHARE_ENV, Worker } from 'node:worker_threads';
import { AppError } from '@/lib/errors';
import { rememberStored } from './handoff';
import { storeFile, type StoredFile } from './ut-api';

// Plain CommonJS so that no bundler or TypeScript loader has to know about it.
const THREAD_SOURCE = `
const { parentPort } = require('node:worker_threads');
const { createRequire } = require('node:module');
const { UTApi, UTFile } = createRequire(process.cwd() + '/')('uploadthing/server');
parentPort.on('message', async (m) => {
  try {
    const r = await new UTApi({ logLevel: 'Error' }).uploadFiles(new UTFile([m.bytes], m.name, { type: m.type }));
    if (r.error || !r.data) parentPort.postMessage({ id: m.id, refused: JSON.stringify(r.error ?? 'no data') });
    else parentPort.postMessage({ id: m.id, data: { key: r.data.key, ufsUrl: r.data.ufsUrl, name: r.data.name, size: r.data.size } });
  } catch (e) {
    parentPort.postMessage({ id: m.id, failed: String((e && e.message) || e) });
  }
});
`;

type Reply = { id: number; data?: StoredFile; refused?: string; failed?: string };
interface Pending {
  resolve: (r: Reply) => void;
  reject: (e: Error) => void;
}
interface ThreadState {
  worker: Worker;
  pending: Map<number, Pending>;
  next: number;
}
const holder = globalThis as typeof globalThis & { __branchwiseStoreThread?: ThreadState | null };

function thread(): ThreadState | null {
  if (holder.__branchwiseStoreThread !== undefined) return holder.__branchwiseStoreThread;
  let worker: Worker;
  try {
    worker = new Worker(THREAD_SOURCE, { eval: true, env: SHARE_ENV });
  } catch (e) {
    console.error('[branchwise] upload thread unavailable; uploading on the main thread:', e);
    return (holder.__branchwiseStoreThread = null);
  }
  const state: ThreadState = { worker, pending: new Map(), next: 1 };
  worker.unref();
  worker.on('message', (r: Reply) => {
    const p = state.pending.get(r.id);
    state.pending.delete(r.id);
    if (!state.pending.size) worker.unref();
    p?.resolve(r);
  });
  const fail = (e: Error) => {
    // A new thread is made for the next upload; these ones fall back to the main thread.
    if (holder.__branchwiseStoreThread === state) holder.__branchwiseStoreThread = undefined;
    for (const p of state.pending.values()) p.reject(e);
    state.pending.clear();
  };
  worker.on('error', fail);
  worker.on('exit', (code) => fail(new Error(`upload thread exited with code ${code}`)));
  return (holder.__branchwiseStoreThread = state);
}

/** Starts the upload thread ahead of the first upload (loading the SDK takes a moment). */
export function warmStoreThread(): void {
  thread();
}

/**
 * Stores the bytes like `storeFile`, from the upload thread. Returns at once; the caller may
 * do CPU work while the promise is pending. Refusals by the service are a 503 as in storeFile.
 */
export function storeFileOffThread(bytes: Uint8Array, name: string, type = 'text/plain'): Promise<StoredFile> {
  const t = thread();
  if (!t) return storeFile(bytes, name, type);
  const id = t.next++;
  const reply = new Promise<Reply>((resolve, reject) => t.pending.set(id, { resolve, reject }));
  t.worker.ref();
  t.worker.postMessage({ id, bytes, name, type: type || 'text/plain' });
  return reply.then(
    (r) => {
      if (r.data) {
        rememberStored(r.data.key, bytes);
        return r.data;
      }
      if (r.refused) {
        console.error('[branchwise] upload service refused a file:', r.refused);
        throw new AppError('unavailable', 'The file store did not accept the file; try again shortly.');
      }
      console.error('[branchwise] upload thread failed; retrying on the main thread:', r.failed);
      return storeFile(bytes, name, type);
    },
    (e: Error) => {
      console.error('[branchwise] upload thread failed; retrying on the main thread:', e.message);
      return storeFile(bytes, name, type);
    },
  );
}
