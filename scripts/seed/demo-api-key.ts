/**
 * The demo organisation's API key, so the README's curl example works right
 * after `npm start`: role member, created by the demo member, stored hashed
 * like any key; the key itself is printed and kept in `.data/demo-api-key`
 * (git-ignored, mode 600). Re-seeding reuses it while it is still active.
 * Local set-up only — the seed runs only with DEMO_SEED on.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createKey } from "@/lib/api-keys/mutations";
import { findUserByEmail } from "@/lib/auth/queries";
import { hashApiKey, looksLikeApiKey } from "@/lib/orgs/api-key-format";
import { findActiveApiKeyByHash, getMembership } from "@/lib/orgs/queries";
import { DEMO_USERS } from "./demo-data";

export const DEMO_API_KEY_FILE = ".data/demo-api-key";

export async function ensureDemoApiKey(orgId: string): Promise<{ key: string; created: boolean }> {
  if (existsSync(DEMO_API_KEY_FILE)) {
    const key = readFileSync(DEMO_API_KEY_FILE, "utf8").trim();
    const found = looksLikeApiKey(key) ? await findActiveApiKeyByHash(hashApiKey(key)) : null;
    if (found?.org.id === orgId) return { key, created: false };
  }
  const member = DEMO_USERS.find((u) => u.role === "member");
  const user = member ? await findUserByEmail(member.email) : null;
  if (!user)
    throw new Error(`the demo member ${member?.email} is missing; seed the demo users first`);
  // Scripts run under plain Node: read the membership directly (the page/action guards need a request).
  const membership = await getMembership(orgId, user.id);
  if (!membership) throw new Error(`${user.id} is not a member of organisation ${orgId}`);
  const access = { userId: user.id, ...membership };
  const { key } = await createKey(access, {
    name: "Demo key (README example)",
    role: "member",
    scope: "personal",
  });
  mkdirSync(".data", { recursive: true });
  writeFileSync(DEMO_API_KEY_FILE, `${key}\n`, { mode: 0o600 });
  return { key, created: true };
}
