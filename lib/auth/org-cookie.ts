/** Sets and clears the "current organisation" cookie (server actions only). */
import "server-only";
import { cookies } from "next/headers";
import { env } from "@/lib/env";
import { ORG_COOKIE } from "./guards";

export async function setCurrentOrgCookie(orgId: string): Promise<void> {
  (await cookies()).set(ORG_COOKIE, orgId, {
    httpOnly: true,
    sameSite: "lax",
    secure: env.AUTH_URL.startsWith("https://"),
    path: "/",
    maxAge: 365 * 24 * 60 * 60,
  });
}

export async function clearCurrentOrgCookie(): Promise<void> {
  (await cookies()).delete(ORG_COOKIE);
}
