import http from 'node:http';
import https from 'node:https';
import { sign } from './signing';

// node:http rather than fetch: the app answers a callback only after onUploadComplete, and
// fetch gives up waiting for response headers after 300 s.

export type HookKind = 'callback' | 'error';

export interface HookDelivery {
  url: string;
  hook: HookKind;
  /** The exact JSON text signed and sent. */
  body: string;
  signature: string;
}

export interface HookAnswer {
  status: number;
  body: string;
}

export function callbackTarget(callbackUrl: string, slug: string): string {
  const url = new URL(callbackUrl);
  url.searchParams.set('slug', slug);
  return url.href;
}

export function makeDelivery(url: string, hook: HookKind, payload: unknown, apiKey: string): HookDelivery {
  const body = JSON.stringify(payload);
  return { url, hook, body, signature: sign(body, apiKey) };
}

/** POSTs a hook; resolves with the app's answer (any status), rejects only on network failure. */
export function postHook(delivery: HookDelivery, timeoutMs: number): Promise<HookAnswer> {
  const url = new URL(delivery.url);
  const client = url.protocol === 'https:' ? https : http;
  return new Promise((resolve, reject) => {
    const req = client.request(
      url,
      {
        method: 'POST',
        headers: {
          'content-type': 'application/json',
          'content-length': Buffer.byteLength(delivery.body),
          'uploadthing-hook': delivery.hook,
          'x-uploadthing-signature': delivery.signature,
        },
        timeout: timeoutMs,
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8') }));
        res.on('error', reject);
      },
    );
    req.on('timeout', () => req.destroy(new Error(`no answer from ${delivery.url} within ${timeoutMs} ms`)));
    req.on('error', reject);
    req.end(delivery.body);
  });
}

/** The JSON line a dev-mode `/route-metadata` stream carries; the SDK forwards it to its handler. */
export function devStreamLine(delivery: HookDelivery): string {
  return JSON.stringify({ payload: delivery.body, signature: delivery.signature, hook: delivery.hook }) + '\n';
}
