/**
 * A small test network of Linux network namespaces (needs root): one bridge in
 * the root namespace with its own /24, and one namespace per "host", each
 * joined to the bridge by a veth pair. Traffic stays on this bridge and these
 * namespaces; nothing is routed anywhere else (no default route, no NAT).
 *
 * Names all start with `kwc` so a leftover of an aborted run is found and
 * removed by `destroyNetwork()` before the next one starts.
 */
import { execFileSync } from "node:child_process";

export const SUBNET = "10.231.7";
export const BRIDGE = "kwc-br0";
export const BRIDGE_IP = `${SUBNET}.1`;

export type Host = { name: string; ns: string; ip: string; veth: string };

export function ip(...args: string[]): string {
  return execFileSync("ip", args, { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
}

function tryIp(...args: string[]): void {
  try {
    ip(...args);
  } catch {
    // already gone
  }
}

export function host(name: string, last: number): Host {
  return { name, ns: `kwc-${name}`, ip: `${SUBNET}.${last}`, veth: `kwc-v${name}`.slice(0, 15) };
}

/** Removes every namespace and link this module creates (idempotent). */
export function destroyNetwork(): void {
  for (const ns of ip("netns", "list")
    .split("\n")
    .map((l) => l.split(" ")[0])
    .filter((n) => n.startsWith("kwc-"))) {
    tryIp("netns", "del", ns);
  }
  for (const line of ip("-o", "link", "show").split("\n")) {
    const name = /^\d+:\s+([^:@]+)/.exec(line)?.[1];
    if (name?.startsWith("kwc-")) tryIp("link", "del", name);
  }
}

export function createNetwork(hosts: Host[]): void {
  destroyNetwork();
  ip("link", "add", BRIDGE, "type", "bridge");
  ip("addr", "add", `${BRIDGE_IP}/24`, "dev", BRIDGE);
  ip("link", "set", BRIDGE, "up");
  for (const h of hosts) {
    ip("netns", "add", h.ns);
    ip("link", "add", h.veth, "type", "veth", "peer", "name", "eth0", "netns", h.ns);
    ip("link", "set", h.veth, "master", BRIDGE, "up");
    ip("-n", h.ns, "addr", "add", `${h.ip}/24`, "dev", "eth0");
    ip("-n", h.ns, "link", "set", "eth0", "up");
    ip("-n", h.ns, "link", "set", "lo", "up");
  }
}

/** Cuts a host off the network (its bridge-side link down) or brings it back. */
export function setLink(h: Host, up: boolean): void {
  ip("link", "set", h.veth, up ? "up" : "down");
}
