/**
 * Applies the generated SQL migrations in drizzle/ to DATABASE_URL with the
 * programmatic Drizzle migrator (already-applied ones are skipped), then the data
 * migrations not yet recorded in `data_migrations` (lib/maintenance/mutations.ts).
 * Run: node --conditions=react-server --import tsx scripts/migrate.ts
 */
import { migrate } from "drizzle-orm/mysql2/migrator";
import { closeDb, db } from "@/db";
import { applyDataMigrations } from "@/lib/maintenance/mutations";

async function main(): Promise<void> {
  const started = Date.now();
  await migrate(db, { migrationsFolder: "drizzle" });
  const applied = await applyDataMigrations();
  for (const name of applied) console.log(`[ketwise] data migration applied: ${name}`);
  console.log(`[ketwise] migrations applied in ${Date.now() - started} ms`);
}

main()
  .catch((error: unknown) => {
    console.error("[ketwise] migration failed:", error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
