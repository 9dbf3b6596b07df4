// The job queue for background work, kept in PostgreSQL by pg-boss (its own schema, `pgboss`): a job
// survives a restart of the server, and a failed one is retried with exponential back-off
// (docs/decisions/0020-mail-through-a-queue.md). A job can be written inside the caller's transaction,
// so that the change and the work it asks for commit together or not at all (decision 0036).
import PgBoss from "pg-boss";
import { positionalSql, type Executor } from "#db/client";

export interface QueueOptions {
  /** How often a failing job is tried again, and the first delay in seconds (doubling each time). */
  retryLimit: number;
  retryDelaySeconds: number;
  /**
   * A job taken by a process that then dies is given up after this long and tried again; the
   * queue's maintenance looks for such jobs every half of it (30 s at most). Every job here finishes
   * in seconds (an e-mail, an alert, a purge; the largest upload the desk accepts is analysed in well
   * under a minute), so a minute is ample, and a dead process's job runs again within two
   * (60 s + 30 s + the first retry delay).
   */
  expirySeconds: number;
}

/** The defaults: 12 retries from 10 s doubling, about 11 hours in all before a job is given up. */
export const defaultQueueOptions: QueueOptions = { retryLimit: 12, retryDelaySeconds: 10, expirySeconds: 60 };

export interface SendOptions {
  /** Only one job of this key at a time is useful (the worker checks again what it is asked). */
  singletonKey?: string;
  /** Not before this time (a release). */
  startAfter?: Date;
  /** The transaction to write the job in: it is taken only if that transaction commits. */
  in?: Executor;
}

export interface Queue {
  send(name: string, data: object, options?: SendOptions): Promise<void>;
  work<T extends object>(name: string, handler: (job: { data: T; retryCount: number; retryLimit: number }) => Promise<void>): Promise<void>;
  stop(): Promise<void>;
}

export async function startQueue(databaseUrl: string, options: QueueOptions = defaultQueueOptions, onError: (error: Error) => void = () => {}): Promise<Queue> {
  // Each worker's poll holds a connection while it runs (five workers), and sending needs its own.
  const boss = new PgBoss({ connectionString: databaseUrl, schema: "pgboss", max: 10, maintenanceIntervalSeconds: Math.max(1, Math.min(30, Math.floor(options.expirySeconds / 2))) });
  boss.on("error", onError);
  await boss.start();
  // Several processes starting together create the same queues at once: one of them wins, and a
  // loser's error (a unique violation, or a deadlock between the two inserts) is tried again. A queue
  // once seen is remembered: sending a job is then one statement.
  const known = new Set<string>();
  const ensureQueue = async (name: string) => {
    for (let attempt = 1; !known.has(name); attempt++) {
      try {
        if (!(await boss.getQueue(name))) await boss.createQueue(name);
        known.add(name);
      } catch (error) {
        if (await boss.getQueue(name)) known.add(name);
        else if (attempt === 5) throw error;
        else await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200 * attempt));
      }
    }
  };
  return {
    async send(name, data, { singletonKey, startAfter, in: tx } = {}) {
      await ensureQueue(name);
      await boss.send(name, data, {
        retryLimit: options.retryLimit,
        retryDelay: options.retryDelaySeconds,
        retryBackoff: true,
        expireInSeconds: options.expirySeconds,
        singletonKey,
        startAfter,
        // pg-boss writes through anything with `executeSql(text, values)`.
        db: tx ? { executeSql: positionalSql(tx) } : undefined,
      });
    },
    async work(name, handler) {
      await ensureQueue(name);
      // Up to ten jobs at a time, each on its own: one that fails is marked failed (and retried
      // later) while the others complete, so a backlog drains quickly after an outage.
      await boss.work<object>(name, { includeMetadata: true, batchSize: 10, pollingIntervalSeconds: 0.5 }, async (jobs) => {
        await Promise.all(
          jobs.map(async (job) => {
            try {
              await handler({ data: job.data as never, retryCount: job.retryCount, retryLimit: job.retryLimit });
            } catch (error) {
              await boss.fail(name, job.id, { message: error instanceof Error ? error.message : String(error) });
            }
          }),
        );
      });
    },
    stop: () => boss.stop({ graceful: true, timeout: 5000 }),
  };
}
