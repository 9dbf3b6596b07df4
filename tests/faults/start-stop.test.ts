// `npm start` stops what it started — the web processes and its PostgreSQL — on SIGINT (Ctrl-C) and on
// SIGTERM (a supervisor), and says so (hostile probe round 3: SIGTERM left PostgreSQL running). The
// real command, in a folder of its own and on free ports, serving the build the suite already made.
import { spawn } from "node:child_process";
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { freePort } from "../../scripts/lib/postgres";
import { projectRoot } from "../../scripts/lib/steps";

/** Whether anything answers on a port of this machine. */
async function answers(port: number): Promise<boolean> {
  try {
    await fetch(`http://127.0.0.1:${port}/api/health`, { signal: AbortSignal.timeout(2000) });
    return true;
  } catch {
    return false;
  }
}

describe("npm start, stopped by a signal", () => {
  it.each(["SIGTERM", "SIGINT"] as const)("on %s stops the web processes and PostgreSQL, and says so", async (signal) => {
    const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-start-"));
    // The `postgres` user (when running as root) must be able to reach its data folder inside.
    chmodSync(folder, 0o755);
    const [port, pgPort] = [await freePort(), await freePort()];
    // As a developer starts it: no database or secret given, so it makes its own.
    const env = Object.fromEntries(Object.entries(process.env).filter(([name]) => name !== "DATABASE_URL" && name !== "SESSION_SECRET"));
    const child = spawn("npm", ["start"], {
      cwd: projectRoot,
      env: { ...env, PORT: String(port), PGPORT: String(pgPort), FAIRWEIGH_DATA: folder, SKIP_BUILD: "1" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let output = "";
    child.stdout.on("data", (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on("data", (chunk: Buffer) => (output += chunk.toString()));
    const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
    try {
      for (let i = 0; i < 1200 && !output.includes("Press Ctrl-C"); i++) await new Promise((resolve) => setTimeout(resolve, 100));
      expect(output, "npm start did not come up within two minutes").toContain("Press Ctrl-C");
      const postmaster = path.join(folder, "postgres", "postmaster.pid");
      expect(existsSync(postmaster)).toBe(true);
      expect(await answers(port)).toBe(true);

      child.kill(signal);
      expect(await exited).toBe(0);
      expect(output).toContain("The web server has stopped");
      expect(output).toContain("PostgreSQL has stopped");
      expect(await answers(port), "the web server still answers").toBe(false);
      expect(existsSync(postmaster), "PostgreSQL is still running").toBe(false);
    } finally {
      if (child.exitCode === null) child.kill("SIGKILL");
      // A PostgreSQL left running by a failure is stopped here (SIGINT: its fast shutdown).
      const pidFile = path.join(folder, "postgres", "postmaster.pid");
      if (existsSync(pidFile)) process.kill(Number(readFileSync(pidFile, "utf8").split("\n")[0]), "SIGINT");
      await new Promise((resolve) => setTimeout(resolve, 500));
      rmSync(folder, { recursive: true, force: true });
    }
  }, 180_000);
});
