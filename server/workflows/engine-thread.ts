// One worker thread for the engine, started on first use and kept (docs/decisions/0016-engine-off-the-event-loop.md).
// Jobs queue in the worker in the order they are sent. The worker registers tsx first
// (analysis-worker-boot.mjs), so that it runs the TypeScript engine as the server does; a worker
// that dies is replaced on the next job.
import { Worker } from "node:worker_threads";
import type { AnalysisResult } from "#core/nma/analyse";
import { DatasetError, type AnalysisOptions, type DatasetIssue, type Format, type ParsedDataset } from "#core/nma/types";
import type { AnalysisJob, EngineWork } from "./analysis-worker";

type Answer = { id: number; parsed: ParsedDataset; result: AnalysisResult } | { id: number; issues: DatasetIssue[] } | { id: number; failure: string };
type Pending = { resolve: (value: { parsed: ParsedDataset; result: AnalysisResult }) => void; reject: (error: Error) => void };

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, Pending>();

function failAll(error: Error): void {
  for (const job of pending.values()) job.reject(error);
  pending.clear();
  worker = null;
}

function engine(): Worker {
  if (worker) return worker;
  const started = new Worker(new URL("./analysis-worker-boot.mjs", import.meta.url), { workerData: { entry: new URL("./analysis-worker.ts", import.meta.url).href } });
  started.unref();
  started.on("message", (answer: Answer) => {
    const job = pending.get(answer.id);
    if (!job) return;
    pending.delete(answer.id);
    if ("issues" in answer) job.reject(new DatasetError(answer.issues));
    else if ("failure" in answer) job.reject(new Error(`the engine failed: ${answer.failure}`));
    else job.resolve({ parsed: answer.parsed, result: answer.result });
  });
  started.on("error", (error) => failAll(error));
  started.on("exit", (code) => {
    if (worker === started) failAll(new Error(`the engine's thread stopped (exit code ${code})`));
  });
  worker = started;
  return started;
}

function run(job: EngineWork): Promise<{ parsed: ParsedDataset; result: AnalysisResult }> {
  return new Promise((resolve, reject) => {
    const id = nextId++;
    pending.set(id, { resolve, reject });
    engine().postMessage({ ...job, id } as AnalysisJob);
  });
}

/** Parses and analyses an uploaded file; rejects with DatasetError when the file breaks a rule. */
export const parseAndAnalyse = (bytes: Uint8Array, format: Format, settings: AnalysisOptions) => run({ bytes, format, settings });

/** Reads a file by the rules of the input formats only; rejects with DatasetError when it breaks one. */
export const checkFile = async (bytes: Uint8Array, format: Format): Promise<void> => {
  await run({ bytes, format, settings: null });
};

/** Analyses parsed data again (the outcome's settings changed). */
export const analyseParsed = async (parsed: ParsedDataset, settings: AnalysisOptions) => (await run({ parsed, settings })).result;
