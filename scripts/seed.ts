/**
 * Seeds the demo organisation and prints how to sign in.
 * Run: node --conditions=react-server --import tsx scripts/seed.ts
 */
import { closeDb } from "@/db";
import { env } from "@/lib/env";
import { DEMO_API_KEY_FILE, ensureDemoApiKey } from "./seed/demo-api-key";
import { DEMO_ORG, DEMO_PASSWORD, DEMO_USERS } from "./seed/demo-data";
import { seedDemoLibrary } from "./seed/demo-library";
import { seedDemo } from "./seed/seed-demo";

async function main(): Promise<void> {
  const { orgId } = await seedDemo();
  await seedDemoLibrary(orgId);
  const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
  console.log(
    `[ketwise] demo organisation "${DEMO_ORG.name}" is ready. Sign in at ${env.AUTH_URL}/sign-in with:`,
  );
  for (const user of DEMO_USERS)
    console.log(
      `           ${user.email.padEnd(width)}  ${user.role.padEnd(6)}  password: ${DEMO_PASSWORD}`,
    );
  if (env.DEMO_SEED) {
    const { key, created } = await ensureDemoApiKey(orgId);
    console.log(
      `[ketwise] demo API key (role member${created ? ", new" : ""}, also in ${DEMO_API_KEY_FILE}): ${key}`,
    );
  }
}

main()
  .catch((error: unknown) => {
    console.error("[ketwise] seeding failed:", error);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
