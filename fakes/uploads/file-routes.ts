import { createReadStream } from 'node:fs';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { FakeContext } from './context';
import { CORS_HEADERS, HttpError, requestBase } from './http-util';
import { isValidKey, UrlRefused, verifySignedUrl } from './presigned';

// GET /f/<key> and /a/<appId>/<key>. Public files need no signature; a signature, when present
// (or required because the file is private), must be valid and unexpired.

export async function handleFileGet(ctx: FakeContext, req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
  if (!isValidKey(key)) throw new HttpError(404, 'no such file');
  const file = await ctx.store.get(key);
  if (!file) throw new HttpError(404, `no file ${key}`);
  const signed = /[?&]signature=/.test(req.url ?? '');
  if (signed || file.acl === 'private') {
    try {
      verifySignedUrl(requestBase(req) + req.url, ctx.opts.apiKey);
    } catch (err) {
      throw new HttpError(403, err instanceof UrlRefused ? err.message : 'invalid signed URL');
    }
  }
  const disposition = file.contentDisposition === 'attachment' ? 'attachment' : 'inline';
  res.writeHead(200, {
    ...CORS_HEADERS,
    'content-type': file.type || 'application/octet-stream',
    'content-length': String(file.size),
    'content-disposition': `${disposition}; filename*=UTF-8''${encodeURIComponent(file.name)}`,
    etag: `"${file.fileHash}"`,
    'cache-control': 'no-store',
  });
  if (req.method === 'HEAD') return void res.end();
  await new Promise<void>((resolve) => {
    const stream = createReadStream(ctx.store.dataPath(key));
    stream.on('error', () => (res.destroy(), resolve()));
    res.on('close', resolve);
    stream.pipe(res);
  });
}
