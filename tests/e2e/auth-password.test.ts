/**
 * Browser: sign up (with the bad inputs first), the signed-in shell, sign out
 * from the user menu, sign in with a password (wrong one first), and an
 * expired session. Screenshots land in tests/artifacts/.
 */
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeRedis } from "@/lib/rate-limit/redis";
import { launchBrowser, screenshot } from "../support/browser";
import { E2E_URL } from "../support/e2e-config";
import { createTestUser, uniqueEmail } from "../support/factories";

let browser: Browser;
let page: Page;
const email = uniqueEmail("e2e-signup");
const password = "superposition of states";

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
});

afterAll(async () => {
  await browser?.close();
  await closeRedis();
  await closeDb();
});

async function fillSignUp(p: Page, values: { name: string; email: string; password: string }) {
  await p.getByLabel("Name").fill(values.name);
  await p.getByLabel("Work e-mail").fill(values.email);
  await p.getByLabel("Password").fill(values.password);
  await p.getByRole("button", { name: "Create account" }).click();
}

describe("sign up, sign out, sign in", () => {
  it("shows the landing page", async () => {
    const res = await page.goto(`${E2E_URL}/`);
    expect(res?.status()).toBe(200);
    await screenshot(page, "landing");
  });

  it("explains a weak password and a malformed e-mail, keeping what was typed", async () => {
    await page.goto(`${E2E_URL}/sign-up`);
    await screenshot(page, "sign-up");
    await fillSignUp(page, { name: "Grace Hopper", email: "grace-at-example", password: "short" });
    await page.getByText("Enter a valid e-mail address").waitFor();
    await page.getByText("Use at least 10 characters.").waitFor();
    expect(await page.getByLabel("Name").inputValue()).toBe("Grace Hopper");
    await screenshot(page, "sign-up-errors");
  });

  it("creates the account and opens the new personal organisation", async () => {
    await page.goto(`${E2E_URL}/sign-up`);
    await fillSignUp(page, { name: "Grace Hopper", email, password });
    await page.waitForURL(/\/app\?welcome=1$/);
    await page.getByRole("heading", { level: 1, name: "Grace Hopper's organisation" }).waitFor();
    await page.getByText("Welcome to Ketwise").waitFor();
    await screenshot(page, "dashboard-after-sign-up");
  });

  it("signs out from the user menu", async () => {
    await page.getByRole("button", { name: /^Account:/ }).click();
    await page.getByRole("menuitem", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in\?signedOut=1$/);
    await page.getByText("You have signed out.").waitFor();
    await page.goto(`${E2E_URL}/app`);
    await page.waitForURL(/\/sign-in\?callbackUrl=%2Fapp$/);
  });

  it("refuses a taken e-mail on sign-up", async () => {
    await page.goto(`${E2E_URL}/sign-up`);
    await fillSignUp(page, { name: "Someone Else", email: email.toUpperCase(), password: "another fine password" });
    await page.getByText("An account with this e-mail already exists. Sign in instead.").first().waitFor();
  });

  it("gives one generic message for a wrong password and for an unknown e-mail", async () => {
    const message = "That e-mail and password don't match an account. Check both and try again.";
    for (const [who, pass] of [
      [email, "not the password"],
      [uniqueEmail("nobody"), "not the password"],
    ]) {
      await page.goto(`${E2E_URL}/sign-in`);
      await page.getByLabel("E-mail").fill(who);
      await page.getByLabel("Password").fill(pass);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.getByText(message).waitFor();
    }
    await screenshot(page, "sign-in-wrong-password");
  });

  it("signs in with the password", async () => {
    await page.goto(`${E2E_URL}/sign-in`);
    await screenshot(page, "sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/app$/);
    await page.getByRole("heading", { level: 1, name: "Grace Hopper's organisation" }).waitFor();
    await page.getByText("You are Owner here").waitFor();
  });

  it("sends an expired session back to sign-in with a clear message", async () => {
    const context = await browser.newContext();
    await context.addCookies([{ name: "authjs.session-token", value: "expired.or.garbage", url: E2E_URL }]);
    const p = await context.newPage();
    await p.goto(`${E2E_URL}/app`);
    await p.waitForURL(/\/sign-in\?.*error=SessionExpired/);
    await p.getByText("Your session has expired. Sign in again to continue.").waitFor();
    await screenshot(p, "session-expired");
    await context.close();
  });

  it("seeded users can sign in too (factory user, password form)", async () => {
    const user = await createTestUser("e2e-factory");
    const context = await browser.newContext();
    const p = await context.newPage();
    await p.goto(`${E2E_URL}/sign-in?callbackUrl=%2Fapp`);
    await p.getByLabel("E-mail").fill(user.email);
    await p.getByLabel("Password").fill("correct horse battery");
    await p.getByRole("button", { name: "Sign in" }).click();
    await p.waitForURL(/\/app$/);
    await context.close();
  });
});
