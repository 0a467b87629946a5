/**
 * Global setup of the integration project: applies the migrations and the data
 * migrations to the test database (a no-op when `npm test` already did), so single
 * files can run alone.
 */
import "./test-env";
import { migrate } from "drizzle-orm/mysql2/migrator";

export default async function setup(): Promise<void> {
  const { db, closeDb } = await import("@/db");
  await migrate(db, { migrationsFolder: "drizzle" });
  const { applyDataMigrations } = await import("@/lib/maintenance/mutations");
  await applyDataMigrations(db);
  await closeDb();
}
