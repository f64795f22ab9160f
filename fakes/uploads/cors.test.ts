import { afterEach, expect, it } from 'vitest';
import { presign, putFile, startFixture, textFile, type Fixture } from './testing/fixture';

// What a browser needs on OPTIONS, HEAD and PUT (checked in chromium too, see README).
const needed = {
  'access-control-allow-origin': '*',
  'access-control-allow-methods': expect.stringContaining('PUT'),
  'access-control-allow-headers': expect.stringMatching(/b3.*traceparent|traceparent.*b3/),
};

let fx: Fixture;
afterEach(async () => fx?.close());

function headersOf(res: Response): Record<string, string> {
  return Object.fromEntries(res.headers);
}

it('answers OPTIONS, HEAD and PUT with the CORS headers the browser client needs', async () => {
  fx = await startFixture({ isDev: false });
  const file = textFile('a.txt', 100);
  const [p] = await presign(fx.app, [file]);

  const preflight = await fetch(p.url, {
    method: 'OPTIONS',
    headers: { origin: 'http://127.0.0.1:9', 'access-control-request-method': 'PUT', 'access-control-request-headers': 'b3,traceparent,x-uploadthing-version,range' },
  });
  expect(preflight.status).toBe(204);
  const pre = headersOf(preflight);
  expect(pre).toMatchObject(needed);
  for (const h of ['range', 'x-uploadthing-version', 'b3', 'traceparent', 'content-type']) expect(pre['access-control-allow-headers']).toContain(h);

  const head = await fetch(p.url, { method: 'HEAD' });
  expect(head.status).toBe(200);
  expect(headersOf(head)).toMatchObject({ ...needed, 'x-ut-range-start': '0', 'access-control-expose-headers': 'x-ut-range-start' });

  const put = await putFile(p.url, file, { 'x-uploadthing-version': '7.7.4' });
  expect(put.status).toBe(200);
  expect(headersOf(put)).toMatchObject(needed);

  const refused = await putFile(p.url.replace('signature=', 'signature=x'), file);
  expect(refused.status).toBe(403);
  expect(headersOf(refused)).toMatchObject(needed);
});
