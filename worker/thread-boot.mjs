// Entry of an engine thread: worker threads do not inherit `--import tsx`, so
// register the TypeScript loader here, then load the TypeScript entry.
import { workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
await import(workerData.entry);
