import net from 'node:net';
import { describe, expect, it } from 'vitest';
import { freePort } from './free-port';

describe('freePort', () => {
  it('gives a loopback port that can be listened on', async () => {
    const port = await freePort();
    expect(port).toBeGreaterThan(0);
    const server = net.createServer();
    await new Promise<void>((resolve, reject) => server.once('error', reject).listen(port, '127.0.0.1', resolve));
    await new Promise<void>((resolve) => server.close(() => resolve()));
  });
});
