// The engine off the event loop: parsing and analysing an upload (seconds for a large or broken
// file) runs in this worker thread, so the server keeps answering meanwhile. Messages carry plain
// data; a DatasetError comes back as its issues.
import { parentPort } from "node:worker_threads";
import { analyse } from "#core/nma/analyse";
import { parseDataset } from "#core/nma/parse";
import { DatasetError, type AnalysisOptions, type Format, type ParsedDataset } from "#core/nma/types";

/** `settings: null`: read the file by the rules of the input formats only (a large upload, before it is queued). */
export type EngineWork = { settings: AnalysisOptions | null } & ({ bytes: Uint8Array; format: Format } | { parsed: ParsedDataset });
export type AnalysisJob = EngineWork & { id: number };

parentPort?.on("message", (job: AnalysisJob) => {
  try {
    const parsed = "parsed" in job ? job.parsed : parseDataset(job.bytes, job.format);
    // Only the check is sent back for a parse alone: the parsed rows stay in the thread.
    if (job.settings === null) parentPort!.postMessage({ id: job.id, parsed: null, result: null });
    else parentPort!.postMessage({ id: job.id, parsed, result: analyse(parsed, job.settings) });
  } catch (error) {
    if (error instanceof DatasetError) parentPort!.postMessage({ id: job.id, issues: error.issues });
    else parentPort!.postMessage({ id: job.id, failure: error instanceof Error ? error.message : String(error) });
  }
});
