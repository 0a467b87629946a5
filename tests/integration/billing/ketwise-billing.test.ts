/**
 * Ketwise's billing end to end through the real SDK against the payment fake:
 * checkout on the hosted page → signed webhook → plan upgraded; duplicate and
 * forged deliveries; seats with a prorated invoice; a renewal carrying the
 * reported overage; a failed renewal → past due and the admins e-mailed; and
 * the provider down → a clear error with nothing changed.
 * Expected amounts are worked out here from the plan table and the provider's
 * documented rules: proration charges the unused fraction f = (e − t)/(e − s)
 * of the period for the new quantity and credits it for the old one; metered
 * package pricing rounds up to whole packages; line amounts round to cents.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import {
  auditEvents,
  billingEvents,
  organizations,
  overageReports,
  runs,
  usageEvents,
} from "@/db/schema";
import { ensureCatalog } from "@/lib/billing/catalog";
import { changeSeatsOp, startCheckoutOp } from "@/lib/billing/operations";
import { reportOverage } from "@/lib/billing/overage";
import { getPlan, overageCents } from "@/lib/billing/plans";
import { getStripe } from "@/lib/billing/stripe-client";
import { runOperation } from "@/lib/api/operation";
import { closeRedis } from "@/lib/rate-limit/redis";
import { recordRunUsage } from "@/lib/usage/mutations";
import { addMember, createTestUser, createUserWithOrg } from "../../support/factories";
import { waitForMail } from "../../support/maildev";
import {
  payOnHostedPage,
  startBillingHarness,
  TEST_WEBHOOK_SECRET,
  type BillingHarness,
} from "./ketwise-support";

let h: BillingHarness;
/** maildev stamps messages to the whole second; compare from the start of this second. */
const wholeSecond = () => new Date(Math.floor(Date.now() / 1000) * 1000);

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let admin: Awaited<ReturnType<typeof createTestUser>>;
const lab = getPlan("lab");

const org = async () =>
  (await db.select().from(organizations).where(eq(organizations.id, owner.orgId)))[0];
const audits = async (action: string) =>
  db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.orgId, owner.orgId), eq(auditEvents.action, action)));

beforeAll(async () => {
  h = await startBillingHarness();
  owner = await createUserWithOrg("billing-owner");
  admin = await createTestUser("billing-admin");
  await addMember(owner.orgId, admin.id, "admin");
});

afterAll(async () => {
  await h?.close();
  await closeRedis();
  await closeDb();
});

describe("checkout → webhook → plan", () => {
  it("a declined card changes nothing; a good card moves the organisation to Lab through the webhook", async () => {
    const started = await runOperation(startCheckoutOp, owner.user.id, owner.orgId, {
      plan: "lab",
      seats: "3",
    });
    expect(started.status).toBe("success");
    const url = (started as { data: { url: string } }).data.url;
    expect(url).toMatch(/\/pay\/cs_test_/);
    expect((await org()).plan).toBe("sandbox");

    const declined = await payOnHostedPage(url, "4000 0000 0000 0002");
    expect(declined.status).toBe(402);
    await h.flush();
    expect(await org()).toMatchObject({ plan: "sandbox", stripeSubscriptionId: null });

    const since = wholeSecond();
    const paid = await payOnHostedPage(url);
    expect(paid.status).toBe(303);
    expect(paid.location).toMatch(/\/app\/billing\?checkout=success&session_id=cs_test_/);
    await h.flush();
    const after = await org();
    expect(after).toMatchObject({ plan: "lab", seats: 3, subscriptionStatus: "active" });
    expect(after.stripeSubscriptionId).toMatch(/^sub_/);
    const completed = h.deliveries.find((d) => d.body.type === "checkout.session.completed");
    expect(completed?.status).toBe(200);
    const planChanges = await audits("billing.plan_changed");
    expect(planChanges).toHaveLength(1);
    expect(planChanges[0].actorUserId).toBeNull();
    // The first invoice (3 seats of Lab) is announced to the owner and the admin.
    const mail = await waitForMail(admin.email, since);
    expect(mail.subject).toContain(`$${((3 * lab.seatPriceCents) / 100).toFixed(2)}`);
  });

  it("a replayed delivery is a no-op, also when the provider redelivers it", async () => {
    const delivery = h.deliveries.find((d) => d.body.type === "checkout.session.completed")!;
    const before = (await db.select().from(auditEvents).where(eq(auditEvents.orgId, owner.orgId)))
      .length;
    const again = await h.post(delivery.raw, delivery.signature);
    expect(again).toMatchObject({ status: 200, body: { result: "duplicate" } });
    const id = (JSON.parse(delivery.raw) as { id: string }).id;
    const count = h.deliveries.length;
    await h.admin("/_fake/webhooks/redeliver", { event: id });
    await h.flush();
    expect(h.deliveries.slice(count).map((d) => d.body.result)).toEqual(["duplicate"]);
    expect(
      (await db.select().from(auditEvents).where(eq(auditEvents.orgId, owner.orgId))).length,
    ).toBe(before);
    expect(await db.select().from(billingEvents).where(eq(billingEvents.id, id))).toHaveLength(1);
  });

  it("rejects a forged body, a wrong secret, a stale timestamp and a missing signature with 400", async () => {
    const delivery = h.deliveries.find((d) => d.body.type === "checkout.session.completed")!;
    const forged = delivery.raw.replace('"lab"', '"institute"');
    expect(forged).not.toBe(delivery.raw);
    expect((await h.post(forged, delivery.signature)).status).toBe(400);
    const fresh = JSON.stringify({ ...JSON.parse(delivery.raw), id: "evt_forged_1" });
    const stripe = getStripe();
    const wrongSecret = stripe.webhooks.generateTestHeaderString({
      payload: fresh,
      secret: "whsec_someone_else",
    });
    expect((await h.post(fresh, wrongSecret)).status).toBe(400);
    // Five minutes is the provider's documented default tolerance; ten minutes old is a replay.
    const stale = stripe.webhooks.generateTestHeaderString({
      payload: fresh,
      secret: TEST_WEBHOOK_SECRET,
      timestamp: Math.floor(Date.now() / 1000) - 600,
    });
    const staleAnswer = await h.post(fresh, stale);
    expect(staleAnswer.status).toBe(400);
    expect(String(staleAnswer.body.detail)).toMatch(/tolerance/i);
    expect((await h.post(fresh, null)).status).toBe(400);
    expect(
      await db.select().from(billingEvents).where(eq(billingEvents.id, "evt_forged_1")),
    ).toHaveLength(0);
  });
});

describe("seats", () => {
  it("adding seats charges a prorated invoice at once and updates the organisation", async () => {
    const auditsBefore = (await audits("billing.seats_changed")).length;
    const result = await runOperation(changeSeatsOp, admin.id, owner.orgId, { seats: "5" });
    expect(result).toMatchObject({ status: "success" });
    expect((await org()).seats).toBe(5);
    const sub = await getStripe().subscriptions.retrieve((await org()).stripeSubscriptionId!);
    const invoice = await getStripe().invoices.retrieve(sub.latest_invoice as string);
    expect(invoice.billing_reason).toBe("subscription_update");
    expect(invoice.status).toBe("paid");
    const item = sub.items.data.find((i) => i.quantity === 5)!;
    const [s, e] = [item.current_period_start, item.current_period_end];
    const t = invoice.lines.data[0].period.start;
    const f = (e - t) / (e - s);
    const expected =
      Math.round(5 * lab.seatPriceCents * f) - Math.round(3 * lab.seatPriceCents * f);
    expect(invoice.total).toBe(expected);
    expect(invoice.lines.data.map((l) => l.amount).sort((a, b) => a - b)).toEqual([
      -Math.round(3 * lab.seatPriceCents * f),
      Math.round(5 * lab.seatPriceCents * f),
    ]);
    const seatAudit = (await audits("billing.seats_changed")).slice(auditsBefore);
    expect(seatAudit.map((a) => a.actorUserId)).toEqual([admin.id]);
    await h.flush(); // the subscription.updated webhook finds nothing left to change
    expect(await audits("billing.seats_changed")).toHaveLength(auditsBefore + 1);
  });

  it("refuses fewer seats than people in the organisation", async () => {
    const result = await runOperation(changeSeatsOp, owner.user.id, owner.orgId, { seats: "1" });
    expect(result).toMatchObject({ status: "error", code: 409 });
    expect((await org()).seats).toBe(5);
  });
});

describe("overage and renewal", () => {
  const period = "2025-01";
  const used = {
    shots: lab.limits.monthlyShots + 12_345,
    simulationSeconds: lab.limits.monthlySimulationSeconds + 100.4,
  };

  it("reports the period's overage once, and the renewal invoice bills it", async () => {
    const runId = crypto.randomUUID();
    await db.insert(runs).values({
      id: runId,
      orgId: owner.orgId,
      name: "overage fixture",
      request: {},
      method: "statevector",
      qubits: 2,
      seed: 1,
      status: "succeeded",
      requestHash: "0".repeat(64),
    });
    // Through the runs pipeline's own writer, so events and monthly totals agree.
    await db.transaction((tx) =>
      recordRunUsage(tx, owner.orgId, runId, period, {
        shots: used.shots,
        simulationSeconds: used.simulationSeconds,
      }),
    );
    const first = await reportOverage(owner.orgId, period);
    expect(first.skipped).toBeUndefined();
    expect(first.sent).toEqual([
      { metric: "shots", quantity: 12_345 },
      { metric: "simulation_seconds", quantity: 101 },
    ]);
    const second = await reportOverage(owner.orgId, period);
    expect(second.sent).toEqual([]);
    const rows = await db
      .select()
      .from(overageReports)
      .where(eq(overageReports.orgId, owner.orgId));
    expect(rows.map((r) => [r.metric, r.status, r.attempts])).toEqual([
      ["shots", "sent", 1],
      ["simulation_seconds", "sent", 1],
    ]);

    const sub = await getStripe().subscriptions.retrieve((await org()).stripeSubscriptionId!);
    const customer = sub.customer as string;
    await h.admin("/_fake/advance", { customer, to: sub.items.data[0].current_period_end });
    const renewed = await getStripe().subscriptions.retrieve(sub.id);
    const invoice = await getStripe().invoices.retrieve(renewed.latest_invoice as string);
    expect(invoice.billing_reason).toBe("subscription_cycle");
    const catalog = await ensureCatalog();
    const line = (price: string) =>
      invoice.lines.data.find((l) => l.pricing?.price_details?.price === price)!;
    const shots = line(catalog.prices.lab.shots);
    const seconds = line(catalog.prices.lab.seconds);
    expect(shots.quantity).toBe(13); // ⌈12,345 / 1,000⌉ started blocks
    expect(shots.amount).toBe(13 * lab.overage!.shotsPer1000Cents);
    expect(seconds.quantity).toBe(101);
    expect(seconds.amount).toBe(
      Math.round(101 * Number(lab.overage!.simulationSecondCentsDecimal)),
    );
    // The plan table's own overage formula agrees before the per-line rounding.
    expect(Math.abs(overageCents(lab, used) - (shots.amount + seconds.amount))).toBeLessThan(1);
    expect(line(catalog.prices.lab.seat).quantity).toBe(5);
    const marked = await db.select().from(usageEvents).where(eq(usageEvents.runId, runId));
    expect(marked.every((u) => u.reportedAt instanceof Date)).toBe(true);
  });

  it("a failed renewal payment marks the plan past due and e-mails the owner and admins", async () => {
    await h.flush();
    const sub = await getStripe().subscriptions.retrieve((await org()).stripeSubscriptionId!);
    const customer = sub.customer as string;
    const since = wholeSecond();
    await h.admin("/_fake/fail-next-payment", { customer });
    await h.admin("/_fake/advance", { customer, to: sub.items.data[0].current_period_end });
    await h.flush();
    expect((await org()).subscriptionStatus).toBe("past_due");
    expect((await org()).plan).toBe("lab");
    expect(await audits("billing.payment_failed")).toHaveLength(1);
    for (const email of [owner.user.email, admin.email]) {
      const mail = await waitForMail(email, since, 20_000, /Payment failed/);
      expect(mail.subject).toMatch(/Payment failed/);
      expect(mail.text).toMatch(/past due/);
      expect(mail.text).toMatch(/\/invoice\//);
    }
  });
});

describe("payment provider down", () => {
  it("a seat change answers 503 with a plain message and changes nothing", async () => {
    const before = await org();
    await h.fake.close();
    const result = await runOperation(changeSeatsOp, owner.user.id, owner.orgId, { seats: "6" });
    expect(result).toMatchObject({ status: "error", code: 503 });
    expect((result as { message: string }).message).toMatch(/can't be reached/);
    const after = await org();
    expect(after.seats).toBe(before.seats);
    expect(after.updatedAt.getTime()).toBe(before.updatedAt.getTime());
  });
});
