import { isIPv4, isIPv6 } from 'node:net';

/** Hextets of an IPv6 address, `::` expanded (an embedded IPv4 tail counts as two). */
function hextets(address: string): string[] {
  const [head, tail = ''] = address.includes('::') ? address.split('::') : [address, undefined as unknown as string];
  const part = (s: string | undefined): string[] => {
    if (!s) return [];
    return s.split(':').flatMap((h) => {
      if (!isIPv4(h)) return [h];
      const [a, b, c, d] = h.split('.').map(Number);
      return [((a << 8) | b).toString(16), ((c << 8) | d).toString(16)];
    });
  };
  const left = part(head);
  const right = address.includes('::') ? part(tail) : [];
  const fill = address.includes('::') ? Array(8 - left.length - right.length).fill('0') : [];
  return [...left, ...fill, ...right].map((h) => h.toLowerCase().replace(/^0+(?=.)/, ''));
}

/**
 * The key a client's address is limited under. One IPv6 subscriber is usually handed a whole /64
 * and can pick any address in it, so IPv6 is keyed by its /64; IPv4 (also written IPv4-mapped,
 * `::ffff:a.b.c.d`) by the address itself.
 */
export function addressLimitKey(address: string): string {
  const bare = address.replace(/%.*$/, '');
  const mapped = /^::ffff:(\d{1,3}(?:\.\d{1,3}){3})$/i.exec(bare);
  if (mapped) return mapped[1];
  if (!isIPv6(bare)) return bare;
  return `${hextets(bare).slice(0, 4).join(':')}::/64`;
}
