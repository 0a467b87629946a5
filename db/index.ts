/**
 * The Drizzle client over a mysql2 pool. Only data-access modules
 * (`lib/<area>/queries.ts`, `mutations.ts`) and scripts import it.
 * `mode: "planetscale"` makes relational queries avoid LATERAL joins, which
 * MariaDB lacks; `timezone: "Z"` keeps DATETIMEs in UTC both ways.
 */
import { drizzle, type MySql2Database } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Db = MySql2Database<typeof schema>;
/** The client handed to a `db.transaction` callback. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either: for data-access functions that run alone or inside a caller's transaction. */
export type Executor = Db | Tx;

type Holder = { pool?: mysql.Pool; db?: Db };
// One pool per process, also across Next dev hot reloads.
const holder = ((globalThis as { __ketwiseDb?: Holder }).__ketwiseDb ??= {});

/** The connected client itself (for libraries that check its class, like the Auth.js adapter). */
export function getDb(): Db {
  holder.pool ??= mysql.createPool({
    uri: env.DATABASE_URL,
    timezone: "Z",
    connectionLimit: 10,
    dateStrings: false,
    supportBigNumbers: true,
  });
  holder.db ??= drizzle({ client: holder.pool, schema, mode: "planetscale" });
  return holder.db;
}

/** Lazily connected database; importing this module opens nothing. */
export const db: Db = new Proxy({} as Db, {
  get: (_t, key) => Reflect.get(getDb(), key),
});

/** Closes the pool (scripts and tests call this so the process can exit). */
export async function closeDb(): Promise<void> {
  const pool = holder.pool;
  holder.pool = undefined;
  holder.db = undefined;
  await pool?.end();
}

export { schema };
