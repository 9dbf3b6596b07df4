// The production build served by server/index.ts in a child process, as `npm start` serves it:
// used by the browser and integration tests and by `npm run bench:http`.
import { spawn, type ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import { freePort } from "./postgres";
import { projectRoot } from "./steps";

export interface RunningServer {
  url: string;
  /** The server's process id (its memory is read from /proc by the benchmark). */
  pid: number;
  stop(): Promise<void>;
  /** Ends the process at once (SIGKILL), as a crash or a power cut would: no shutdown runs. */
  kill(): Promise<void>;
}

/** A server's resident memory in MiB, from /proc (the benchmarks read it). */
export function residentMiB(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, "utf8").split("\n").find((l) => l.startsWith("VmRSS:"))!;
  return Number(line.replace(/\D+/g, "")) / 1024;
}

/** The resident memory of a process and its children (the primary and its workers), in MiB. */
export function residentTreeMiB(pid: number): number {
  const children = readFileSync(`/proc/${pid}/task/${pid}/children`, "utf8").trim().split(/\s+/).filter(Boolean).map(Number);
  return residentMiB(pid) + children.reduce((sum, child) => sum + residentTreeMiB(child), 0);
}

export async function startProductionServer(options: { databaseUrl: string; sessionSecret: string; port?: number; env?: Record<string, string> }): Promise<RunningServer> {
  const port = options.port ?? (await freePort());
  // Node itself with tsx's loader, not the tsx command: that one runs the server in a child of its
  // own, which a SIGKILL (kill(), as a crash would) leaves running.
  const child: ChildProcess = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    cwd: projectRoot,
    env: {
      ...process.env,
      NODE_ENV: "production",
      DATABASE_URL: options.databaseUrl,
      SESSION_SECRET: options.sessionSecret,
      PORT: String(port),
      LOG_LEVEL: "warn",
      // One process unless a test asks for more: a test that kills the server kills all of it.
      WORKERS: "1",
      ...options.env,
    },
    stdio: ["ignore", "pipe", "inherit"],
  });
  const url = `http://127.0.0.1:${port}`;
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error("the production server did not start within 30 s")), 30_000);
    child.stdout!.on("data", (chunk: Buffer) => {
      if (chunk.toString().includes("Fairweigh is serving")) {
        clearTimeout(timer);
        resolve();
      }
    });
    child.once("exit", (code) => reject(new Error(`the production server exited with code ${code}`)));
  });
  const end = (signal: NodeJS.Signals) =>
    new Promise<void>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once("exit", () => resolve());
      child.kill(signal);
    });
  return { url, pid: child.pid!, stop: () => end("SIGTERM"), kill: () => end("SIGKILL") };
}
