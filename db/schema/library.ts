/**
 * The saved library of an organisation: circuits (OpenQASM source) and
 * observables (Pauli-sum text or a Hermitian matrix). Names are unique per
 * organisation and kind; `tags` is a short list of lower-case labels.
 */
import { sql } from "drizzle-orm";
import {
  datetime,
  index,
  int,
  mediumtext,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { users } from "./auth";
import { jsonText } from "./json-text";
import { organizations } from "./orgs";

export const CIRCUIT_FORMATS = ["qasm2", "qasm3"] as const;
export const OBSERVABLE_FORMATS = ["pauli", "matrix"] as const;

/** Matrix observable entries, row-major; `imag` omitted for a real matrix. */
export type StoredMatrix = { real: number[][]; imag?: number[][] };

const createdAt = () =>
  datetime("created_at", { mode: "date", fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`);
const updatedAt = () =>
  datetime("updated_at", { mode: "date", fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`)
    .$onUpdate(() => new Date());
const org = () =>
  varchar("org_id", { length: 36 })
    .notNull()
    .references(() => organizations.id, { onDelete: "cascade" });
const creator = () =>
  varchar("created_by_user_id", { length: 36 }).references(() => users.id, {
    onDelete: "set null",
  });
const id = () =>
  varchar("id", { length: 36 })
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());

export const circuits = mysqlTable(
  "circuits",
  {
    id: id(),
    orgId: org(),
    createdByUserId: creator(),
    name: varchar("name", { length: 120 }).notNull(),
    description: varchar("description", { length: 2000 }).notNull().default(""),
    tags: jsonText<string[]>("tags").notNull(),
    format: mysqlEnum("format", CIRCUIT_FORMATS).notNull(),
    source: mediumtext("source").notNull(),
    qubits: int("qubits").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("circuits_org_name").on(t.orgId, t.name),
    index("circuits_org_created").on(t.orgId, t.createdAt, t.id),
  ],
);

export const observables = mysqlTable(
  "observables",
  {
    id: id(),
    orgId: org(),
    createdByUserId: creator(),
    name: varchar("name", { length: 120 }).notNull(),
    description: varchar("description", { length: 2000 }).notNull().default(""),
    tags: jsonText<string[]>("tags").notNull(),
    format: mysqlEnum("format", OBSERVABLE_FORMATS).notNull(),
    /** Pauli-sum text (format "pauli"). */
    terms: mediumtext("terms"),
    /** Matrix entries (format "matrix"). */
    matrix: jsonText<StoredMatrix>("matrix"),
    qubits: int("qubits").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("observables_org_name").on(t.orgId, t.name),
    index("observables_org_created").on(t.orgId, t.createdAt, t.id),
  ],
);

export type CircuitRow = typeof circuits.$inferSelect;
export type ObservableRow = typeof observables.$inferSelect;
