/**
 * The webhook address guard. Expected verdicts come from the IANA IPv4 and IPv6
 * Special-Purpose Address Registries (RFC 6890; RFC 1918 private, RFC 6598 shared,
 * RFC 3927 link-local, RFC 4193 unique-local, RFC 4291 §2.5.5.2 IPv4-mapped and
 * §2.5.5.1 IPv4-compatible, RFC 6052 NAT64 well-known prefix, RFC 8215 local-use NAT64,
 * RFC 3056 6to4); the public examples are addresses outside every such range.
 */
import { describe, expect, it } from "vitest";
import { envSchema } from "@/lib/env";
import { embeddedIpv4, parseNetworks, refusalOf } from "@/lib/webhooks/address-guard";

describe("refusalOf", () => {
  it.each([
    "127.0.0.1",
    "127.255.0.9",
    "10.0.0.1",
    "172.16.0.1",
    "172.31.255.255",
    "192.168.1.10",
    "169.254.169.254",
    "100.64.0.1",
    "100.100.100.200",
    "0.0.0.0",
    "224.0.0.251",
    "255.255.255.255",
    "192.0.2.5",
    "198.18.0.1",
    "::",
    "::1",
    "fe80::1",
    "fd00:ec2::254",
    "fc00::7",
    "ff02::1",
    "2001:db8::1",
    "::ffff:127.0.0.1",
    "::ffff:7f00:1",
    "::ffff:169.254.169.254",
    "64:ff9b::a00:1",
    // IPv4-compatible (RFC 4291 §2.5.5.1), 6to4 (RFC 3056) and local-use NAT64 (RFC 8215).
    "::127.0.0.1",
    "::a9fe:a9fe",
    "2002:7f00:1::1",
    "2002:a9fe:a9fe::",
    "64:ff9b:1::a00:1",
  ])("refuses %s", (address) => {
    expect(refusalOf(address)).toMatch(/non-public/);
  });

  it.each([
    "93.184.215.14",
    "1.1.1.1",
    "8.8.4.4",
    "172.32.0.1",
    "100.128.0.1",
    "2606:4700:4700::1111",
    "::ffff:8.8.8.8",
    "2002:808:808::1",
  ])("lets public %s through", (address) => {
    expect(refusalOf(address)).toBeNull();
  });

  it("lets the allowed networks through, and only those", () => {
    const allowed = parseNetworks("127.0.0.0/8, ::1/128");
    expect(refusalOf("127.0.0.1", allowed)).toBeNull();
    expect(refusalOf("::1", allowed)).toBeNull();
    expect(refusalOf("::ffff:127.0.0.1", allowed)).toBeNull();
    expect(refusalOf("10.0.0.1", allowed)).toMatch(/non-public/);
    expect(refusalOf("169.254.169.254", allowed)).toMatch(/non-public/);
  });

  it("names a non-address", () => {
    expect(refusalOf("example.com")).toMatch(/not an IP address/);
  });
});

describe("embeddedIpv4", () => {
  it("reads IPv4-mapped and NAT64 addresses in dotted and hex form", () => {
    expect(embeddedIpv4("::ffff:10.1.2.3")).toBe("10.1.2.3");
    expect(embeddedIpv4("::ffff:a01:203")).toBe("10.1.2.3");
    expect(embeddedIpv4("64:ff9b::10.1.2.3")).toBe("10.1.2.3");
    expect(embeddedIpv4("::10.1.2.3")).toBe("10.1.2.3");
    expect(embeddedIpv4("2002:a01:203::9")).toBe("10.1.2.3");
    expect(embeddedIpv4("2001:db8::1")).toBeNull();
  });
});

describe("parseNetworks", () => {
  it("accepts CIDR lists and single addresses, refuses anything else by name", () => {
    expect(parseNetworks("").check("127.0.0.1")).toBe(false);
    expect(parseNetworks("10.0.0.0/8,192.168.1.7").check("192.168.1.7")).toBe(true);
    expect(() => parseNetworks("10.0.0.0/33")).toThrow(/10\.0\.0\.0\/33/);
    expect(() => parseNetworks("localhost")).toThrow(/localhost/);
  });
});

describe("WEBHOOK_ALLOWED_NETWORKS", () => {
  it("is checked with the environment, not at the first delivery", () => {
    const base = { DATABASE_URL: "mysql://u:p@127.0.0.1:3306/k", AUTH_SECRET: "x".repeat(32) };
    expect(envSchema.safeParse({ ...base, WEBHOOK_ALLOWED_NETWORKS: "10.0.0.0/8" }).success).toBe(
      true,
    );
    const bad = envSchema.safeParse({ ...base, WEBHOOK_ALLOWED_NETWORKS: "10.0.0.0/8, intranet" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(["WEBHOOK_ALLOWED_NETWORKS"]);
    expect(bad.error?.issues[0].message).toMatch(/intranet/);
  });
});
