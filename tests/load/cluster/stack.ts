/**
 * The parts of Ketwise placed on the test hosts: MariaDB and Redis (append-only
 * file on) on the data host, `next start` on the app host, worker processes on
 * the worker hosts. Data lives under .data/cluster (fresh for every check).
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import type { Host } from "./netns";
import { startIn, stop, waitFor, type Proc } from "./processes";

export const ROOT = process.cwd();
const DATA = join(ROOT, ".data/cluster");
const MY_CNF = join(DATA, "my.cnf");
const SOCKET = "/tmp/kwc-mariadb.sock";
export const DB_NAME = "ketwise_cluster";
export const DB_PORT = 3306;
export const REDIS_PORT = 6379;
export const APP_PORT = 3000;
export const WORKER_METRICS_PORT = 9464;

export type StackConfig = {
  data: Host;
  app: Host;
  password: string;
  metricsToken: string;
  authSecret: string;
  distDir: string;
};

export function databaseUrl(c: StackConfig): string {
  return `mysql://kwc:${c.password}@${c.data.ip}:${DB_PORT}/${DB_NAME}`;
}
export function redisUrl(c: StackConfig): string {
  return `redis://${c.data.ip}:${REDIS_PORT}/0`;
}
export function appUrl(c: StackConfig): string {
  return `http://${c.app.ip}:${APP_PORT}`;
}

/** Environment every Ketwise process of the cluster shares. */
export function appEnv(c: StackConfig): Record<string, string> {
  return {
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    NEXT_DIST_DIR: c.distDir,
    DATABASE_URL: databaseUrl(c),
    REDIS_URL: redisUrl(c),
    AUTH_SECRET: c.authSecret,
    AUTH_URL: appUrl(c),
    APP_URL: appUrl(c),
    AUTH_TRUST_HOST: "true",
    METRICS_TOKEN: c.metricsToken,
    DEMO_SEED: "off",
    // A load test would otherwise be refused by the per-person limits.
    API_RATE_LIMIT_PER_MINUTE: "100000000",
    RUN_SUBMIT_LIMIT_PER_MINUTE: "100000000",
    RUNS_MAX_UNFINISHED: "100000000",
    // Orphans (a crash between insert and enqueue) are found within seconds, not minutes.
    RUN_SWEEP_SECONDS: "2",
    RUN_QUEUED_GRACE_SECONDS: "5",
    LOG_LEVEL: "info",
  };
}

function mariadbRoot(sql: string): void {
  execFileSync("mariadb", [`--defaults-file=${MY_CNF}`, "-u", "root", "-e", sql], {
    stdio: ["ignore", "ignore", "pipe"],
  });
}

export function prepareData(c: StackConfig): void {
  rmSync(DATA, { recursive: true, force: true });
  mkdirSync(join(DATA, "mariadb"), { recursive: true });
  mkdirSync(join(DATA, "redis"), { recursive: true });
  writeFileSync(
    MY_CNF,
    [
      "[client-server]",
      `socket=${SOCKET}`,
      `port=${DB_PORT}`,
      "[mariadbd]",
      "user=root",
      `datadir=${join(DATA, "mariadb")}`,
      `pid-file=${join(DATA, "mariadb.pid")}`,
      `log-error=${join(DATA, "mariadb.err")}`,
      `bind-address=${c.data.ip}`,
      "skip-name-resolve",
      "skip-log-bin",
      "innodb_buffer_pool_size=64M",
      "",
    ].join("\n"),
  );
  execFileSync(
    "mariadb-install-db",
    [
      `--defaults-file=${MY_CNF}`,
      "--user=root",
      "--auth-root-authentication-method=socket",
      "--skip-test-db",
    ],
    {
      stdio: ["ignore", "ignore", "pipe"],
    },
  );
}

export async function startMariadb(c: StackConfig): Promise<Proc> {
  const proc = startIn(c.data, "mariadb", ["mariadbd", `--defaults-file=${MY_CNF}`]);
  await waitFor(
    "MariaDB start",
    () => {
      try {
        execFileSync("mariadb-admin", [`--defaults-file=${MY_CNF}`, "--silent", "ping"], {
          stdio: "ignore",
        });
        return true;
      } catch {
        return false;
      }
    },
    30_000,
    proc,
  );
  return proc;
}

export function createDatabase(c: StackConfig): void {
  mariadbRoot(
    `CREATE DATABASE IF NOT EXISTS ${DB_NAME} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;` +
      `CREATE USER IF NOT EXISTS 'kwc'@'${c.data.ip.replace(/\.\d+$/, ".%")}' IDENTIFIED BY '${c.password}';` +
      `GRANT ALL PRIVILEGES ON ${DB_NAME}.* TO 'kwc'@'${c.data.ip.replace(/\.\d+$/, ".%")}';`,
  );
}

/** Stops MariaDB cleanly (mariadb-admin shutdown), as an operator's restart would. */
export async function stopMariadb(proc: Proc): Promise<void> {
  try {
    execFileSync("mariadb-admin", [`--defaults-file=${MY_CNF}`, "shutdown"], { stdio: "ignore" });
  } catch {
    proc.signal("SIGTERM");
  }
  await proc.exited();
}

export async function startRedis(c: StackConfig): Promise<Proc> {
  const proc = startIn(c.data, "redis", [
    "redis-server",
    "--bind",
    c.data.ip,
    "--port",
    String(REDIS_PORT),
    "--dir",
    join(DATA, "redis"),
    "--appendonly",
    "yes",
    "--save",
    "",
    "--maxmemory-policy",
    "noeviction",
    // Bound to the data host's own address on the test bridge only; protected mode would refuse the other hosts.
    "--protected-mode",
    "no",
  ]);
  await waitFor(
    "Redis start",
    () => proc.output().includes("Ready to accept connections"),
    15_000,
    proc,
  );
  return proc;
}

/** SHUTDOWN flushes the append-only file, then the server exits. */
export async function stopRedis(proc: Proc): Promise<void> {
  proc.signal("SIGTERM");
  await proc.exited();
}

export async function startApp(c: StackConfig): Promise<Proc> {
  const proc = startIn(
    c.app,
    "app",
    [
      process.execPath,
      join(ROOT, "node_modules/next/dist/bin/next"),
      "start",
      "-H",
      c.app.ip,
      "-p",
      String(APP_PORT),
    ],
    { ...appEnv(c), PORT: String(APP_PORT) },
  );
  await waitFor(
    "app start",
    async () => {
      const res = await fetch(`${appUrl(c)}/api/ready`, {
        signal: AbortSignal.timeout(2_000),
      }).catch(() => null);
      return res?.status === 200;
    },
    60_000,
    proc,
  );
  return proc;
}

export async function startWorkerOn(c: StackConfig, h: Host, concurrency: number): Promise<Proc> {
  const proc = startIn(
    h,
    `worker ${h.name}`,
    [
      process.execPath,
      "--conditions=react-server",
      "--import",
      "tsx",
      join(ROOT, "worker/index.ts"),
    ],
    {
      ...appEnv(c),
      WORKER_CONCURRENCY: String(concurrency),
      WORKER_METRICS_PORT: String(WORKER_METRICS_PORT),
      WORKER_METRICS_HOST: h.ip,
    },
  );
  await waitFor(`worker ${h.name} start`, () => proc.output().includes("ready:"), 90_000, proc);
  return proc;
}

export { stop };
