// Which address a request came from, for the sign-in limits. Pure apart from reading TRUSTED_PROXIES.
import { BlockList, isIP } from 'node:net';
import { env } from '../env';

/** Set on every incoming request by lib/http/peer-address.ts: the socket's own address, never the client's word. */
export const PEER_HEADER = 'x-scribeline-peer';

/** TRUSTED_PROXIES: addresses or CIDR ranges (comma or space separated) of the proxies in front of the app. */
export function trustedProxies(setting: string = env().TRUSTED_PROXIES): BlockList {
  const list = new BlockList();
  for (const item of (setting ?? '').split(/[\s,]+/).filter(Boolean)) {
    const [address, bits] = item.split('/');
    const family = isIP(normalizeIp(address));
    if (!family) continue;
    const type = family === 6 ? 'ipv6' : 'ipv4';
    if (bits !== undefined && /^\d+$/.test(bits)) list.addSubnet(normalizeIp(address), Number(bits), type);
    else list.addAddress(normalizeIp(address), type);
  }
  return list;
}

/** "::ffff:1.2.3.4" → "1.2.3.4", "[::1]" → "::1", "1.2.3.4:5678" → "1.2.3.4"; anything else as given. */
export function normalizeIp(value: string): string {
  let v = value.trim();
  if (v.startsWith('[') && v.includes(']')) v = v.slice(1, v.indexOf(']'));
  else if (/^\d+\.\d+\.\d+\.\d+:\d+$/.test(v)) v = v.slice(0, v.lastIndexOf(':'));
  if (/^::ffff:\d+\.\d+\.\d+\.\d+$/i.test(v)) v = v.slice(7);
  return v.toLowerCase();
}

function isTrusted(list: BlockList, ip: string): boolean {
  const family = isIP(ip);
  return family !== 0 && list.check(ip, family === 6 ? 'ipv6' : 'ipv4');
}

type HeaderGetter = (name: string) => string | undefined;

/**
 * The client's address: start from the socket's peer and, only while the hop at hand is a trusted proxy,
 * step left through X-Forwarded-For. A client's own X-Forwarded-For is never believed unless a trusted
 * proxy passed it on, and then only the hop that proxy added. Without the peer (tests, a handler called
 * outside the server) the rightmost forwarded hop stands in; with nothing at all: "unknown".
 */
export function clientAddressFrom(get: HeaderGetter, trusted: BlockList = trustedProxies()): string {
  const hops = (get('x-forwarded-for') ?? '')
    .split(',')
    .map((h) => normalizeIp(h))
    .filter(Boolean);
  const peer = get(PEER_HEADER);
  let current = peer ? normalizeIp(peer) : hops.pop();
  while (current && isTrusted(trusted, current) && hops.length) current = hops.pop();
  return current && isIP(current) ? current : 'unknown';
}
