/**
 * Entry point: `node --import tsx docker/payment-fake/server.ts`.
 * Reads the environment (see config.ts), listens, and saves state on exit.
 */
import { startPaymentFake } from "./app";
import { optionsFromEnv } from "./config";

async function main(): Promise<void> {
  const options = optionsFromEnv(process.env);
  const running = await startPaymentFake(options);
  console.log(
    `[payment-fake] listening on ${options.host}:${running.port}; pages at ${running.fake.config.publicUrl}; ` +
      `webhooks → ${running.fake.config.webhook.url || "(off)"}${options.dataFile ? `; state in ${options.dataFile}` : ""}`,
  );
  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    console.log(`[payment-fake] ${signal}: saving state and stopping`);
    running.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.on("SIGTERM", () => shutdown("SIGTERM"));
  process.on("SIGINT", () => shutdown("SIGINT"));
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
