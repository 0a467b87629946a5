/**
 * Browser: the run workspace end to end, against the production build, the real worker
 * process, MariaDB and Redis.
 *
 * 1. Compose a run from the library (Bell pair + the ZZ + XX correlator), see an inline
 *    OpenQASM error at the parser's line, fix it, submit while no worker runs (the run
 *    waits, queued), start the worker and watch the run finish, read the agreement panel,
 *    download the run as JSON and the terms as CSV, and the measurement circuits as a zip.
 * 2. A 1-D sweep of the two-level ansatz over θ with the reduced model: the chart, its
 *    marked minimum, and every exact value against the closed form of E(θ).
 * 3. Compare the two runs from the runs list.
 *
 * Reference values: for the Bell state (|00⟩ + |11⟩)/√2, ⟨Z⊗Z⟩ = ⟨X⊗X⟩ = 1 (it is their
 * common +1 eigenstate; Nielsen & Chuang §2.6 / §10.5, common practice), so ZZ + XX = 2.
 * Screenshots land in tests/artifacts/workspace-*.png.
 */
import { readFileSync } from "node:fs";
import { migrate } from "drizzle-orm/mysql2/migrator";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { closeRedis } from "@/lib/rate-limit/redis";
import { seedDemoLibrary } from "@/scripts/seed/demo-library";
import { startWorker, type WorkerProcess } from "../integration/runs/support/worker-process";
import { launchBrowser, screenshot } from "../support/browser";
import { E2E_URL } from "../support/e2e-config";
import { createUserWithOrg, TEST_PASSWORD } from "../support/factories";
import { threeSpinEnergy } from "../support/three-spin-closed-form";
import { parseCsv } from "./workspace-helpers";

let browser: Browser;
let page: Page;
let worker: WorkerProcess | null = null;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
const runIds: string[] = [];

beforeAll(async () => {
  await migrate(db, { migrationsFolder: "drizzle" });
  owner = await createUserWithOrg("e2e-workspace");
  await seedDemoLibrary(owner.orgId);
  browser = await launchBrowser();
  page = await (
    await browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true })
  ).newPage();
});

afterAll(async () => {
  await worker?.stop();
  await browser?.close();
  await closeRedis();
  await closeDb();
});

async function pickFromLibrary(slot: 0 | 1, name: string) {
  await page.getByRole("button", { name: "Library" }).nth(slot).click();
  await page
    .getByRole("dialog")
    .getByRole("button", { name: new RegExp(name.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")) })
    .click();
  await page.getByText(`Loaded “${name}” from the library.`).waitFor();
}

async function download(buttonName: string) {
  const [file] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: buttonName }).click(),
  ]);
  return { name: file.suggestedFilename(), bytes: readFileSync((await file.path())!) };
}

describe("run workspace", () => {
  it("signs in and opens the new-run page", async () => {
    await page.goto(`${E2E_URL}/sign-in?callbackUrl=%2Fapp%2Fruns%2Fnew`);
    await page.getByLabel("E-mail").fill(owner.user.email);
    await page.getByLabel("Password").fill(TEST_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/app\/runs\/new$/);
    await page.getByRole("heading", { level: 1, name: "New run" }).waitFor();
  });

  it("composes from the library and shows the preview", async () => {
    await pickFromLibrary(0, "Bell pair");
    await pickFromLibrary(1, "Correlator ZZ + XX");
    await page.getByText("2 terms · acts on qubits 0, 1 · 2 measurement settings").waitFor();
    await page.getByText("Ready to run").waitFor();
    // The diagram draws the Bell preparation: an h tile and a controlled-x.
    expect(
      await page.getByRole("img", { name: /Circuit diagram: 2 qubits, 2 operations/ }).count(),
    ).toBe(1);
    await screenshot(page, "workspace-new-run");
  });

  it("marks an OpenQASM error at the parser's line, and clears it once fixed", async () => {
    const editor = page.getByRole("textbox", { name: "Circuit source, OpenQASM 2.0" });
    await editor.click();
    await page.keyboard.press("Control+End");
    const bad = "cx q[0], q[5];";
    await page.keyboard.type(bad);
    await page.locator(".cm-lintRange-error").first().waitFor();
    const issues = page.locator("#circuit-issues");
    await issues.getByText(/line 6/).waitFor();
    expect(await issues.textContent()).toMatch(/q\[5\]|index|out of range|range/i);
    await page.getByText("Needs a fix").waitFor();
    await screenshot(page, "workspace-new-run-error");
    for (let i = 0; i < bad.length; i++) await page.keyboard.press("Backspace");
    await page.getByText("Ready to run").waitFor();
    expect(await page.locator(".cm-lintRange-error").count()).toBe(0);
  });

  it("submits with Ctrl+Enter; the run waits queued until a worker starts, then finishes", async () => {
    await page.getByLabel("Total shots").fill("8000");
    await page.getByLabel("Seed").fill("20261201");
    await page.getByLabel("Run name").fill("Bell pair, ZZ + XX");
    await page.getByLabel("Total shots").press("Control+Enter");
    await page.waitForURL(/\/app\/runs\/[0-9a-f-]{36}$/);
    runIds.push(page.url().split("/").pop()!);
    await page.getByRole("progressbar", { name: "Queued" }).waitFor();
    await screenshot(page, "workspace-run-queued");
    worker = await startWorker({ concurrency: 1 });
    await page.getByTestId("verdict").waitFor({ timeout: 60_000 });
    expect(await page.getByRole("progressbar").count()).toBe(0);
  });

  it("reads the agreement panel: exact 2, sampled mean with its error, a consistent verdict", async () => {
    const text = (await page.locator("[aria-labelledby=agreement-title]").textContent()) ?? "";
    expect(text).toContain("2.000000"); // ⟨ZZ⟩ + ⟨XX⟩ = 2 on the Bell state
    expect(["Consistent", "Exact agreement"]).toContain(
      (await page.getByTestId("verdict").textContent())?.trim(),
    );
    expect(await page.getByTestId("verdict-sentence").textContent()).toMatch(/exact value/);
    await page.getByRole("table", { name: "Terms of the observable" }).waitFor();
    await screenshot(page, "workspace-run");
  });

  it("downloads the run as JSON and the terms as CSV with the same numbers", async () => {
    const json = await download("Run (JSON)");
    expect(json.name).toMatch(/^bell-pair-zz-xx-[0-9a-f]{8}\.json$/);
    const run = JSON.parse(json.bytes.toString("utf8"));
    expect(run.id).toBe(runIds[0]);
    expect(run.seed).toBe(20261201);
    expect(run.result.ideal.value).toBeCloseTo(2, 12);
    expect(run.result.sampled.shots).toBe(8000);

    const csv = await download("Terms (CSV)");
    const rows = parseCsv(csv.bytes.toString("utf8"));
    expect(rows[0]).toEqual([
      "pauli",
      "coefficient",
      "exact",
      "sampled_mean",
      "std_err",
      "setting",
      "setting_bases",
      "ci95_low",
      "ci95_high",
    ]);
    const byWord = new Map(rows.slice(1).map((r) => [r[0], r]));
    expect(Number(byWord.get("ZZ")![2])).toBeCloseTo(1, 12);
    expect(Number(byWord.get("XX")![2])).toBeCloseTo(1, 12);
    expect(Number(byWord.get("ZZ")![3])).toBe(
      run.result.terms.find((t: { pauli: string }) => t.pauli === "ZZ").sampledMean,
    );

    const zip = await download("Measurement circuits (zip)");
    expect([...zip.bytes.subarray(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]); // ZIP local file header (PKWARE APPNOTE)
    expect(zip.bytes.toString("latin1")).toContain("setting-0-");
  });

  it("runs a 1-D sweep and draws the landscape with its minimum marked", async () => {
    await page.goto(`${E2E_URL}/app/runs/new`);
    await page.getByRole("button", { name: "Start over" }).click();
    await pickFromLibrary(0, "Three-spin ansatz (θ)");
    await pickFromLibrary(1, "Three-spin cluster (invented)");
    await page.getByRole("button", { name: "Sweep", exact: true }).click();
    await page.getByLabel("From", { exact: true }).fill("0");
    await page.getByLabel("To", { exact: true }).fill("6.283185307179586");
    await page.getByLabel("Points", { exact: true }).fill("25");
    await page.getByText("25 values, step 0.2618").waitFor();
    await page.getByLabel("Total shots").fill("2000");
    await page.getByLabel("Run name").fill("Ansatz sweep over theta");
    await page.getByText("Ready to run").waitFor();
    await screenshot(page, "workspace-new-run-sweep");
    await page.getByRole("button", { name: "Run", exact: true }).click();
    await page.waitForURL(/\/app\/runs\/[0-9a-f-]{36}$/);
    runIds.push(page.url().split("/").pop()!);
    await page.getByTestId("sweep-min").waitFor({ timeout: 60_000 });

    // Every exact point against E(θ) = c0 + 2J + 3h cos θ + (k − m) sin θ (derived by hand in
    // tests/support/three-spin-closed-form.ts).
    const csv = parseCsv((await download("Sweep (CSV)")).bytes.toString("utf8"));
    expect(csv[0]).toEqual([
      "point",
      "theta",
      "ideal",
      "exact",
      "sampled_mean",
      "std_err",
      "shots",
      "ci95_low",
      "ci95_high",
    ]);
    const points = csv.slice(1).map((r) => ({ theta: Number(r[1]), exact: Number(r[3]) }));
    expect(points).toHaveLength(25);
    for (const p of points) expect(p.exact).toBeCloseTo(threeSpinEnergy(p.theta), 10);
    const best = points.reduce((a, b) => (b.exact < a.exact ? b : a));
    const minText = (await page.getByTestId("sweep-min").textContent()) ?? "";
    expect(minText).toContain(`theta = ${Number(best.theta.toPrecision(6))}`);
    await screenshot(page, "workspace-sweep");
  });

  it("saves a noise profile for the organisation and finds it again after a reload", async () => {
    await page.goto(`${E2E_URL}/app/runs/new`);
    await page.getByRole("button", { name: "Start over" }).click(); // the sweep left a draft
    await page.getByLabel("Add a noise model").check();
    await page.getByLabel("Start from a profile").selectOption({ label: "Light gate noise" });
    expect(await page.getByLabel(/Depolarizing, multi-qubit gates/).inputValue()).toBe("0.01");
    await page.getByRole("button", { name: "Save as profile" }).click();
    await page.getByLabel("Profile name").fill("Bench A, light");
    await page.getByRole("button", { name: "Save", exact: true }).click();
    await page.getByText("Saved “Bench A, light”.").waitFor();
    // The reload must find the noise card open: wait until the draft that says so is stored.
    await page.waitForFunction(() =>
      Object.keys(localStorage).some(
        (k) =>
          k.startsWith("ketwise:new-run-draft:") &&
          (localStorage.getItem(k) ?? "").includes('"noiseEnabled":true'),
      ),
    );
    await page.reload();
    const saved = page.locator("optgroup[label='Saved in this organisation'] option", {
      hasText: "Bench A, light",
    });
    await saved.waitFor({ state: "attached" });
    await page.getByLabel("Depolarizing, 1-qubit gates").fill("");
    await page.getByLabel("Start from a profile").selectOption({ label: "Bench A, light" });
    expect(await page.getByLabel(/Depolarizing, 1-qubit gates/).inputValue()).toBe("0.001");
    await screenshot(page, "workspace-noise-profile");
  });

  it("draws the circuit while it is typed, before the observable or the shots are written", async () => {
    await page.goto(`${E2E_URL}/app/runs/new`);
    await page.getByRole("button", { name: "Start over" }).click(); // the starter: h, cx, ry on 2 qubits
    const diagram = (ops: number) =>
      page.getByRole("img", { name: new RegExp(`^Circuit diagram: 2 qubits, ${ops} operations`) });
    await diagram(3).waitFor();
    // No observable yet: the preview's problem carries the outline.
    await page.getByRole("textbox", { name: "Observable, Pauli sum" }).click();
    await page.keyboard.press("Control+A");
    await page.keyboard.press("Backspace");
    const circuit = page.getByRole("textbox", { name: "Circuit source, OpenQASM 2.0" });
    await circuit.click();
    await page.keyboard.press("Control+End");
    await page.keyboard.type("x q[1];");
    await diagram(4).waitFor();
    // A form issue of its own (no shots): the circuit alone is outlined.
    await page.getByLabel("Total shots").fill("");
    await circuit.click();
    await page.keyboard.press("Control+End");
    await page.keyboard.type("\nh q[0];");
    await diagram(5).waitFor();
    await screenshot(page, "workspace-new-run-outline-while-typing");
  });

  it("compares the two runs from the runs list", async () => {
    await page.goto(`${E2E_URL}/app/runs`);
    await page.getByRole("table", { name: "Runs" }).waitFor();
    await page.getByLabel("Select Bell pair, ZZ + XX").check();
    await page.getByLabel("Select Ansatz sweep over theta").check();
    await page.getByRole("link", { name: /Compare 2 finished/ }).click();
    await page.waitForURL(/\/app\/compare\?ids=/);
    const table = page.getByRole("table", { name: "Runs compared" });
    await table.waitFor();
    expect(await table.getByRole("row").count()).toBe(3); // header + 2 runs
    expect(await page.getByRole("img", { name: /^Comparison: / }).count()).toBe(1);
    expect(await table.textContent()).toContain("Bell pair, ZZ + XX");
    await screenshot(page, "workspace-compare");
  });
});
