/**
 * Password sign-in throttling that slows attacks without locking anyone out.
 *
 * Failures are counted per account AND per source — the browser (a signed
 * device cookie given after a successful sign-in, OWASP "device cookies"),
 * else the client IP (lib/rate-limit/client-ip.ts), else one shared
 * "unknown" source. After FREE_FAILURES failures from one source the next
 * attempt from that source must wait 1 s, then 2 s, 4 s … up to 15 minutes
 * (a progressive delay, never a lock). An attacker's failures never delay
 * the owner signing in from their own browser or network. A success clears
 * the counter of its source.
 */
import "server-only";
import { createHash, createHmac, randomUUID, timingSafeEqual } from "node:crypto";
import { tooManyRequests } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { getRedis } from "@/lib/rate-limit/redis";
import { formatWait } from "@/lib/format";

export const FREE_FAILURES = 5;
export const MAX_DELAY_SECONDS = 15 * 60;
export const DEVICE_COOKIE = "kw_device";
const FORGET_AFTER_SECONDS = 24 * 60 * 60;

/** Seconds the next attempt must wait after `failures` failures from one source. */
export function delaySeconds(failures: number): number {
  if (failures < FREE_FAILURES) return 0;
  return Math.min(2 ** (failures - FREE_FAILURES), MAX_DELAY_SECONDS);
}

const mac = (id: string, email: string) =>
  createHmac("sha256", env.AUTH_SECRET).update(`device:${id}:${email}`).digest("base64url");

/** A new device cookie value for a browser that just signed in as `email`. */
export function newDeviceCookie(email: string): string {
  const id = randomUUID();
  return `${id}.${mac(id, email)}`;
}

/** The device id of a valid device cookie for this e-mail, else null. */
export function deviceIdOf(cookieValue: string | null | undefined, email: string): string | null {
  const [id, sig] = (cookieValue ?? "").split(".");
  if (!id || !sig) return null;
  const expected = Buffer.from(mac(id, email));
  const given = Buffer.from(sig);
  return expected.length === given.length && timingSafeEqual(expected, given) ? id : null;
}

function cookieFrom(headers: Headers, name: string): string | null {
  for (const part of (headers.get("cookie") ?? "").split(";")) {
    const [key, ...rest] = part.trim().split("=");
    if (key === name) return rest.join("=");
  }
  return null;
}

/** Where an attempt comes from: the signed-in-before browser, else the IP, else "unknown". */
export function signInSource(headers: Headers, email: string, ip: string | null): string {
  const device = deviceIdOf(cookieFrom(headers, DEVICE_COOKIE), email);
  if (device) return `device:${device}`;
  return ip ? `ip:${ip}` : "unknown";
}

type Entry = { failures: number; until: number };
/** Used only while Redis is unreachable, so sign-in keeps working (per process). */
const fallback = new Map<string, Entry>();

const keyOf = (email: string, source: string) =>
  `kw:signin:fail:${createHash("sha256").update(email.trim().toLowerCase()).digest("hex").slice(0, 32)}:${source}`;

async function read(key: string): Promise<Entry> {
  try {
    const raw = await getRedis().hgetall(key);
    return { failures: Number(raw.failures ?? 0), until: Number(raw.until ?? 0) };
  } catch {
    return fallback.get(key) ?? { failures: 0, until: 0 };
  }
}

/** Throws 429 (with Retry-After) while this source must still wait for this account. */
export async function assertSignInAllowed(email: string, source: string): Promise<void> {
  const { until } = await read(keyOf(email, source));
  const wait = Math.ceil((until - Date.now()) / 1000);
  if (wait > 0) {
    throw tooManyRequests(
      `Too many failed sign-ins for this account from this browser or network. Wait ${formatWait(wait)} and try again, or sign in with an e-mail link instead.`,
      wait,
    );
  }
}

export async function recordSignInFailure(email: string, source: string): Promise<void> {
  const key = keyOf(email, source);
  try {
    const redis = getRedis();
    const failures = await redis.hincrby(key, "failures", 1);
    await redis.hset(key, "until", String(Date.now() + delaySeconds(failures) * 1000));
    await redis.expire(key, FORGET_AFTER_SECONDS);
  } catch {
    const entry = fallback.get(key) ?? { failures: 0, until: 0 };
    entry.failures += 1;
    entry.until = Date.now() + delaySeconds(entry.failures) * 1000;
    fallback.set(key, entry);
  }
}

export async function clearSignInFailures(email: string, source: string): Promise<void> {
  const key = keyOf(email, source);
  fallback.delete(key);
  try {
    await getRedis().del(key);
  } catch {
    // Nothing to forget while Redis is down beyond the local entry.
  }
}
