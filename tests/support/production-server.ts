// The production build against the test cluster, as `npm start` serves it.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll } from "vitest";
import { startProductionServer as start, type RunningServer } from "../../scripts/lib/production-server";
import { testDatabaseUrl, testSessionSecret } from "./app";
import { type ApiClient, demoClient } from "./client";

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

/**
 * The production server of a test file, started before its tests and stopped after them, with a
 * client signed in for each demo account named ("analyst" for analyst@fairweigh.example). `server`
 * and `clients` are filled in before the first test runs.
 */
export function withProductionServer(accounts: readonly string[] = [], options: Parameters<typeof startProductionServer>[0] = {}): { server: RunningServer; clients: Record<string, ApiClient> } {
  const server = {} as RunningServer;
  const clients: Record<string, ApiClient> = {};
  beforeAll(async () => {
    Object.assign(server, await startProductionServer(options));
    for (const account of accounts) clients[account] = await demoClient(server.url, account);
  }, 60_000);
  afterAll(async () => {
    await server.stop?.();
  });
  return { server, clients };
}
