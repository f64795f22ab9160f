import http, { type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { postHook, type HookAnswer, type HookDelivery } from './callback-sender';
import { DEFAULT_TIMEOUTS, type ResolvedOptions, type UploadFakeOptions } from './config';
import type { FakeContext } from './context';
import { handleFileGet } from './file-routes';
import { CORS_HEADERS, HttpError, drain, sendJson } from './http-util';
import { handleCallbackResult, handleRouteMetadata } from './ingest-routes';
import { handlePresignedHead, handlePresignedPut } from './ingest-put';
import { Registry } from './registry';
import { sign } from './signing';
import { FileStore } from './storage';
import { handleUtApi } from './utapi-routes';

export interface UploadFake {
  /** `http://127.0.0.1:<port>`: use it for UPLOADTHING_INGEST_URL and UPLOADTHING_API_URL. */
  url: string;
  port: number;
  store: FileStore;
  /** Every hook sent (callbacks and error hooks), oldest first. */
  hooks: readonly HookDelivery[];
  /** The last `uploadthing-hook: callback` sent, if any. */
  lastCallback(): HookDelivery | undefined;
  /** Sends the last callback again, byte for byte and correctly signed, straight to the app. */
  replayLastCallback(): Promise<HookAnswer>;
  /** Sends a callback (by default the last one) with a signature made with the wrong key. */
  sendForgedCallback(delivery?: HookDelivery): Promise<HookAnswer>;
  close(): Promise<void>;
}

function route(ctx: FakeContext, req: IncomingMessage, res: ServerResponse): Promise<void> {
  const path = new URL(req.url ?? '/', 'http://x').pathname;
  const method = req.method ?? 'GET';
  if (method === 'OPTIONS') {
    res.writeHead(204, CORS_HEADERS).end();
    return Promise.resolve();
  }
  if (method === 'POST' && path === '/route-metadata') return handleRouteMetadata(ctx, req, res);
  if (method === 'POST' && path === '/callback-result') return handleCallbackResult(ctx, req, res);
  const v6 = /^\/v6\/([A-Za-z]+)$/.exec(path);
  if (method === 'POST' && v6) return handleUtApi(ctx, req, res, v6[1]);
  const file = /^\/f\/([^/]+)$/.exec(path) ?? /^\/a\/([^/]+)\/([^/]+)$/.exec(path);
  if ((method === 'GET' || method === 'HEAD') && file) {
    if (file.length === 3 && file[1] !== ctx.opts.appId) throw new HttpError(404, `unknown app "${file[1]}"`);
    return handleFileGet(ctx, req, res, file[file.length - 1]);
  }
  if (/^\/[^/]+$/.test(path)) {
    if (method === 'HEAD') return handlePresignedHead(ctx, req, res);
    if (method === 'PUT') return handlePresignedPut(ctx, req, res);
  }
  throw new HttpError(404, `${method} ${path}: not served by the upload fake`);
}

export async function startUploadFake(options: UploadFakeOptions): Promise<UploadFake> {
  const opts: ResolvedOptions = {
    registrationTimeoutMs: options.registrationTimeoutMs ?? DEFAULT_TIMEOUTS.registrationTimeoutMs,
    callbackTimeoutMs: options.callbackTimeoutMs ?? DEFAULT_TIMEOUTS.callbackTimeoutMs,
    devStreamTimeoutMs: options.devStreamTimeoutMs ?? DEFAULT_TIMEOUTS.devStreamTimeoutMs,
    port: options.port,
    dir: options.dir,
    apiKey: options.apiKey,
    appId: options.appId,
    log: options.log,
  };
  if (!opts.apiKey.startsWith('sk_')) throw new Error('upload fake: apiKey must start with "sk_"');
  const store = new FileStore(opts.dir);
  await store.init();
  const log = (line: string) => opts.log?.(line);
  const registry = new Registry(log);
  let base = '';
  const hooks: HookDelivery[] = [];
  const ctx: FakeContext = { opts, store, registry, hooks, uploading: new Set(), origin: () => base, log };

  // Held PUTs and dev streams outlive Node's default 300 s request timeout.
  const server = http.createServer({ requestTimeout: 0 }, (req, res) => {
    route(ctx, req, res).catch(async (err: unknown) => {
      const status = err instanceof HttpError ? err.status : 500;
      if (status === 500) ctx.log(`${req.method} ${req.url}: ${(err as Error).stack ?? err}`);
      await drain(req);
      sendJson(res, status, { error: err instanceof Error ? err.message : String(err) });
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, '127.0.0.1', () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  base = `http://127.0.0.1:${port}`;

  const lastCallback = () => hooks.findLast((h) => h.hook === 'callback');
  const requireLast = () => {
    const last = lastCallback();
    if (!last) throw new Error('upload fake: no callback has been sent yet');
    return last;
  };
  return {
    url: base,
    port,
    store,
    hooks,
    lastCallback,
    replayLastCallback: () => postHook(requireLast(), opts.callbackTimeoutMs),
    sendForgedCallback: (delivery = requireLast()) => {
      const forged = { ...delivery, signature: sign(delivery.body, `${opts.apiKey}-forged`) };
      return postHook(forged, opts.callbackTimeoutMs);
    },
    close: () =>
      new Promise<void>((resolve) => {
        registry.closeAll();
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
