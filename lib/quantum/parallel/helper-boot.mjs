// Entry of a kernel helper thread: worker threads do not inherit `--import tsx`, so register
// the TypeScript loader (the engine's source is TypeScript), then load the helper module. A
// failure is also written to the shared boot word (−1): the engine thread waiting for this
// helper cannot receive the worker's error event while it blocks in Atomics.wait.
import { workerData } from "node:worker_threads";

try {
  const { register } = await import("tsx/esm/api");
  register();
  await import(workerData.entry);
} catch (error) {
  const word = new Int32Array(workerData.boot);
  Atomics.store(word, 0, -1);
  Atomics.notify(word, 0);
  throw error;
}
