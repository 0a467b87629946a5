import { defineConfig } from "drizzle-kit";

// Only `drizzle-kit generate` is used (push/pull crash on MariaDB); migrations
// are applied by scripts/migrate.ts. Generation needs no database connection.
export default defineConfig({
  dialect: "mysql",
  schema: "./db/schema/index.ts",
  out: "./drizzle",
  casing: undefined,
});
