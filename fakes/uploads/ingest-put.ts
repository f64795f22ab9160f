import type { IncomingMessage, ServerResponse } from 'node:http';
import busboy from 'busboy';
import { callbackTarget, devStreamLine, makeDelivery, postHook, type HookDelivery } from './callback-sender';
import type { FakeContext } from './context';
import { CORS_HEADERS, drain, requestBase, sendJson } from './http-util';
import { parsePresignedUpload, UrlRefused, type PresignedUpload } from './presigned';
import type { Registration } from './registry';
import { SizeMismatch, type StoredFile } from './storage';

// PUT <presigned url>: verify, stream the multipart field `file` to disk, then (route uploads)
// send the signed callback and hold the answer until the app's `/callback-result` arrives.

class UploadFailed extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export async function handlePresignedHead(ctx: FakeContext, req: IncomingMessage, res: ServerResponse): Promise<void> {
  try {
    parsePresignedUpload(requestBase(req) + req.url, ctx.opts.apiKey, ctx.opts.appId);
  } catch (err) {
    const status = err instanceof UrlRefused ? err.status : 400;
    res.writeHead(status, { ...CORS_HEADERS, 'x-ut-error': (err as Error).message }).end();
    return;
  }
  // Resume is not offered: an interrupted upload leaves nothing, so the client starts at 0.
  res.writeHead(200, { ...CORS_HEADERS, 'x-ut-range-start': '0', 'content-length': '0' }).end();
}

export async function handlePresignedPut(ctx: FakeContext, req: IncomingMessage, res: ServerResponse): Promise<void> {
  let upload: PresignedUpload;
  try {
    upload = parsePresignedUpload(requestBase(req) + req.url, ctx.opts.apiKey, ctx.opts.appId);
    checkRange(req.headers.range);
    if (!String(req.headers['content-type'] ?? '').startsWith('multipart/form-data')) {
      throw new UploadFailed(400, 'expected a multipart/form-data body with the field "file"');
    }
  } catch (err) {
    await drain(req);
    return sendJson(res, err instanceof UrlRefused || err instanceof UploadFailed ? err.status : 400, { error: (err as Error).message });
  }

  // A presigned URL is good for one upload: a repeat must neither interleave with nor replace it.
  if (ctx.uploading.has(upload.key) || (await ctx.store.get(upload.key))) {
    await drain(req);
    return sendJson(res, 409, { error: `file ${upload.key} is already uploaded or uploading` });
  }
  ctx.uploading.add(upload.key);
  try {
    await receiveAndComplete(ctx, req, res, upload);
  } finally {
    ctx.uploading.delete(upload.key);
  }
}

async function receiveAndComplete(ctx: FakeContext, req: IncomingMessage, res: ServerResponse, upload: PresignedUpload): Promise<void> {
  let reg: Registration | null = null;
  if (upload.slug !== null) {
    reg = await ctx.registry.waitForRegistration(upload.key, ctx.opts.registrationTimeoutMs);
    if (!reg) {
      await drain(req);
      ctx.log(`PUT ${upload.key}: no /route-metadata registration`);
      return sendJson(res, 409, { error: `no /route-metadata registration for ${upload.key} within ${ctx.opts.registrationTimeoutMs} ms` });
    }
  }

  try {
    const stored = await receiveFile(ctx, req, upload);
    const urls = fileUrls(ctx, req, stored.key);
    ctx.log(`stored ${stored.key} (${stored.size} bytes, md5 ${stored.fileHash})`);
    const serverData = reg ? await runCallback(ctx, reg, upload, stored, urls) : null;
    sendJson(res, 200, { ...urls, fileHash: stored.fileHash, serverData });
  } catch (err) {
    const status = err instanceof UploadFailed ? err.status : err instanceof SizeMismatch ? 413 : 500;
    const message = (err as Error).message;
    ctx.log(`PUT ${upload.key} failed: ${message}`);
    await ctx.store.delete(upload.key);
    if (reg) sendErrorHook(ctx, reg, upload.key, message);
    await drain(req);
    sendJson(res, status, { error: message });
  } finally {
    ctx.registry.finish(upload.key);
  }
}

function checkRange(range: string | undefined): void {
  if (range === undefined) return;
  const m = /^bytes=(\d+)-$/.exec(range.trim());
  if (!m) throw new UploadFailed(400, `unsupported Range "${range}"`);
  if (m[1] !== '0') throw new UploadFailed(416, `Range ${range}: resume is not offered, start at 0`);
}

function receiveFile(ctx: FakeContext, req: IncomingMessage, upload: PresignedUpload): Promise<StoredFile> {
  return new Promise((resolve, reject) => {
    let parser: busboy.Busboy;
    try {
      parser = busboy({ headers: req.headers, limits: { files: 1, fields: 20 } });
    } catch (err) {
      return reject(new UploadFailed(400, `bad multipart body: ${(err as Error).message}`));
    }
    let storing: Promise<StoredFile> | null = null;
    parser.on('file', (field, stream) => {
      if (field !== 'file' || storing) return stream.resume();
      const file = {
        key: upload.key,
        name: upload.fileName,
        type: upload.fileType,
        customId: upload.customId,
        acl: upload.acl,
        contentDisposition: upload.contentDisposition,
      };
      storing = ctx.store.store(file, stream, upload.fileSize);
      storing.catch(() => {}); // observed below; avoids an unhandled rejection meanwhile
    });
    parser.on('error', (err: Error) => reject(new UploadFailed(400, `bad multipart body: ${err.message}`)));
    parser.on('close', () => {
      if (!storing) return reject(new UploadFailed(400, 'multipart body has no field "file"'));
      storing.then(resolve, reject);
    });
    // A client that goes away mid-body must not leave a half file behind.
    req.on('close', () => {
      if (!req.complete) parser.destroy(new Error('client closed the connection before the end of the file'));
    });
    req.pipe(parser);
  });
}

function fileUrls(ctx: FakeContext, req: IncomingMessage, key: string) {
  const base = requestBase(req);
  const ufsUrl = `${base}/f/${key}`;
  return { url: ufsUrl, appUrl: `${base}/a/${ctx.opts.appId}/${key}`, ufsUrl };
}

async function runCallback(
  ctx: FakeContext,
  reg: Registration,
  upload: PresignedUpload,
  stored: StoredFile,
  urls: ReturnType<typeof fileUrls>,
): Promise<unknown> {
  const payload = {
    status: 'uploaded',
    file: { name: stored.name, size: stored.size, type: stored.type, customId: stored.customId, key: stored.key, ...urls, fileHash: stored.fileHash },
    origin: ctx.origin(),
    metadata: reg.metadata,
  };
  const delivery = makeDelivery(callbackTarget(reg.callbackUrl, reg.callbackSlug), 'callback', payload, ctx.opts.apiKey);
  const result = reg.awaitServerData ? ctx.registry.expectResult(upload.key, ctx.opts.callbackTimeoutMs) : null;
  const sent = deliver(ctx, reg, delivery);
  if (!result) {
    sent.catch((err: Error) => ctx.log(`callback for ${upload.key} failed: ${err.message}`));
    return null;
  }
  const failed = sent.then(
    () => new Promise<never>(() => {}),
    (err: Error) => {
      ctx.registry.cancelResult(upload.key);
      throw err;
    },
  );
  const answer = await Promise.race([result, failed]);
  if (answer === null) throw new UploadFailed(504, `no /callback-result from the app within ${ctx.opts.callbackTimeoutMs} ms (did onUploadComplete throw?)`);
  if ('error' in answer) throw new UploadFailed(502, `the app reported: ${answer.error}`);
  return answer.callbackData;
}

/** Production: POST to the app. Dev: a line on the open `/route-metadata` stream. */
async function deliver(ctx: FakeContext, reg: Registration, delivery: HookDelivery): Promise<void> {
  ctx.hooks.push(delivery);
  if (ctx.hooks.length > 200) ctx.hooks.shift(); // a long demo run keeps only recent ones
  if (reg.isDev) {
    if (!reg.devStream || reg.devStream.writableEnded || reg.devStream.destroyed) {
      throw new UploadFailed(502, 'the app closed its /route-metadata stream before the file arrived');
    }
    reg.devStream.write(devStreamLine(delivery));
    return;
  }
  let answer;
  try {
    answer = await postHook(delivery, ctx.opts.callbackTimeoutMs);
  } catch (err) {
    throw new UploadFailed(502, `callback to ${delivery.url} failed: ${(err as Error).message}`);
  }
  if (answer.status < 200 || answer.status >= 300) {
    throw new UploadFailed(502, `callback to ${delivery.url} answered ${answer.status}: ${answer.body.slice(0, 200)}`);
  }
}

function sendErrorHook(ctx: FakeContext, reg: Registration, fileKey: string, error: string): void {
  const delivery = makeDelivery(callbackTarget(reg.callbackUrl, reg.callbackSlug), 'error', { fileKey, error }, ctx.opts.apiKey);
  deliver(ctx, reg, delivery).catch((err: Error) => ctx.log(`error hook for ${fileKey} not delivered: ${err.message}`));
}
