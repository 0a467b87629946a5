/**
 * Browser: an owner invites a colleague on /app/members, the colleague opens
 * the link from the mail sink, creates an account and joins; the owner sees
 * them in the member list, upgrades to Lab through the payment fake's hosted
 * card page (test card 4242 4242 4242 4242), comes back to the Lab plan with
 * a paid first invoice, and finds all of it in the audit log.
 *
 * The payment fake delivers webhooks to the dev server (port 3000) by default;
 * this file points it at the e2e server through `POST /_fake/config` and puts
 * the previous address back afterwards. Screenshots land in tests/artifacts/.
 */
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeRedis } from "@/lib/rate-limit/redis";
import { launchBrowser, screenshot } from "../support/browser";
import { E2E_PORT, E2E_URL } from "../support/e2e-config";
import { createUserWithOrg, TEST_PASSWORD, uniqueEmail } from "../support/factories";
import { linkIn, waitForMail } from "../support/maildev";

const FAKE_URL = `http://127.0.0.1:${process.env.PAYMENT_FAKE_PORT ?? 12111}`;
/** The fake's own default when PAYMENT_FAKE_WEBHOOK_URL is unset (docker/payment-fake/README.md). */
const DEV_WEBHOOK_URL =
  process.env.PAYMENT_FAKE_WEBHOOK_URL ?? "http://127.0.0.1:3000/api/webhooks/billing";
const E2E_WEBHOOK_URL = `http://127.0.0.1:${E2E_PORT}/api/webhooks/billing`;

async function fake<T>(path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${FAKE_URL}${path}`, {
    method: body === undefined ? "GET" : "POST",
    headers: {
      Authorization: `Bearer ${process.env.STRIPE_SECRET_KEY ?? "sk_test_e2e"}`,
      ...(body === undefined ? {} : { "Content-Type": "application/json" }),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`payment fake ${path} answered ${res.status}: ${await res.text()}`);
  return (await res.json()) as T;
}

let browser: Browser;
let admin: Page;
let colleagueContext: BrowserContext;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
const colleagueEmail = uniqueEmail("e2e-colleague");
const colleagueName = "Ada Colleague";
let checkoutSessionId = "";

beforeAll(async () => {
  await fake("/_fake/config", { webhook_url: E2E_WEBHOOK_URL });
  owner = await createUserWithOrg("e2e-admin");
  browser = await launchBrowser();
  admin = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
  colleagueContext = await browser.newContext({ viewport: { width: 1280, height: 800 } });
});

afterAll(async () => {
  await fake("/_fake/webhooks/flush", { timeout_ms: 5000 }).catch(() => undefined);
  await fake("/_fake/config", { webhook_url: DEV_WEBHOOK_URL }).catch(() => undefined);
  await browser?.close();
  await closeRedis();
  await closeDb();
});

describe("organisation admin: invite, join, upgrade, audit", () => {
  it("signs the owner in", async () => {
    await admin.goto(`${E2E_URL}/sign-in?callbackUrl=%2Fapp`);
    await admin.getByLabel("E-mail").fill(owner.user.email);
    await admin.getByLabel("Password").fill(TEST_PASSWORD);
    await admin.getByRole("button", { name: "Sign in" }).click();
    await admin.waitForURL(/\/app$/);
    await admin.getByRole("heading", { level: 1, name: owner.name }).waitFor();
  });

  it("invites a colleague by e-mail on the members page", async () => {
    await admin.goto(`${E2E_URL}/app/members`);
    await admin.getByRole("heading", { level: 2, name: "1 member" }).waitFor();
    await admin.getByText("No pending invitations", { exact: true }).waitFor();
    const since = new Date();
    await admin.getByRole("textbox", { name: "E-mail" }).fill(colleagueEmail);
    await admin.getByLabel("Role").selectOption("member");
    await admin.getByRole("button", { name: "Send invitation" }).click();
    const pending = admin.getByRole("row").filter({ hasText: colleagueEmail });
    await pending.waitFor();
    await expect(pending.textContent()).resolves.toContain("Member");
    await screenshot(admin, "admin-members-invited");

    const mail = await waitForMail(colleagueEmail, since);
    expect(mail.subject).toContain(owner.name);
    const link = linkIn(mail, `${E2E_URL}/invite/`);
    const page = await colleagueContext.newPage();
    await page.goto(link);
    await page.getByRole("heading", { level: 1, name: `Join ${owner.name}` }).waitFor();
    expect(await page.getByLabel("Work e-mail").inputValue()).toBe(colleagueEmail);
    await screenshot(page, "admin-invite-page");
  });

  it("lets the colleague create an account and join with the invited role", async () => {
    const page = colleagueContext.pages()[0];
    await page.getByLabel("Your name").fill(colleagueName);
    await page.getByLabel("Choose a password").fill("entangled pair of qubits");
    await page.getByRole("button", { name: `Create account and join ${owner.name}` }).click();
    await page.waitForURL(/\/app\?joined=1$/);
    await page.getByRole("heading", { level: 1, name: owner.name }).waitFor();
    await page.getByText(/You are\s*Member\s*here/).waitFor();

    // The link works once: opening it again explains that it was used.
    const mail = await waitForMail(colleagueEmail, new Date(0));
    await page.goto(linkIn(mail, `${E2E_URL}/invite/`));
    await page.getByRole("heading", { level: 1, name: "This invitation can't be used" }).waitFor();
  });

  it("shows the colleague in the owner's member list, no longer pending", async () => {
    await admin.goto(`${E2E_URL}/app/members`);
    await admin.getByRole("heading", { level: 2, name: "2 members" }).waitFor();
    const row = admin.getByRole("row").filter({ hasText: colleagueEmail });
    await expect(row.textContent()).resolves.toContain(colleagueName);
    await admin.getByText("No pending invitations", { exact: true }).waitFor();
    await screenshot(admin, "admin-members");
  });

  it("upgrades to Lab on the fake's hosted card page and returns to the Lab plan", async () => {
    await admin.goto(`${E2E_URL}/app/billing`);
    await admin.getByRole("heading", { level: 2, name: "Invoices" }).waitFor();
    await admin.getByText("No invoices yet").waitFor();
    await admin.getByRole("button", { name: "Upgrade to Lab" }).click();
    await admin.waitForURL(/^http:\/\/localhost:\d+\/pay\/cs_test_/);
    checkoutSessionId = new URL(admin.url()).pathname.split("/").pop()!;
    await admin.getByRole("heading", { level: 1, name: "Subscribe" }).waitFor();
    await screenshot(admin, "admin-hosted-payment");

    await admin.getByLabel("Name on card").fill(owner.user.name);
    await admin.getByLabel("Card number").fill("4242 4242 4242 4242");
    await admin.getByLabel("Expiry (MM / YY)").fill("12 / 34");
    await admin.getByLabel("CVC").fill("123");
    await admin.getByRole("button", { name: /^Pay .* and subscribe$/ }).click();
    await admin.waitForURL(
      new RegExp(`^${E2E_URL}/app/billing\\?checkout=success&session_id=${checkoutSessionId}$`),
    );
    await admin.getByText("Payment received — your new plan is active.").waitFor();
  });

  it("shows Lab, the seats and a paid first invoice on the billing page", async () => {
    await admin.reload();
    // The "Plan" card's title is the plan's name with the subscription status beside it.
    await admin.getByRole("heading", { level: 2, name: /^Lab\s*active$/ }).waitFor();
    const currentCard = admin
      .locator("div", { has: admin.getByText("Current plan", { exact: true }) })
      .last();
    expect(await currentCard.getByRole("heading", { level: 2 }).textContent()).toBe("Lab");
    const invoice = admin.getByRole("row").filter({ hasText: "First month" });
    await invoice.waitFor();
    const text = (await invoice.textContent()) ?? "";
    expect(text).toContain("paid");
    expect(text).toMatch(/\$\d/);
    await screenshot(admin, "admin-billing-after-upgrade");
  });

  it("delivered the checkout webhook to the e2e server", async () => {
    await fake("/_fake/webhooks/flush", { timeout_ms: 10_000 });
    const events = await fake<{ data: { id: string; data: { object: { id: string } } }[] }>(
      "/v1/events?type=checkout.session.completed&limit=20",
    );
    const event = events.data.find((e) => e.data.object.id === checkoutSessionId);
    expect(event, "checkout.session.completed event for this session").toBeDefined();
    const { data } = await fake<{ data: { url: string; status: string }[] }>(
      `/_fake/deliveries?event=${event!.id}`,
    );
    expect(data.map((d) => [d.url, d.status])).toEqual([[E2E_WEBHOOK_URL, "succeeded"]]);
  });

  it("records the invitation, the join and the plan change in the audit log", async () => {
    await admin.goto(`${E2E_URL}/app/audit`);
    await admin.getByRole("heading", { level: 1, name: "Audit log" }).waitFor();
    for (const label of [
      "Invitation sent",
      "Invitation accepted",
      "Checkout started",
      "Plan changed",
    ]) {
      await admin.getByRole("cell", { name: label }).first().waitFor();
    }
    await screenshot(admin, "admin-audit");
  });
});
