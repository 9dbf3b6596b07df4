// Plain JavaScript, because it starts the engine's worker thread before TypeScript can be loaded
// there: it registers tsx in this thread, then loads the worker written in TypeScript.
import { workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
await import(workerData.entry);
