import type { IncomingMessage, ServerResponse } from 'node:http';
import type { FakeContext } from './context';
import { HttpError, readJson, requestBase, requireApiKey, sendJson, stringArray } from './http-util';
import { signUrl } from './presigned';
import type { StoredFile } from './storage';

// POST /v6/<action>, as UTApi calls them. Answers follow the SDK's response schemas.

type Body = Record<string, unknown>;
type Action = (ctx: FakeContext, body: Body, base: string) => Promise<unknown>;

/** Resolves `fileKeys` or `customIds` (UTApi's keyType option) to stored files. */
async function filesFor(ctx: FakeContext, body: Body): Promise<StoredFile[]> {
  const files = body.customIds !== undefined
    ? await Promise.all(stringArray(body.customIds, 'customIds').map((id) => ctx.store.findByCustomId(id)))
    : await Promise.all(stringArray(body.fileKeys, 'fileKeys').map((key) => ctx.store.get(key)));
  return files.filter((f): f is StoredFile => f !== null);
}

async function fileFor(ctx: FakeContext, ref: Body): Promise<StoredFile | null> {
  if (typeof ref.fileKey === 'string') return ctx.store.get(ref.fileKey);
  if (typeof ref.customId === 'string') return ctx.store.findByCustomId(ref.customId);
  throw new HttpError(400, 'each entry needs fileKey or customId');
}

function updates(body: Body): Body[] {
  if (!Array.isArray(body.updates) || !body.updates.every((u) => typeof u === 'object' && u !== null)) {
    throw new HttpError(400, 'updates must be an array of objects');
  }
  return body.updates as Body[];
}

const actions: Record<string, Action> = {
  async deleteFiles(ctx, body) {
    let deletedCount = 0;
    for (const f of await filesFor(ctx, body)) if (await ctx.store.delete(f.key)) deletedCount++;
    return { success: true, deletedCount };
  },
  async getFileUrl(ctx, body, base) {
    return { data: (await filesFor(ctx, body)).map((f) => ({ key: f.key, url: `${base}/f/${f.key}` })) };
  },
  async listFiles(ctx, body) {
    const all = await ctx.store.list();
    const offset = typeof body.offset === 'number' ? body.offset : 0;
    const limit = typeof body.limit === 'number' ? body.limit : 500;
    const page = all.slice(offset, offset + limit);
    return {
      hasMore: offset + page.length < all.length,
      files: page.map((f) => ({ id: f.key, customId: f.customId, key: f.key, name: f.name, size: f.size, status: 'Uploaded', uploadedAt: f.uploadedAt })),
    };
  },
  async requestFileAccess(ctx, body, base) {
    const file = await fileFor(ctx, body);
    if (!file) throw new HttpError(404, 'no such file');
    const ttl = typeof body.expiresIn === 'number' ? body.expiresIn : 3600;
    const url = signUrl(`${base}/a/${ctx.opts.appId}/${file.key}`, ctx.opts.apiKey, ttl);
    return { url, ufsUrl: url };
  },
  async renameFiles(ctx, body) {
    for (const u of updates(body)) {
      if (typeof u.newName !== 'string' || u.newName === '') throw new HttpError(400, 'newName must be a non-empty string');
      const file = await fileFor(ctx, u);
      if (file) await ctx.store.update(file.key, { name: u.newName });
    }
    return { success: true };
  },
  async updateACL(ctx, body) {
    for (const u of updates(body)) {
      if (u.acl !== 'public-read' && u.acl !== 'private') throw new HttpError(400, 'acl must be "public-read" or "private"');
      const file = await fileFor(ctx, u);
      if (file) await ctx.store.update(file.key, { acl: u.acl });
    }
    return { success: true };
  },
  async getUsageInfo(ctx) {
    const all = await ctx.store.list();
    const bytes = all.reduce((sum, f) => sum + f.size, 0);
    return { totalBytes: bytes, appTotalBytes: bytes, filesUploaded: all.length, limitBytes: 2 ** 40 };
  },
};

export async function handleUtApi(ctx: FakeContext, req: IncomingMessage, res: ServerResponse, name: string): Promise<void> {
  const action = Object.hasOwn(actions, name) ? actions[name] : undefined;
  if (!action) throw new HttpError(404, `unknown UTApi action "${name}"`);
  requireApiKey(req, ctx.opts.apiKey);
  sendJson(res, 200, await action(ctx, await readJson(req), requestBase(req)));
}
