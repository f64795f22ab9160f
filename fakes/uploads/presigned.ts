import { sign, verifySignature } from './signing';

// Presigned URLs are signed over the whole URL string before `&signature=…`, origin included.
// The origin is rebuilt from the Host header: clients use the URL exactly as the app gave it.

export interface PresignedUpload {
  key: string;
  appId: string;
  fileName: string;
  fileSize: number;
  fileType: string;
  /** Present for route uploads (callback expected); absent for UTApi.uploadFiles. */
  slug: string | null;
  customId: string | null;
  contentDisposition: string;
  acl: string;
  expires: number;
}

export class UrlRefused extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

const KEY_PATTERN = /^[A-Za-z0-9_-]{1,200}$/;

export function isValidKey(key: string): boolean {
  return KEY_PATTERN.test(key);
}

/** Splits a raw request target into the signed part and the signature. */
function splitSignature(fullUrl: string): { signed: string; signature: string | null } {
  const cut = Math.max(fullUrl.lastIndexOf('&signature='), fullUrl.lastIndexOf('?signature='));
  if (cut < 0) return { signed: fullUrl, signature: null };
  const rest = fullUrl.slice(cut + '&signature='.length);
  if (rest.includes('&')) return { signed: fullUrl, signature: null }; // the SDK appends it last
  try {
    return { signed: fullUrl.slice(0, cut), signature: decodeURIComponent(rest) };
  } catch {
    return { signed: fullUrl, signature: null };
  }
}

/** Checks signature and expiry of a signed URL (`/a/…` file links and presigned PUTs). */
export function verifySignedUrl(fullUrl: string, apiKey: string, now = Date.now()): URL {
  const { signed, signature } = splitSignature(fullUrl);
  if (!signature) throw new UrlRefused(403, 'missing signature');
  if (!verifySignature(signed, signature, apiKey)) throw new UrlRefused(403, 'invalid signature');
  const url = new URL(signed);
  const expires = Number(url.searchParams.get('expires'));
  if (!Number.isFinite(expires) || expires <= 0) throw new UrlRefused(403, 'missing or invalid expires');
  if (expires < now) throw new UrlRefused(403, `URL expired at ${new Date(expires).toISOString()}`);
  return url;
}

// The SDK encodes each x-ut-* value with encodeURIComponent before URLSearchParams encodes it again.
function param(url: URL, name: string): string | null {
  const raw = url.searchParams.get(name);
  if (raw === null) return null;
  try {
    return decodeURIComponent(raw);
  } catch {
    throw new UrlRefused(400, `${name}: malformed encoding`);
  }
}

export function parsePresignedUpload(fullUrl: string, apiKey: string, appId: string, now = Date.now()): PresignedUpload {
  const url = verifySignedUrl(fullUrl, apiKey, now);
  const key = decodeURIComponent(url.pathname.slice(1));
  if (!isValidKey(key)) throw new UrlRefused(400, `invalid file key "${key}"`);
  const identifier = param(url, 'x-ut-identifier');
  if (identifier !== appId) throw new UrlRefused(403, `x-ut-identifier "${identifier}" is not this app`);
  const size = Number(param(url, 'x-ut-file-size'));
  if (!Number.isSafeInteger(size) || size < 0) throw new UrlRefused(400, 'x-ut-file-size missing or invalid');
  return {
    key,
    appId,
    fileName: param(url, 'x-ut-file-name') ?? key,
    fileSize: size,
    fileType: param(url, 'x-ut-file-type') ?? 'application/octet-stream',
    slug: param(url, 'x-ut-slug'),
    customId: param(url, 'x-ut-custom-id'),
    contentDisposition: param(url, 'x-ut-content-disposition') ?? 'inline',
    acl: param(url, 'x-ut-acl') ?? 'public-read',
    expires: Number(url.searchParams.get('expires')),
  };
}

/** Signs a URL the way the SDK does (used for private-file links and by tests to forge/expire URLs). */
export function signUrl(base: string, apiKey: string, ttlSeconds: number, data: Record<string, string | number> = {}, now = Date.now()): string {
  const url = new URL(base);
  url.searchParams.append('expires', String(now + ttlSeconds * 1000));
  for (const [k, v] of Object.entries(data)) url.searchParams.append(k, encodeURIComponent(v));
  const signature = sign(url.toString(), apiKey);
  url.searchParams.append('signature', signature);
  return url.href;
}
