/**
 * Browser: sign up (with the bad inputs first; the account's sign-in link comes by e-mail), the signed-in shell, sign out
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
import { linkIn, waitForMail } from "../support/maildev";

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

  it("creates the account, e-mails a sign-in link, and the link opens the new personal organisation", async () => {
    const since = new Date();
    await page.goto(`${E2E_URL}/sign-up`);
    await fillSignUp(page, { name: "Grace Hopper", email, password });
    await page.waitForURL(/\/check-email\?.*for=sign-up/);
    const mail = await waitForMail(email, since, 20_000, /sign-in link/);
    // the password works only once the address is confirmed by the link
    await page.goto(`${E2E_URL}/sign-in`);
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText(/^Confirm your e-mail address first/).waitFor();
    await page.goto(linkIn(mail, `${E2E_URL}/api/auth/callback/nodemailer?`));
    await page.waitForURL(/\/app\?welcome=1$/);
    await page.getByRole("heading", { level: 1, name: "Grace Hopper's organisation" }).waitFor();
    await page.getByText("Welcome to Ketwise").waitFor();
    await screenshot(page, "dashboard-after-sign-up");
  });

  it("signs out from the user menu, and a copy of the session cookie stops working", async () => {
    const copied = (await page.context().cookies()).filter((c) =>
      c.name.startsWith("authjs.session-token"),
    );
    expect(copied.length).toBeGreaterThan(0);
    await page.getByRole("button", { name: /^Account:/ }).click();
    await page.getByRole("menuitem", { name: "Sign out", exact: true }).click();
    await page.waitForURL(/\/sign-in\?signedOut=1$/);
    await page.getByText("You have signed out.").waitFor();
    await page.goto(`${E2E_URL}/app`);
    await page.waitForURL(/\/sign-in\?callbackUrl=%2Fapp$/);
    const thief = await browser.newContext();
    await thief.addCookies(copied);
    const p = await thief.newPage();
    await p.goto(`${E2E_URL}/app`);
    await p.waitForURL(/\/sign-in\?/);
    await thief.close();
  });

  it("answers a taken e-mail like a new one, and tells the owner by e-mail", async () => {
    const since = new Date();
    await page.goto(`${E2E_URL}/sign-up`);
    await fillSignUp(page, {
      name: "Someone Else",
      email: email.toUpperCase(),
      password: "another fine password",
    });
    await page.waitForURL(/\/check-email\?.*for=sign-up/);
    await page
      .getByText("If the address already has an account, the message tells you how to sign in")
      .waitFor();
    await waitForMail(email, since, 20_000, /already have a Ketwise account/);
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
    // the route streams: picture the form, not the loading bar
    await page.getByRole("heading", { name: "Sign in to Ketwise" }).waitFor();
    await screenshot(page, "sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/app$/);
    await page.getByRole("heading", { level: 1, name: "Grace Hopper's organisation" }).waitFor();
    await page.getByText("You are Owner here").waitFor();
  });

  it("sign out everywhere ends the sessions of other browsers too", async () => {
    const other = await browser.newContext();
    const p = await other.newPage();
    await p.goto(`${E2E_URL}/sign-in`);
    await p.getByLabel("E-mail").fill(email);
    await p.getByLabel("Password").fill(password);
    await p.getByRole("button", { name: "Sign in" }).click();
    await p.waitForURL(/\/app$/);
    await page.getByRole("button", { name: /^Account:/ }).click();
    await page.getByRole("menuitem", { name: "Sign out everywhere" }).click();
    await page.waitForURL(/\/sign-in\?signedOut=everywhere$/);
    await page.getByText("You have signed out on every browser and device.").waitFor();
    await p.goto(`${E2E_URL}/app`);
    await p.waitForURL(/\/sign-in\?/);
    await other.close();
  });

  it("sends an expired session back to sign-in with a clear message", async () => {
    const context = await browser.newContext();
    await context.addCookies([
      { name: "authjs.session-token", value: "expired.or.garbage", url: E2E_URL },
    ]);
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
