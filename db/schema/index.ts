/** All tables, one file per group. New groups are re-exported here so drizzle-kit and the client see them. */
export * from "./auth";
export * from "./orgs";
export * from "./api-keys";
export * from "./audit";
export * from "./runs";
export * from "./library";
export * from "./usage";
export * from "./billing";
export * from "./noise-profiles";
export * from "./webhooks";
export * from "./data-migrations";
