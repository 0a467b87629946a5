/**
 * An EngineRunner that records each run in the worker's metrics: engine
 * seconds by method, and the run's engine latency by method, size class and
 * outcome (lib/observability/metrics.ts).
 */
import { metrics, sizeClass } from "@/lib/observability/metrics";
import type { EngineRunner } from "@/lib/runs/engine-runner";

export function meteredEngine(engine: EngineRunner): EngineRunner {
  return {
    async run(request, options) {
      const outcome = await engine.run(request, options);
      const method = request.method ?? "statevector";
      const seconds = outcome.elapsedMs / 1000;
      const size = outcome.kind === "result" ? sizeClass(outcome.result.qubits) : "unknown";
      const m = metrics();
      m.engineSeconds.inc({ method }, seconds);
      m.runDuration.observe({ method, size, outcome: outcome.kind }, seconds);
      return outcome;
    },
  };
}
