// The production build against the test cluster, as `npm start` serves it.
import { randomUUID } from "node:crypto";
import { startProductionServer as start, type RunningServer } from "../../scripts/lib/production-server";
import { testDatabaseUrl, testSessionSecret } from "./app";

export type { RunningServer };

/**
 * `port` to start again where a stopped one listened; `env` for settings such as SMTP_URL. Each
 * server counts rate-limited attempts in a namespace of its own, unless `env` names one (two
 * processes of one deployment share theirs).
 */
export function startProductionServer(options: { port?: number; env?: Record<string, string> } = {}): Promise<RunningServer> {
  const env = { RATE_LIMIT_NAMESPACE: `test-${randomUUID()}:`, ...options.env };
  return start({ databaseUrl: testDatabaseUrl(), sessionSecret: testSessionSecret, ...options, env });
}
