/**
 * Light requests while heavy previews run (bench:api phase): one client sends
 * the heaviest preview the caps allow (lib/runs/preview-caps.ts) in a loop to
 * POST /api/v1/runs/preview, while 10 connections GET /api/v1/usage (a light
 * request with a database read) for 20 s. Reported: the light requests' p95
 * without and with the heavy loop, and what the heavy previews answered.
 */
import autocannon from "autocannon";
import { PREVIEW_CAPS } from "@/lib/runs/preview-caps";
import { percentile } from "./bench-stats";

const QUBITS = 12;

/** A circuit of h / rz / cx lines filling the source cap, and PREVIEW_CAPS.terms distinct Pauli words. */
export function heaviestPreview(): Record<string, unknown> {
  const lines = ["OPENQASM 2.0;", 'include "qelib1.inc";', `qreg q[${QUBITS}];`];
  let size = lines.join("\n").length;
  for (let i = 0; ; i++) {
    const line =
      i % 3 === 0
        ? `cx q[${i % QUBITS}],q[${(i + 1) % QUBITS}];`
        : i % 3 === 1
          ? `rz(0.3) q[${i % QUBITS}];`
          : `h q[${i % QUBITS}];`;
    if (size + line.length + 1 > PREVIEW_CAPS.circuitSourceChars) break;
    lines.push(line);
    size += line.length + 1;
  }
  // Word i spells i in base 4 over I, Z, X, Y on the low qubits — distinct words, many settings.
  const terms = Array.from(
    { length: PREVIEW_CAPS.terms },
    (_, i) =>
      `0.01 ${Array.from({ length: QUBITS }, (_, q) => "IZXY"[Math.floor(i / 4 ** q) % 4]).join("")}`,
  ).join(" + ");
  return {
    circuit: { format: "qasm2", source: lines.join("\n") },
    observable: { format: "pauli", terms },
    targetPrecision: 0.01,
  };
}

async function lightLoad(base: string, key: string, seconds: number) {
  const times: number[] = [];
  const instance = autocannon({
    url: `${base}/api/v1/usage`,
    connections: 10,
    duration: seconds,
    headers: { authorization: `Bearer ${key}` },
  });
  instance.on("response", (_c, _s, _b, responseTime) => times.push(responseTime));
  const result = await instance;
  return {
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    requests: result.requests.total,
    errors: result.non2xx + result.errors + result.timeouts,
  };
}

export async function previewIsolationPhase(base: string, key: string, seconds = 20) {
  const baseline = await lightLoad(base, key, seconds);
  const body = JSON.stringify(heaviestPreview());
  const statuses = new Map<number, number>();
  const heavyMs: number[] = [];
  let stop = false;
  const heavyLoop = (async () => {
    while (!stop) {
      const started = performance.now();
      const res = await fetch(`${base}/api/v1/runs/preview`, {
        method: "POST",
        headers: { authorization: `Bearer ${key}`, "content-type": "application/json" },
        body,
      });
      await res.arrayBuffer();
      heavyMs.push(performance.now() - started);
      statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
    }
  })();
  // Let the first heavy preview start before measuring.
  await new Promise((r) => setTimeout(r, 500));
  const loaded = await lightLoad(base, key, seconds);
  stop = true;
  await heavyLoop;
  return {
    baseline,
    loaded,
    heavy: {
      count: heavyMs.length,
      medianMs: percentile(heavyMs, 50),
      statuses: [...statuses].map(([s, n]) => `${n}× ${s}`).join(", "),
    },
    bodyBytes: body.length,
  };
}
