/**
 * Run-finished webhooks end to end: admins register endpoints (secret shown once,
 * audited), a real worker process fans a finished run out to every enabled endpoint of
 * the run's organisation and POSTs signed deliveries to a loopback receiver (permitted
 * by WEBHOOK_ALLOWED_NETWORKS, as the tests must), retries with backoff until a 2xx,
 * records every attempt, gives up after WEBHOOK_MAX_ATTEMPTS, never follows a redirect,
 * and refuses private and metadata addresses at registration.
 *
 * Signature check: HMAC-SHA256 over "<timestamp>.<body>" (RFC 2104 / FIPS 180-4), also
 * recomputed here with node:crypto directly.
 */
import { createHmac } from "node:crypto";
import { createServer, type IncomingHttpHeaders, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { auditEvents, webhookAttempts, webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { runOperation } from "@/lib/api/operation";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { closeRunWaiters } from "@/lib/runs/run-waiter";
import { fanOutRunFinished } from "@/lib/webhooks/deliveries";
import {
  createWebhookOp,
  deleteWebhookOp,
  setWebhookEnabledOp,
  type CreatedWebhook,
} from "@/lib/webhooks/operations";
import { verifyWebhook } from "@/lib/webhooks/signature";
import {
  addMember,
  createTestApiKey,
  createTestUser,
  createUserWithOrg,
} from "../../support/factories";
import { api } from "../runs/support/api";
import { bellRequest } from "../runs/support/requests";
import { startWorker, type WorkerProcess } from "../runs/support/worker-process";

// Before lib/env is first read (it caches): the loopback receiver is allowed, retries are quick.
process.env.WEBHOOK_ALLOWED_NETWORKS = "127.0.0.0/8";
const FAST = {
  WEBHOOK_ALLOWED_NETWORKS: "127.0.0.0/8",
  WEBHOOK_RETRY_BASE_MS: "100",
  WEBHOOK_MAX_ATTEMPTS: "3",
};

type Received = { path: string; headers: IncomingHttpHeaders; body: string };
const received: Received[] = [];
let server: Server;
let base: string;
let worker: WorkerProcess;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let other: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;
let memberId: string;
let okAfterOne: CreatedWebhook;
let alwaysFails: CreatedWebhook;
let redirects: CreatedWebhook;

beforeAll(async () => {
  let flaky = 0;
  server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      received.push({
        path: req.url ?? "",
        headers: req.headers,
        body: Buffer.concat(chunks).toString("utf8"),
      });
      if (req.url === "/ok-after-one") {
        res.statusCode = flaky++ === 0 ? 500 : 204;
      } else if (req.url === "/redirect") {
        res.statusCode = 302;
        res.setHeader("location", "/ok-after-one");
      } else res.statusCode = 503;
      res.end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  [worker, owner, other] = await Promise.all([
    startWorker({ concurrency: 2, env: FAST }),
    createUserWithOrg("hooks"),
    createUserWithOrg("hooks-other"),
  ]);
  key = (await createTestApiKey(owner.orgId, "member", owner.user.id)).key;
  const member = await createTestUser("hooks-member");
  await addMember(owner.orgId, member.id, "member");
  memberId = member.id;
});

afterAll(async () => {
  await worker?.stop();
  await new Promise((r) => server?.close(r));
  await closeRunWaiters();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

async function create(orgId: string, userId: string, url: string) {
  return runOperation(createWebhookOp, userId, orgId, { url });
}

/** Waits for a database condition the worker brings about (bounded; no fixed sleeps). */
async function eventually<T>(
  read: () => Promise<T>,
  done: (value: T) => boolean,
  timeoutMs = 30_000,
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (Date.now() > deadline) throw new Error(`condition not reached: ${JSON.stringify(value)}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const deliveriesOf = (endpointId: string) =>
  db
    .select()
    .from(webhookDeliveries)
    .where(
      and(eq(webhookDeliveries.orgId, owner.orgId), eq(webhookDeliveries.endpointId, endpointId)),
    );

describe("registering endpoints", () => {
  it("an admin adds an endpoint and sees its secret once; it is stored encrypted and audited", async () => {
    const state = await create(owner.orgId, owner.user.id, `${base}/ok-after-one`);
    expect(state.status, JSON.stringify(state)).toBe("success");
    okAfterOne = (state as { data: CreatedWebhook }).data;
    expect(okAfterOne.secret).toMatch(/^whsec_[A-Za-z0-9_-]{43}$/);
    const [row] = await db
      .select()
      .from(webhookEndpoints)
      .where(eq(webhookEndpoints.id, okAfterOne.id));
    expect(row.secretCipher).not.toContain(okAfterOne.secret.slice(6));
    expect(row.secretPrefix).toBe(okAfterOne.secret.slice(0, 12));
    const audit = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.orgId, owner.orgId), eq(auditEvents.targetId, okAfterOne.id)));
    expect(audit.map((a) => a.action)).toEqual(["webhook.created"]);
    expect(JSON.stringify(audit[0].metadata)).not.toContain("whsec_");

    alwaysFails = (
      (await create(owner.orgId, owner.user.id, `${base}/always-fails`)) as { data: CreatedWebhook }
    ).data;
    redirects = (
      (await create(owner.orgId, owner.user.id, `${base}/redirect`)) as { data: CreatedWebhook }
    ).data;
  });

  it("refuses members, private, link-local/metadata and non-http URLs with a field message", async () => {
    const member = await create(owner.orgId, memberId, `${base}/x`);
    expect(member.status === "error" && member.code).toBe(403);
    for (const url of [
      "http://169.254.169.254/latest/meta-data",
      "https://10.1.2.3/hook",
      "https://[::1]/hook",
      "https://[::ffff:192.168.1.1]/hook",
      "https://100.100.100.200/",
      "ftp://example.com/x",
    ]) {
      const state = await create(owner.orgId, owner.user.id, url);
      expect(state.status, url).toBe("error");
      if (state.status !== "error") continue;
      expect(state.code, url).toBe(422);
      expect(state.fieldErrors?.url?.[0], url).toMatch(/Not allowed|full http\(s\) URL/);
    }
  });
});

describe("deliveries", () => {
  it("POSTs a signed run.finished event, retries after a 500 with the same id and body, and records each attempt", async () => {
    const submitted = await api("POST", "/api/v1/runs", {
      key,
      body: { name: "hooked", ...bellRequest() },
    });
    expect(submitted.status).toBe(202);
    const runId = submitted.body.id as string;

    const [delivery] = await eventually(
      () => deliveriesOf(okAfterOne.id),
      (rows) => rows[0]?.status === "delivered",
    ).catch((e: unknown) => {
      console.log(worker.output());
      throw e;
    });
    expect(delivery).toMatchObject({
      runId,
      event: "run.finished",
      attempts: 2,
      lastResponseStatus: 204,
    });
    const attempts = await db
      .select()
      .from(webhookAttempts)
      .where(eq(webhookAttempts.deliveryId, delivery.id))
      .orderBy(webhookAttempts.attempt);
    expect(attempts.map((a) => [a.attempt, a.responseStatus])).toEqual([
      [1, 500],
      [2, 204],
    ]);

    const posts = received.filter((r) => r.path === "/ok-after-one");
    expect(posts).toHaveLength(2);
    for (const post of posts) {
      expect(post.headers["content-type"]).toBe("application/json");
      expect(post.headers["ketwise-webhook-id"]).toBe(delivery.id);
      expect(post.body).toBe(delivery.body);
      const timestamp = post.headers["ketwise-webhook-timestamp"] as string;
      const signature = post.headers["ketwise-webhook-signature"] as string;
      expect(verifyWebhook(okAfterOne.secret, { timestamp, signature }, post.body)).toBe(true);
      expect(signature).toBe(
        `v1=${createHmac("sha256", okAfterOne.secret).update(`${timestamp}.${post.body}`).digest("hex")}`,
      );
      expect(verifyWebhook(alwaysFails.secret, { timestamp, signature }, post.body)).toBe(false);
      expect(
        verifyWebhook(
          okAfterOne.secret,
          { timestamp, signature },
          post.body.replace("hooked", "hacked"),
        ),
      ).toBe(false);
    }
    const event = JSON.parse(posts[0].body);
    expect(event).toMatchObject({
      id: delivery.id,
      type: "run.finished",
      data: { run: { id: runId, name: "hooked", status: "succeeded" } },
    });
    // √2(ZZ + XX) on the Bell state: 2√2 (Tsirelson's bound; Cirel'son 1980).
    expect(event.data.run.summary.exact).toBeCloseTo(2 * Math.SQRT2, 12);

    // The endpoint that always answers 503 is failed after WEBHOOK_MAX_ATTEMPTS (3) attempts.
    const [failed] = await eventually(
      () => deliveriesOf(alwaysFails.id),
      (rows) => rows[0]?.status === "failed",
    );
    expect(failed).toMatchObject({ attempts: 3, lastResponseStatus: 503 });
    expect(
      await db.select().from(webhookAttempts).where(eq(webhookAttempts.deliveryId, failed.id)),
    ).toHaveLength(3);

    // A redirect is an unsuccessful attempt, never followed.
    const [redirected] = await eventually(
      () => deliveriesOf(redirects.id),
      (rows) => rows[0]?.status === "failed",
    );
    expect(redirected.lastResponseStatus).toBe(302);
    expect(redirected.lastError).toMatch(/redirect .*not followed/);
    expect(received.filter((r) => r.path === "/redirect")).toHaveLength(3);
    expect(received.filter((r) => r.path === "/ok-after-one")).toHaveLength(2);
  });

  it("fans out only to the run's own organisation and only to enabled endpoints", async () => {
    const foreign = await createTestApiKey(other.orgId, "member", other.user.id);
    const theirs = await api("POST", "/api/v1/runs", {
      key: foreign.key,
      body: bellRequest({ shots: 0 }),
    });
    expect(
      await fanOutRunFinished({ orgId: other.orgId, runId: theirs.body.id, status: "succeeded" }),
    ).toBe(0);

    const disabled = await runOperation(setWebhookEnabledOp, owner.user.id, owner.orgId, {
      endpointId: alwaysFails.id,
      enabled: "false",
    });
    expect(disabled.status).toBe("success");
    await runOperation(deleteWebhookOp, owner.user.id, owner.orgId, { endpointId: redirects.id });
    const ours = await api("POST", "/api/v1/runs", { key, body: bellRequest({ shots: 0 }) });
    expect(
      await fanOutRunFinished({ orgId: owner.orgId, runId: ours.body.id, status: "succeeded" }),
    ).toBe(1);
    expect(
      await db.select().from(webhookEndpoints).where(eq(webhookEndpoints.id, redirects.id)),
    ).toHaveLength(0);
    expect(
      await db
        .select()
        .from(webhookDeliveries)
        .where(eq(webhookDeliveries.endpointId, redirects.id)),
    ).toHaveLength(0);

    const audit = await db
      .select({ action: auditEvents.action })
      .from(auditEvents)
      .where(eq(auditEvents.orgId, owner.orgId));
    expect(audit.map((a) => a.action)).toEqual(
      expect.arrayContaining(["webhook.created", "webhook.disabled", "webhook.deleted"]),
    );
    // Another organisation's admin cannot touch this organisation's endpoint: 404.
    const foreignTry = await runOperation(deleteWebhookOp, other.user.id, other.orgId, {
      endpointId: okAfterOne.id,
    });
    expect(foreignTry.status === "error" && foreignTry.code).toBe(404);
  });
});
