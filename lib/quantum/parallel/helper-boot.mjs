// Entry of a kernel helper thread: worker threads do not inherit `--import tsx`, so register
// the TypeScript loader (the engine's source is TypeScript), then load the helper module.
import { workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
await import(workerData.entry);
