import type { IncomingMessage, ServerResponse } from 'node:http';

// What browsers need on OPTIONS, HEAD and PUT to the ingest URL; anything missing shows in the
// app only as a vague "upload failed", hence one constant used everywhere.
export const CORS_HEADERS = {
  'access-control-allow-origin': '*',
  'access-control-allow-methods': 'GET, HEAD, PUT, POST, OPTIONS',
  'access-control-allow-headers': 'range, x-uploadthing-version, b3, traceparent, content-type',
  'access-control-expose-headers': 'x-ut-range-start',
  'access-control-max-age': '600',
} as const;

export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export function sendJson(res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  if (res.headersSent) {
    res.end();
    return;
  }
  const text = JSON.stringify(body);
  res.writeHead(status, { ...CORS_HEADERS, 'content-type': 'application/json', 'content-length': Buffer.byteLength(text), ...headers });
  res.end(text);
}

/** Reads a small JSON body (hook results, UTApi calls); refuses anything big or malformed. */
export async function readJson(req: IncomingMessage, limit = 1 << 20): Promise<Record<string, unknown>> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req as AsyncIterable<Buffer>) {
    size += chunk.length;
    if (size > limit) throw new HttpError(413, `JSON body larger than ${limit} bytes`);
    chunks.push(chunk);
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.concat(chunks).toString('utf8') || '{}');
  } catch {
    throw new HttpError(400, 'body is not valid JSON');
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) throw new HttpError(400, 'body must be a JSON object');
  return parsed as Record<string, unknown>;
}

/** Consumes a request body we refuse, so the client gets our answer rather than a reset socket. */
export function drain(req: IncomingMessage): Promise<void> {
  if (req.complete || req.readableEnded) return Promise.resolve();
  return new Promise((resolve) => {
    req.on('end', resolve);
    req.on('close', resolve);
    req.on('error', resolve);
    req.resume();
  });
}

/** The base URL as the client reached us: signatures and file URLs follow the Host header. */
export function requestBase(req: IncomingMessage): string {
  return `http://${req.headers.host ?? '127.0.0.1'}`;
}

export function requireApiKey(req: IncomingMessage, apiKey: string): void {
  if (req.headers['x-uploadthing-api-key'] !== apiKey) throw new HttpError(401, 'missing or wrong x-uploadthing-api-key');
}

export function stringArray(value: unknown, field: string): string[] {
  if (!Array.isArray(value) || !value.every((v) => typeof v === 'string')) throw new HttpError(400, `${field} must be an array of strings`);
  return value;
}
