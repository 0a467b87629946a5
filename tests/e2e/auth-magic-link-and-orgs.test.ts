/**
 * Browser: magic-link sign-in with the link read from maildev's REST API,
 * the link refused on reuse, and switching organisation in the top bar.
 */
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeRedis } from "@/lib/rate-limit/redis";
import { launchBrowser, screenshot } from "../support/browser";
import { E2E_URL } from "../support/e2e-config";
import { addMember, createUserWithOrg, uniqueEmail } from "../support/factories";
import { linkIn, waitForMail } from "../support/maildev";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeRedis();
  await closeDb();
});

async function requestLink(page: Page, email: string): Promise<string> {
  const since = new Date(Date.now() - 1000);
  await page.goto(`${E2E_URL}/sign-in?tab=link`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
  await page.waitForURL(/\/check-email\?email=/);
  const mail = await waitForMail(email, since);
  expect(mail.subject).toBe("Your Ketwise sign-in link");
  return linkIn(mail, `${E2E_URL}/api/auth/callback/nodemailer?`);
}

describe("magic link", () => {
  it("signs in a new address, creating its personal organisation, and refuses the link a second time", async () => {
    const email = uniqueEmail("e2e-link");
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const link = await requestLink(page, email);
    await screenshot(page, "check-email");

    await page.goto(link);
    await page.waitForURL(/\/app$/);
    const name = `${email.split("@")[0]}'s organisation`;
    await page.getByRole("heading", { level: 1, name }).waitFor();
    await screenshot(page, "dashboard-after-magic-link");
    await context.close();

    const other = await browser.newContext();
    const second = await other.newPage();
    await second.goto(link);
    await second.waitForURL(/\/sign-in\?error=Verification/);
    await second.getByText("That sign-in link has expired or was already used.").waitFor();
    await screenshot(second, "magic-link-reused");
    await other.close();
  });
});

describe("organisation switcher", () => {
  it("switches between the user's organisations and shows the role in each", async () => {
    const home = await createUserWithOrg("switcher");
    const lab = await createUserWithOrg("lab-owner");
    await addMember(lab.orgId, home.user.id, "viewer");

    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const link = await requestLink(page, home.user.email);
    await page.goto(link);
    await page.waitForURL(/\/app$/);
    await page.getByText("You are Owner here").waitFor();

    await page.getByRole("button", { name: /^Organisation:/ }).click();
    await screenshot(page, "org-switcher-open");
    await page.getByRole("menuitemradio", { name: lab.name }).click();
    await page.waitForURL(/\/app$/);
    await page.getByRole("heading", { level: 1, name: lab.name }).waitFor();
    await page.getByText("You are Viewer here").waitFor();
    await screenshot(page, "dashboard-after-switch");

    // The choice sticks across page loads.
    await page.reload();
    await page.getByText("You are Viewer here").waitFor();
    await context.close();
  });
});
