import type http from 'node:http';
import { Readable } from 'node:stream';

/**
 * A Node request as a web `Request`, so a fetch-style handler (the uploadthing route handler, our
 * route handlers) can be mounted on a plain `node:http` server in tests and benchmarks. The body is
 * streamed, not buffered: uploads can be large.
 */
export function toRequest(req: http.IncomingMessage, base: string): Request {
  const headers = new Headers();
  for (let i = 0; i < req.rawHeaders.length; i += 2) headers.append(req.rawHeaders[i], req.rawHeaders[i + 1]);
  const hasBody = req.method !== 'GET' && req.method !== 'HEAD';
  return new Request(new URL(req.url ?? '/', base), {
    method: req.method,
    headers,
    body: hasBody ? (Readable.toWeb(req) as ReadableStream) : undefined,
    duplex: 'half',
  } as RequestInit);
}
