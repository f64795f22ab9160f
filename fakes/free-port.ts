import net from 'node:net';

/**
 * A loopback port nothing listens on right now, for a fake or a server started beside the tests
 * or a benchmark. The port is released before it is returned, so another process could take it
 * first; on this machine's loopback that race has not been seen.
 */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.unref();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}
