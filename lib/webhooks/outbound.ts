/**
 * One outbound webhook POST, guarded against server-side request forgery:
 *
 * - only http(s) URLs without credentials; plain http only when every address of
 *   the host is in WEBHOOK_ALLOWED_NETWORKS (https otherwise);
 * - the host name is resolved here and EVERY resolved address is checked
 *   (./address-guard.ts); the connection is then pinned to the checked addresses
 *   (a custom `lookup`), so a DNS answer that changes between check and connect
 *   (rebinding) cannot redirect it;
 * - redirects are never followed (a 3xx counts as a failed attempt);
 * - one timeout covers connect and answer; at most 64 KiB of the answer is read.
 */
import "server-only";
import { lookup as dnsLookup } from "node:dns/promises";
import http from "node:http";
import https from "node:https";
import { isIP, type BlockList } from "node:net";
import { refusalOf } from "./address-guard";

export class DestinationRefused extends Error {
  constructor(message: string) {
    super(message);
    this.name = "DestinationRefused";
  }
}

export type CheckedDestination = { url: URL; addresses: { address: string; family: 4 | 6 }[] };

/** Validates the URL and resolves + checks its host; throws DestinationRefused with a plain reason. */
export async function checkDestination(
  raw: string,
  allowed?: BlockList,
): Promise<CheckedDestination> {
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    throw new DestinationRefused("the URL is not valid");
  }
  if (url.protocol !== "https:" && url.protocol !== "http:")
    throw new DestinationRefused("only http and https URLs are allowed");
  if (url.username || url.password)
    throw new DestinationRefused("the URL must not contain a user name or password");
  const host = url.hostname.replace(/^\[|\]$/g, "");
  let addresses: { address: string; family: 4 | 6 }[];
  if (isIP(host)) {
    addresses = [{ address: host, family: isIP(host) as 4 | 6 }];
  } else {
    try {
      addresses = (await dnsLookup(host, { all: true, verbatim: true })).map((a) => ({
        address: a.address,
        family: a.family as 4 | 6,
      }));
    } catch {
      throw new DestinationRefused(`the host name ${host} could not be resolved`);
    }
    if (!addresses.length) throw new DestinationRefused(`the host name ${host} has no address`);
  }
  for (const { address } of addresses) {
    const reason = refusalOf(address, allowed);
    if (reason) throw new DestinationRefused(`${host} resolves to ${reason}`);
  }
  if (
    url.protocol === "http:" &&
    !addresses.every((a) => allowed?.check(a.address, a.family === 6 ? "ipv6" : "ipv4"))
  ) {
    throw new DestinationRefused(
      "use https (plain http is allowed only for networks in WEBHOOK_ALLOWED_NETWORKS)",
    );
  }
  return { url, addresses };
}

export type PostOutcome = { status: number | null; error: string | null; durationMs: number };

/** POSTs `body` to a checked destination; never throws (network faults are an outcome). */
export function postToDestination(
  dest: CheckedDestination,
  body: string,
  headers: Record<string, string>,
  timeoutMs: number,
): Promise<PostOutcome> {
  const started = performance.now();
  const elapsed = () => Math.round(performance.now() - started);
  const { url, addresses } = dest;
  const client = url.protocol === "https:" ? https : http;
  return new Promise<PostOutcome>((resolve) => {
    let settled = false;
    const finish = (status: number | null, error: string | null) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      resolve({ status, error, durationMs: elapsed() });
    };
    const req = client.request(
      {
        method: "POST",
        protocol: url.protocol,
        hostname: url.hostname.replace(/^\[|\]$/g, ""),
        port: url.port || undefined,
        path: `${url.pathname}${url.search}`,
        headers: { ...headers, "content-length": String(Buffer.byteLength(body)) },
        // Pinned to the addresses checked above.
        lookup: ((
          _host: string,
          options: { all?: boolean },
          callback: (...args: unknown[]) => void,
        ) => {
          if (options?.all) callback(null, addresses);
          else callback(null, addresses[0].address, addresses[0].family);
        }) as never,
      },
      (res) => {
        let read = 0;
        res.on("data", (chunk: Buffer) => {
          read += chunk.length;
          if (read > 65_536) res.destroy();
        });
        const status = res.statusCode ?? null;
        const redirect = status !== null && status >= 300 && status < 400;
        res.on("end", () =>
          finish(
            status,
            redirect ? `redirect to ${res.headers.location ?? "?"} not followed` : null,
          ),
        );
        res.on("close", () => finish(status, redirect ? "redirect not followed" : null));
        res.on("error", () => finish(status, null));
      },
    );
    const timer = setTimeout(() => {
      req.destroy();
      finish(null, `no answer within ${timeoutMs} ms`);
    }, timeoutMs);
    req.on("error", (error: NodeJS.ErrnoException) =>
      finish(null, `connection failed (${error.code ?? error.message})`.slice(0, 255)),
    );
    req.end(body);
  });
}
