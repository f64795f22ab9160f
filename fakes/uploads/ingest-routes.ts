import type { IncomingMessage, ServerResponse } from 'node:http';
import type { FakeContext } from './context';
import { HttpError, readJson, requireApiKey, sendJson } from './http-util';
import { parseRegistration } from './registry';

// The app's side of the ingest protocol: register route metadata, report callback results.

export async function handleRouteMetadata(ctx: FakeContext, req: IncomingMessage, res: ServerResponse): Promise<void> {
  requireApiKey(req, ctx.opts.apiKey);
  const reg = parseRegistration(await readJson(req));
  ctx.log(`route-metadata ${reg.callbackSlug} ${reg.isDev ? 'dev' : 'production'}: ${reg.fileKeys.join(', ')}`);
  if (!reg.isDev) {
    ctx.registry.register({ ...reg, devStream: null }, ctx.opts.devStreamTimeoutMs);
    return sendJson(res, 200, { ok: true });
  }
  // Dev mode: answer at once and keep the body open; one JSON line per finished file.
  res.writeHead(200, { 'content-type': 'application/jsonl', 'cache-control': 'no-cache' });
  res.flushHeaders();
  ctx.registry.register({ ...reg, devStream: res }, ctx.opts.devStreamTimeoutMs);
}

export async function handleCallbackResult(ctx: FakeContext, req: IncomingMessage, res: ServerResponse): Promise<void> {
  requireApiKey(req, ctx.opts.apiKey);
  const body = await readJson(req);
  if (typeof body.fileKey !== 'string') throw new HttpError(400, 'fileKey must be a string');
  const result = typeof body.error === 'string' ? { error: body.error } : { callbackData: body.callbackData ?? null };
  const waiting = ctx.registry.deliverResult(body.fileKey, result);
  // A replayed callback produces a second result with no PUT waiting: accepted, nothing to do.
  if (!waiting) ctx.log(`callback-result for ${body.fileKey}: no upload waiting`);
  sendJson(res, 200, { ok: true });
}
