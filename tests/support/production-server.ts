// The production build against the test cluster, as `npm start` serves it.
import { startProductionServer as start, type RunningServer } from "../../scripts/lib/production-server";
import { testDatabaseUrl, testSessionSecret } from "./app";

export type { RunningServer };

export function startProductionServer(): Promise<RunningServer> {
  return start({ databaseUrl: testDatabaseUrl(), sessionSecret: testSessionSecret });
}
