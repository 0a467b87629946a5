/**
 * Builds and starts the fake on a port (0 = any free port) — used by
 * `server.ts` and, in-process, by the integration tests.
 */
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { handleAdmin } from "./admin";
import { processDue } from "./billing/due";
import { Fake, type FakeConfig, type WebhookSettings } from "./core/fake";
import { handleApi } from "./http/api";
import { sendHtml, sendJson } from "./http/respond";
import { Router } from "./http/router";
import { notFoundPage } from "./pages/layout";
import { pageRouter } from "./pages/routes";
import { registerCatalog } from "./resources/catalog";
import { registerCheckoutSessions } from "./resources/checkout-sessions";
import { registerCustomers } from "./resources/customers";
import { registerInvoices } from "./resources/invoices";
import { registerMeters } from "./resources/meters";
import { registerPaymentMethods } from "./resources/payment-methods";
import { registerPortalAndEvents } from "./resources/portal-and-events";
import { registerSubscriptions } from "./resources/subscriptions";
import type { ApiHandler } from "./resources/types";
import { WebhookDispatcher } from "./webhooks/dispatcher";

/** The API version SDK v23 sends by default; stamped on events. */
export const DEFAULT_API_VERSION = "2026-10-28.endive";

export interface PaymentFakeOptions {
  port?: number;
  host?: string;
  /** Defaults to http://127.0.0.1:<port>. */
  publicUrl?: string;
  apiKey?: string | null;
  webhookSecret: string;
  webhookUrl?: string;
  webhook?: Partial<Omit<WebhookSettings, "url" | "secret">>;
  dataFile?: string | null;
  tickMs?: number;
  realNowMs?: () => number;
}

export interface RunningPaymentFake {
  fake: Fake;
  dispatcher: WebhookDispatcher;
  server: Server;
  port: number;
  url: string;
  close(): Promise<void>;
}

export function buildApiRouter(): Router<ApiHandler> {
  const router = new Router<ApiHandler>();
  registerCustomers(router);
  registerPaymentMethods(router);
  registerCatalog(router);
  registerMeters(router);
  registerCheckoutSessions(router);
  registerSubscriptions(router);
  registerInvoices(router);
  registerPortalAndEvents(router);
  return router;
}

export async function startPaymentFake(opts: PaymentFakeOptions): Promise<RunningPaymentFake> {
  const config: FakeConfig = {
    publicUrl: opts.publicUrl ?? "",
    apiKey: opts.apiKey ?? null,
    apiVersion: DEFAULT_API_VERSION,
    webhook: {
      url: opts.webhookUrl ?? "",
      secret: opts.webhookSecret,
      maxAttempts: opts.webhook?.maxAttempts ?? 8,
      baseDelayMs: opts.webhook?.baseDelayMs ?? 1000,
      maxDelayMs: opts.webhook?.maxDelayMs ?? 60_000,
      timeoutMs: opts.webhook?.timeoutMs ?? 10_000,
    },
    dataFile: opts.dataFile ?? null,
    tickMs: opts.tickMs ?? 1000,
  };
  const fake = new Fake(config, opts.realNowMs);
  const dispatcher = new WebhookDispatcher(fake);
  const api = buildApiRouter();

  const server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://fake.local");
    const path = url.pathname;
    const done = (p: Promise<void> | void) =>
      Promise.resolve(p).catch((e: unknown) => {
        console.error("[payment-fake] request failed:", e);
        if (!res.headersSent)
          sendJson(res, 500, {
            error: { type: "api_error", message: "Unexpected error in the local payment fake." },
          });
      });
    if (path === "/health") return void sendJson(res, 200, { status: "ok", now: fake.now() });
    if (path.startsWith("/v1/")) return void done(handleApi(fake, api, req, res, url));
    if (path.startsWith("/_fake/")) return void done(handleAdmin(fake, dispatcher, req, res, url));
    const match = pageRouter.match(req.method ?? "GET", path);
    if (match && match !== "method")
      return void done(match.handler({ fake, params: match.params, req, res }));
    sendHtml(res, 404, notFoundPage(`Nothing here: ${path}`));
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port ?? 0, opts.host ?? "127.0.0.1", () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  config.publicUrl ||= `http://127.0.0.1:${port}`;

  const tick = setInterval(() => {
    if (processDue(fake) > 0) fake.scheduleSave();
  }, config.tickMs);
  tick.unref();
  processDue(fake);
  dispatcher.resume();

  return {
    fake,
    dispatcher,
    server,
    port,
    url: `http://127.0.0.1:${port}`,
    async close() {
      clearInterval(tick);
      dispatcher.stop();
      fake.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
