/**
 * Setup file for integration and e2e tests: loads .env.local and points the
 * app at the test database (`<name>_test`) and Redis database 1, so a direct
 * `npx vitest run --project integration` can never touch development data.
 */
import { existsSync } from "node:fs";

if (existsSync(".env.local")) process.loadEnvFile(".env.local");

const url = process.env.DATABASE_URL;
if (!url)
  throw new Error(
    "DATABASE_URL is not set: run `npm test` (it creates .env.local and the services).",
  );
const match = /^(mysql:\/\/[^/]+\/)([A-Za-z0-9_]+)(.*)$/.exec(url);
if (!match) throw new Error(`DATABASE_URL is malformed: ${url.replace(/:[^:@/]*@/, ":***@")}`);
const [, base, name, rest] = match;
process.env.DATABASE_URL = `${base}${name.endsWith("_test") ? name : `${name}_test`}${rest}`;

// KETWISE_TEST_REDIS_DB lets a second checkout run its tests beside this one (default 1).
const redisPort = process.env.REDIS_PORT ?? "6380";
const redisDb = process.env.KETWISE_TEST_REDIS_DB ?? "1";
process.env.REDIS_URL = `redis://127.0.0.1:${redisPort}/${redisDb}`;
