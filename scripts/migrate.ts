/**
 * Applies the generated SQL migrations in drizzle/ to DATABASE_URL with the
 * programmatic Drizzle migrator (already-applied ones are skipped).
 * Run: node --conditions=react-server --import tsx scripts/migrate.ts
 */
import { migrate } from "drizzle-orm/mysql2/migrator";
import { closeDb, db } from "@/db";

async function main(): Promise<void> {
  const started = Date.now();
  await migrate(db, { migrationsFolder: "drizzle" });
  console.log(`[ketwise] migrations applied in ${Date.now() - started} ms`);
}

main()
  .catch((error: unknown) => {
    console.error("[ketwise] migration failed:", error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
