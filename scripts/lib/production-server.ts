// The production build served by server/index.ts in a child process, as `npm start` serves it:
// used by the browser and integration tests and by `npm run bench:http`.
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { freePort } from "./postgres";
import { projectRoot } from "./steps";

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

export async function startProductionServer(options: { databaseUrl: string; sessionSecret: string }): Promise<RunningServer> {
  const port = await freePort();
  const child: ChildProcess = spawn(path.join(projectRoot, "node_modules/.bin/tsx"), ["server/index.ts"], {
    cwd: projectRoot,
    env: {
      ...process.env,
      NODE_ENV: "production",
      DATABASE_URL: options.databaseUrl,
      SESSION_SECRET: options.sessionSecret,
      PORT: String(port),
      LOG_LEVEL: "warn",
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
  return {
    url,
    stop: () =>
      new Promise((resolve) => {
        child.once("exit", () => resolve());
        child.kill("SIGTERM");
      }),
  };
}
