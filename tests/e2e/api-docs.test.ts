/**
 * Browser: the API reference page, against the production build. The page is rendered on
 * the server from the generated OpenAPI document (lib/openapi/document.ts): its HTML
 * already holds every operation, the browser never asks for /api/v1/openapi.json, and the
 * example tabs switch between curl, Python and TypeScript. Screenshot:
 * tests/artifacts/api-docs.png.
 */
import { migrate } from "drizzle-orm/mysql2/migrator";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { anchor, listOperations } from "@/components/api-docs/openapi-types";
import { closeDb, db } from "@/db";
import { getOpenApiDocument } from "@/lib/openapi/document";
import { closeRedis } from "@/lib/rate-limit/redis";
import { launchBrowser, screenshot } from "../support/browser";
import { E2E_URL } from "../support/e2e-config";
import { createUserWithOrg, TEST_PASSWORD } from "../support/factories";

let browser: Browser;
let page: Page;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
const ops = listOperations(getOpenApiDocument(E2E_URL));
const documentRequests: string[] = [];

beforeAll(async () => {
  await migrate(db, { migrationsFolder: "drizzle" });
  owner = await createUserWithOrg("e2e-api-docs");
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1400, height: 1000 } })).newPage();
  page.on("request", (r) => {
    if (r.url().includes("/api/v1/openapi.json")) documentRequests.push(r.url());
  });
});

afterAll(async () => {
  await browser?.close();
  await closeRedis();
  await closeDb();
});

describe("API reference", () => {
  it("shows every operation, the run request's fields and examples addressed to this server", async () => {
    await page.goto(`${E2E_URL}/sign-in?callbackUrl=%2Fapp%2Fdocs%2Fapi`);
    await page.getByLabel("E-mail").fill(owner.user.email);
    await page.getByLabel("Password").fill(TEST_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/app\/docs\/api$/);
    await page.getByRole("heading", { level: 1, name: "API reference" }).waitFor();
    const nav = page.getByRole("navigation", { name: "Operations" });
    expect(await nav.locator('a[href^="#"]').count()).toBe(ops.length);

    const create = page.locator(`#${anchor("post", "/api/v1/runs")}`);
    const fields = create.getByRole("table", { name: "Request fields of POST /api/v1/runs" });
    await fields.getByText("circuit.source", { exact: true }).waitFor();
    await create.getByRole("tab", { name: "Python" }).click();
    const python = await create.getByRole("tabpanel").innerText();
    expect(python).toContain(E2E_URL);
    expect(python).toContain("/api/v1/runs");
    await create.getByRole("tab", { name: "curl" }).click();
    expect(await create.getByRole("tabpanel").innerText()).toContain("Idempotency-Key");

    expect(documentRequests).toEqual([]);
    await screenshot(page, "api-docs");
  });

  it("is rendered on the server: without JavaScript the HTML holds every operation of the document", async () => {
    const context = await browser.newContext({ javaScriptEnabled: false });
    await context.addCookies(await page.context().cookies());
    const plain = await context.newPage();
    await plain.goto(`${E2E_URL}/app/docs/api`);
    const html = await plain.content();
    expect(ops.length).toBeGreaterThan(10);
    for (const o of ops)
      expect(html, `${o.method} ${o.path}`).toContain(`id="${anchor(o.method, o.path)}"`);
    await context.close();
  });
});
