/**
 * HTTP clients of the cluster check, as a careful API user writes them: every
 * submission carries an Idempotency-Key and is retried with the same key on a
 * network error or a 5xx/429 answer, so an outage never creates a second run.
 */
export type Submitted = { key: string; runId: string; attempts: number; kind: string };

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export class Client {
  constructor(
    readonly base: string,
    readonly apiKey: string,
  ) {}

  async submit(
    idempotencyKey: string,
    body: Record<string, unknown>,
    kind: string,
    deadlineMs = 120_000,
  ): Promise<Submitted> {
    const deadline = Date.now() + deadlineMs;
    let attempts = 0;
    for (;;) {
      attempts++;
      try {
        const res = await fetch(`${this.base}/api/v1/runs`, {
          method: "POST",
          headers: {
            authorization: `Bearer ${this.apiKey}`,
            "content-type": "application/json",
            "idempotency-key": idempotencyKey,
          },
          body: JSON.stringify(body),
          signal: AbortSignal.timeout(10_000),
        });
        if (res.status === 202 || res.status === 200) {
          const run = (await res.json()) as { id: string };
          return { key: idempotencyKey, runId: run.id, attempts, kind };
        }
        if (res.status < 500 && res.status !== 429)
          throw new Error(`submission refused: ${res.status} ${await res.text()}`);
      } catch (error) {
        if (error instanceof Error && error.message.startsWith("submission refused")) throw error;
      }
      if (Date.now() > deadline)
        throw new Error(`submission ${idempotencyKey} not accepted within ${deadlineMs} ms`);
      await sleep(Math.min(100 * attempts, 500));
    }
  }
}

/** Clients submitting small runs at a steady pace until stopped; every acknowledged key is kept. */
export function backgroundLoad(
  client: Client,
  clients: number,
  everyMs: number,
  body: (i: number) => Record<string, unknown>,
) {
  const acknowledged: Submitted[] = [];
  const errors: string[] = [];
  let running = true;
  let counter = 0;
  const loops = Array.from({ length: clients }, async (_, c) => {
    while (running) {
      const i = counter++;
      try {
        acknowledged.push(await client.submit(`bg-${c}-${i}`, body(i), "background"));
      } catch (error) {
        errors.push(error instanceof Error ? error.message : String(error));
      }
      await sleep(everyMs);
    }
  });
  return {
    acknowledged,
    errors,
    async stop() {
      running = false;
      await Promise.all(loops);
    },
  };
}
