/**
 * A JSON column that round-trips on MariaDB. MariaDB's `JSON` is LONGTEXT with
 * a `json_valid` check, so the driver hands back a string; this column parses
 * it (Drizzle's built-in `json()` only serialises on the way in).
 */
import { customType } from "drizzle-orm/mysql-core";

export function jsonText<T>(name: string) {
  return customType<{ data: T; driverData: string }>({
    dataType: () => "json",
    toDriver: (value) => JSON.stringify(value),
    fromDriver: (value) => (typeof value === "string" ? (JSON.parse(value) as T) : (value as T)),
  })(name);
}
