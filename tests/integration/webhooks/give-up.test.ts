/**
 * A `webhook.deliver` job whose last attempt failed with an internal error (the
 * database or Redis was down, so no HTTP answer was recorded) marks its delivery
 * failed instead of leaving it pending for ever; earlier attempts, other job names
 * and settled deliveries are left alone.
 */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { failDeliveryAfterRetries } from "@/lib/webhooks/deliveries";
import { createUserWithOrg } from "../../support/factories";

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let endpointId: string;

beforeAll(async () => {
  owner = await createUserWithOrg("hooks-give-up");
  endpointId = randomUUID();
  await db.insert(webhookEndpoints).values({
    id: endpointId,
    orgId: owner.orgId,
    createdByUserId: owner.user.id,
    url: "https://example.com/hooks",
    secretCipher: "not-used-here",
    secretPrefix: "whsec_test",
  });
});

afterAll(async () => {
  await closeDb();
});

async function delivery(status: "pending" | "delivered" = "pending") {
  const id = randomUUID();
  await db.insert(webhookDeliveries).values({
    id,
    orgId: owner.orgId,
    endpointId,
    runId: randomUUID(),
    event: "run.finished",
    body: "{}",
    status,
  });
  return id;
}

const statusOf = async (id: string) =>
  (
    await db
      .select({ status: webhookDeliveries.status, lastError: webhookDeliveries.lastError })
      .from(webhookDeliveries)
      .where(and(eq(webhookDeliveries.orgId, owner.orgId), eq(webhookDeliveries.id, id)))
  )[0];

const job = (deliveryId: string, attemptsMade: number, name = "webhook.deliver") => ({
  name,
  data: { orgId: owner.orgId, deliveryId },
  attemptsMade,
  opts: { attempts: 3 },
});

describe("failDeliveryAfterRetries", () => {
  it("fails a pending delivery after the last attempt only", async () => {
    const id = await delivery();
    expect(await failDeliveryAfterRetries(job(id, 2))).toBe(false);
    expect((await statusOf(id)).status).toBe("pending");
    expect(await failDeliveryAfterRetries(job(id, 3, "run.execute"))).toBe(false);
    expect(await failDeliveryAfterRetries(job(id, 3))).toBe(true);
    const row = await statusOf(id);
    expect(row.status).toBe("failed");
    expect(row.lastError).toMatch(/internal error/);
  });

  it("leaves a settled delivery and another organisation's id alone", async () => {
    const done = await delivery("delivered");
    expect(await failDeliveryAfterRetries(job(done, 3))).toBe(false);
    expect((await statusOf(done)).status).toBe("delivered");
    const pending = await delivery();
    const foreign = { ...job(pending, 3), data: { orgId: randomUUID(), deliveryId: pending } };
    expect(await failDeliveryAfterRetries(foreign)).toBe(false);
    expect((await statusOf(pending)).status).toBe("pending");
  });
});
