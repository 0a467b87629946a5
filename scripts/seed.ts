/**
 * Seeds the demo organisation and prints how to sign in.
 * Run: node --conditions=react-server --import tsx scripts/seed.ts
 */
import { closeDb } from "@/db";
import { env } from "@/lib/env";
import { DEMO_ORG, DEMO_PASSWORD, DEMO_USERS } from "./seed/demo-data";
import { seedDemo } from "./seed/seed-demo";

async function main(): Promise<void> {
  await seedDemo();
  const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
  console.log(`[ketwise] demo organisation "${DEMO_ORG.name}" is ready. Sign in at ${env.AUTH_URL}/sign-in with:`);
  for (const user of DEMO_USERS) console.log(`           ${user.email.padEnd(width)}  ${user.role.padEnd(6)}  password: ${DEMO_PASSWORD}`);
}

main()
  .catch((error: unknown) => {
    console.error("[ketwise] seeding failed:", error);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
