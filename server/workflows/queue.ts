// The job queue for background work, kept in PostgreSQL by pg-boss (its own schema, `pgboss`): a job
// survives a restart of the server, and a failed one is retried with exponential back-off
// (docs/decisions/0020-mail-through-a-queue.md). E-mail is its first use.
import PgBoss from "pg-boss";

export interface QueueOptions {
  /** How often a failing job is tried again, and the first delay in seconds (doubling each time). */
  retryLimit: number;
  retryDelaySeconds: number;
}

/** The defaults: 12 retries from 10 s doubling, about 11 hours in all before a job is given up. */
export const defaultQueueOptions: QueueOptions = { retryLimit: 12, retryDelaySeconds: 10 };

export interface Queue {
  /** `startAfter`: not before this time (a release). */
  send(name: string, data: object, singletonKey?: string, startAfter?: Date): Promise<void>;
  work<T extends object>(name: string, handler: (job: { data: T; retryCount: number; retryLimit: number }) => Promise<void>): Promise<void>;
  stop(): Promise<void>;
}

export async function startQueue(databaseUrl: string, options: QueueOptions = defaultQueueOptions, onError: (error: Error) => void = () => {}): Promise<Queue> {
  const boss = new PgBoss({ connectionString: databaseUrl, schema: "pgboss", max: 4 });
  boss.on("error", onError);
  await boss.start();
  // Several processes starting together create the same queues at once: one of them wins, and a
  // loser's error (a unique violation, or a deadlock between the two inserts) is tried again.
  const ensureQueue = async (name: string) => {
    for (let attempt = 1; ; attempt++) {
      if (await boss.getQueue(name)) return;
      try {
        await boss.createQueue(name);
        return;
      } catch (error) {
        if (await boss.getQueue(name)) return;
        if (attempt === 5) throw error;
        await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200 * attempt));
      }
    }
  };
  return {
    async send(name, data, singletonKey, startAfter) {
      await ensureQueue(name);
      await boss.send(name, data, { retryLimit: options.retryLimit, retryDelay: options.retryDelaySeconds, retryBackoff: true, singletonKey, startAfter });
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
