import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { createRouteHandler, createUploadthing, type FileRouter } from 'uploadthing/server';
import { makeUploadToken } from '../config';
import { toRequest } from './node-request';

// A minimal app for tests: the REAL uploadthing route handler and file router on node:http,
// pointed at the fake. It stands in for the Next.js route `app/api/uploadthing`.

export interface CompletedUpload {
  file: { key: string; name: string; size: number; type: string; ufsUrl: string; fileHash: string; customId: string | null };
  metadata: { submitter: string };
}

export type ServerData = { [key: string]: string | number | boolean | null };

export interface TestAppOptions {
  fakeUrl: string;
  apiKey: string;
  appId: string;
  isDev: boolean;
  /** Replaces the default onUploadComplete (which records and returns serverData). */
  onComplete?: (upload: CompletedUpload) => Promise<ServerData | void>;
  /** Serves extra paths (the browser check's page and script). */
  extraRoutes?: Record<string, { type: string; body: string | Buffer }>;
}

export interface TestApp {
  url: string;
  /** Where the client posts: `${url}/api/uploadthing`. */
  endpoint: string;
  completed: CompletedUpload[];
  errors: { fileKey: string; message: string }[];
  /** Every hook request the app answered: status and the hook header. */
  hookAnswers: { hook: string; status: number }[];
  close(): Promise<void>;
}

const f = createUploadthing();

export function makeRouter(app: Pick<TestApp, 'completed' | 'errors'>, onComplete?: TestAppOptions['onComplete']) {
  return {
    bandFile: f({ text: { maxFileSize: '4MB', maxFileCount: 2 } })
      .middleware(({ req }) => ({ submitter: req.headers.get('x-test-submitter') ?? 'anonymous' }))
      .onUploadError(({ error, fileKey }) => {
        app.errors.push({ fileKey, message: error.message });
      })
      .onUploadComplete(async ({ file, metadata }) => {
        const upload: CompletedUpload = {
          file: { key: file.key, name: file.name, size: file.size, type: file.type, ufsUrl: file.ufsUrl, fileHash: file.fileHash, customId: file.customId },
          metadata,
        };
        app.completed.push(upload);
        if (onComplete) return onComplete(upload);
        return { storedAs: file.key, submitter: metadata.submitter };
      }),
  } satisfies FileRouter;
}

export type TestRouter = ReturnType<typeof makeRouter>;

export async function startTestApp(options: TestAppOptions): Promise<TestApp> {
  const completed: CompletedUpload[] = [];
  const errors: TestApp['errors'] = [];
  const hookAnswers: TestApp['hookAnswers'] = [];
  let handler: ((req: Request) => Promise<Response>) | null = null;
  let base = '';

  const server = http.createServer(async (req, res) => {
    const extra = options.extraRoutes?.[req.url ?? ''];
    if (extra) return void res.writeHead(200, { 'content-type': extra.type }).end(extra.body);
    if (!handler || !(req.url ?? '').startsWith('/api/uploadthing')) return void res.writeHead(404).end();
    const response = await handler(toRequest(req, base));
    const hook = req.headers['uploadthing-hook'];
    if (typeof hook === 'string') hookAnswers.push({ hook, status: response.status });
    const body = Buffer.from(await response.arrayBuffer());
    res.writeHead(response.status, Object.fromEntries(response.headers)).end(body);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  const router = makeRouter({ completed, errors }, options.onComplete);
  handler = createRouteHandler({
    router,
    config: {
      token: makeUploadToken(options.apiKey, options.appId),
      ingestUrl: options.fakeUrl,
      isDev: options.isDev,
      callbackUrl: `${base}/api/uploadthing`,
      logLevel: 'Error',
    },
  });

  return {
    url: base,
    endpoint: `${base}/api/uploadthing`,
    completed,
    errors,
    hookAnswers,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
