/**
 * `Idempotency-Key` for POST requests. The first result for a key is saved
 * (status and body) once the endpoint has started executing — validation
 * failures (400/404) are not saved, so a corrected retry can reuse the key.
 * A repeat with the same method, path and parameters gets the saved answer
 * with `Idempotent-Replayed: true`; different parameters get a 400
 * `idempotency_error`. Keys are scoped per API key and pruned after 24 h.
 */
import { createHash } from "node:crypto";
import { ApiError } from "../core/errors";
import type { FakeState, IdempotencyRec } from "../core/state";

const DAY_MS = 24 * 3600 * 1000;

export function fingerprint(body: unknown): string {
  return createHash("sha256").update(JSON.stringify(body)).digest("hex");
}

export function lookupIdempotent(
  state: FakeState,
  scopedKey: string,
  method: string,
  path: string,
  print: string,
  nowMs: number,
): IdempotencyRec | null {
  const saved = state.idempotency[scopedKey];
  if (!saved) return null;
  if (nowMs - saved.saved_ms > DAY_MS) {
    delete state.idempotency[scopedKey];
    return null;
  }
  if (saved.method !== method || saved.path !== path || saved.fingerprint !== print) {
    throw new ApiError(
      400,
      "idempotency_error",
      `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${scopedKey.split(":").slice(1).join(":")}' if you meant to execute a different request.`,
    );
  }
  return saved;
}

export function shouldSave(status: number): boolean {
  return status < 400 || status === 402 || status >= 500;
}

export function pruneIdempotency(state: FakeState, nowMs: number): void {
  for (const [key, rec] of Object.entries(state.idempotency)) {
    if (nowMs - rec.saved_ms > DAY_MS) delete state.idempotency[key];
  }
}
