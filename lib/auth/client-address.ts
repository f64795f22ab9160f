/**
 * The client a request came from, as a key for per-client limits. Pure (node:net only).
 *
 * The last `x-forwarded-for` entry is used: Next's server sets the header to the socket's peer
 * when a request arrives without one, and a proxy in front appends the peer it saw, so the last
 * entry is one the client did not write. (A client that reaches the app directly with its own
 * header chooses it; the per-e-mail limit still holds for such a client.)
 */
import { isIP } from 'node:net';

export function clientAddress(headers: Headers): string | null {
  const forwarded = headers.get('x-forwarded-for');
  if (!forwarded) return null;
  const last = forwarded.split(',').pop()!.trim();
  return addressKey(last);
}

/**
 * An address as a limit key: IPv4 as it is, IPv4-mapped IPv6 as IPv4, other IPv6 as its /64
 * (a household or lab is usually handed a whole /64, so single addresses would not limit it).
 * Null for anything that is not an address.
 */
export function addressKey(raw: string): string | null {
  let ip = raw.trim();
  const bracketed = ip.match(/^\[([^\]]+)\](?::\d+)?$/);
  if (bracketed) ip = bracketed[1]!;
  else if (/^[\d.]+:\d+$/.test(ip)) ip = ip.slice(0, ip.lastIndexOf(':'));
  ip = ip.split('%')[0]!; // zone id
  const version = isIP(ip);
  if (version === 4) return ip;
  if (version !== 6) return null;
  const g = ipv6Groups(ip);
  if (g[0] === 0 && g[1] === 0 && g[2] === 0 && g[3] === 0 && g[4] === 0 && g[5] === 0xffff) {
    return [g[6]! >> 8, g[6]! & 255, g[7]! >> 8, g[7]! & 255].join('.');
  }
  return `${g.slice(0, 4).map((x) => x.toString(16)).join(':')}::/64`;
}

/** The eight 16-bit groups of a valid IPv6 address (isIP said 6). */
function ipv6Groups(ip: string): number[] {
  let s = ip.toLowerCase();
  const v4 = s.match(/^(.*:)(\d+)\.(\d+)\.(\d+)\.(\d+)$/);
  if (v4) {
    const [a, b, c, d] = v4.slice(2).map(Number) as [number, number, number, number];
    s = `${v4[1]}${((a << 8) | b).toString(16)}:${((c << 8) | d).toString(16)}`;
  }
  const [head, tail] = s.split('::') as [string, string | undefined];
  const left = head ? head.split(':') : [];
  const right = tail ? tail.split(':') : [];
  const zeros = tail === undefined ? [] : Array<string>(8 - left.length - right.length).fill('0');
  return [...left, ...zeros, ...right].map((h) => parseInt(h, 16));
}
