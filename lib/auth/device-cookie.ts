/** Marks this browser as one that signed in as an account (server actions only); see ./sign-in-throttle.ts. */
import "server-only";
import { cookies } from "next/headers";
import { env } from "@/lib/env";
import { DEVICE_COOKIE, newDeviceCookie } from "./sign-in-throttle";

export async function setDeviceCookie(email: string): Promise<void> {
  (await cookies()).set(DEVICE_COOKIE, newDeviceCookie(email.trim().toLowerCase()), {
    httpOnly: true,
    sameSite: "lax",
    secure: env.AUTH_URL.startsWith("https://"),
    path: "/",
    maxAge: 365 * 24 * 60 * 60,
  });
}
