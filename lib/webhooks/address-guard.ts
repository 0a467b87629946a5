/**
 * Which addresses a webhook delivery may connect to. Refused: every special-purpose
 * range of the IANA IPv4 and IPv6 Special-Purpose Address Registries (RFC 6890 and its
 * updates) that is not globally reachable — "this network", private (RFC 1918),
 * shared/CGNAT (RFC 6598, which also holds some clouds' metadata service), loopback,
 * link-local (RFC 3927; 169.254.169.254 is the usual instance-metadata address),
 * documentation, benchmarking, multicast and reserved; for IPv6 the unspecified and
 * loopback addresses, unique-local (RFC 4193, e.g. fd00:ec2::254 metadata),
 * link-local, site-local, multicast, documentation, discard-only and local-use NAT64
 * (64:ff9b:1::/48, RFC 8215), and IPv4 addresses embedded as IPv4-mapped
 * (::ffff:0:0/96), IPv4-compatible (::/96, RFC 4291 §2.5.5.1), NAT64 (64:ff9b::/96)
 * or 6to4 (2002::/16, RFC 3056) are judged as the IPv4 address they carry. `allowed` (WEBHOOK_ALLOWED_NETWORKS) lets chosen
 * networks through anyway.
 */
import { BlockList, isIP } from "node:net";

const BLOCKED_V4 = [
  "0.0.0.0/8",
  "10.0.0.0/8",
  "100.64.0.0/10",
  "127.0.0.0/8",
  "169.254.0.0/16",
  "172.16.0.0/12",
  "192.0.0.0/24",
  "192.0.2.0/24",
  "192.88.99.0/24",
  "192.168.0.0/16",
  "198.18.0.0/15",
  "198.51.100.0/24",
  "203.0.113.0/24",
  "224.0.0.0/4",
  "240.0.0.0/4",
];
const BLOCKED_V6 = [
  "::/128",
  "::1/128",
  "100::/64",
  "2001::/23",
  "2001:db8::/32",
  "64:ff9b:1::/48",
  "fc00::/7",
  "fe80::/10",
  "fec0::/10",
  "ff00::/8",
];

function toBlockList(cidrs: readonly string[]): BlockList {
  const list = new BlockList();
  for (const cidr of cidrs) {
    const [net, bits] = cidr.split("/");
    const type = isIP(net) === 6 ? "ipv6" : "ipv4";
    list.addSubnet(net, Number(bits ?? (type === "ipv6" ? 128 : 32)), type);
  }
  return list;
}

const blocked = toBlockList([...BLOCKED_V4, ...BLOCKED_V6]);

/** Parses "a/b, c" (CIDR or single addresses) into a list; throws on a malformed entry. */
export function parseNetworks(text: string): BlockList {
  const entries = text
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  for (const entry of entries) {
    const [net, bits, extra] = entry.split("/");
    const family = isIP(net);
    const max = family === 6 ? 128 : 32;
    if (
      !family ||
      extra !== undefined ||
      (bits !== undefined && !(/^\d+$/.test(bits) && Number(bits) <= max))
    ) {
      throw new Error(`not a network in CIDR form: "${entry}"`);
    }
  }
  return toBlockList(entries);
}

/** The 8 groups of an IPv6 address as numbers (handles "::" and a dotted IPv4 tail). */
function ipv6Groups(address: string): number[] {
  let text = address.toLowerCase().split("%")[0];
  const dotted = /(\d+\.\d+\.\d+\.\d+)$/.exec(text);
  if (dotted) {
    const [a, b, c, d] = dotted[1].split(".").map(Number);
    text =
      text.slice(0, -dotted[1].length) +
      `${((a << 8) | b).toString(16)}:${((c << 8) | d).toString(16)}`;
  }
  const [head, tail] = text.split("::");
  const parse = (part: string | undefined) =>
    part ? part.split(":").map((g) => parseInt(g, 16)) : [];
  const left = parse(head);
  const right = tail === undefined ? [] : parse(tail);
  const fill = tail === undefined ? [] : new Array(8 - left.length - right.length).fill(0);
  return [...left, ...fill, ...right];
}

/** The IPv4 address inside an IPv4-mapped, IPv4-compatible, NAT64 or 6to4 IPv6 address, else null. */
export function embeddedIpv4(address: string): string | null {
  const g = ipv6Groups(address);
  const dotted = (hi: number, lo: number) => [hi >> 8, hi & 255, lo >> 8, lo & 255].join(".");
  if (g[0] === 0x2002) return dotted(g[1], g[2]);
  const mapped = g.slice(0, 5).every((x) => x === 0) && (g[5] === 0xffff || g[5] === 0);
  const nat64 = g[0] === 0x64 && g[1] === 0xff9b && g.slice(2, 6).every((x) => x === 0);
  if (!mapped && !nat64) return null;
  return dotted(g[6], g[7]);
}

/** Why `address` may not be reached, or null when it may. */
export function refusalOf(address: string, allowed?: BlockList): string | null {
  const family = isIP(address);
  if (!family) return `"${address}" is not an IP address`;
  const type = family === 6 ? "ipv6" : "ipv4";
  if (allowed?.check(address, type)) return null;
  if (family === 6) {
    const inner = embeddedIpv4(address);
    if (inner) return refusalOf(inner, allowed);
  }
  if (blocked.check(address, type)) {
    return `${address} is a private, loopback, link-local, metadata or otherwise non-public address`;
  }
  return null;
}
