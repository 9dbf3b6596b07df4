// The production build against the test cluster, as `npm start` serves it.
import { startProductionServer as start, type RunningServer } from "../../scripts/lib/production-server";
import { testDatabaseUrl, testSessionSecret } from "./app";

export type { RunningServer };

/** `port` to start again where a stopped one listened; `env` for settings such as SMTP_URL. */
export function startProductionServer(options: { port?: number; env?: Record<string, string> } = {}): Promise<RunningServer> {
  return start({ databaseUrl: testDatabaseUrl(), sessionSecret: testSessionSecret, ...options });
}
