// Starts the server against DATABASE_URL: applies pending migrations, then listens.
// It never seeds: demo content is only for the local cluster that scripts/start.ts manages.
import cluster from "node:cluster";
import type { Server } from "node:http";
import { createApp, logDestination } from "#web/app";
import { readConfig, type ServerConfig } from "./config";
import { connectDatabase } from "#db/client";
import { migrateDatabase } from "#db/migrate";
import { defaultQueueOptions, startQueue } from "#workflows/queue";
import { startMailWorker } from "#workflows/mail";
import { requestPurge, startPurgeWorker } from "#workflows/purge";
import { startAnalysisWorker } from "#workflows/analysis";
import { startAccountWorker } from "#workflows/accounts";
import { startReleaseWorker } from "#workflows/alerts";
import { startSubscriptionWorker } from "#workflows/subscriptions";

/** The exit code of a process whose output pipe is gone (EX_IOERR of sysexits.h). */
const outputGone = 74;

/**
 * Whatever read this output is gone (a supervisor killed without stopping the server): every log line
 * would fail with EPIPE, over and over, at full CPU. Nobody is left to serve; the process ends.
 */
function endWhenOutputGone(stream: NodeJS.EventEmitter): void {
  stream.on("error", (error: NodeJS.ErrnoException) => {
    if (error.code === "EPIPE") process.exit(outputGone);
  });
}

/** `migrate: false` in the processes of a cluster, whose primary migrated once before forking them. */
export async function startServer(config: ServerConfig, { migrate = true } = {}): Promise<{ url: string; close(): Promise<void> }> {
  const connection = connectDatabase(config.databaseUrl);
  if (migrate) await migrateDatabase(connection);
  // The job queue runs in the server's process: e-mail is delivered only where SMTP_URL says how.
  const queue = await startQueue(config.databaseUrl, { ...defaultQueueOptions, retryDelaySeconds: config.mailRetryDelaySeconds, expirySeconds: config.jobExpirySeconds }, (error) => console.error("queue:", error.message));
  const mail = { db: connection.db, queue, siteUrl: config.publicUrl };
  await startAccountWorker(mail);
  await startReleaseWorker(mail);
  await startSubscriptionWorker(mail);
  if (config.purgeUrl) await startPurgeWorker(queue, config.purgeUrl);
  await startAnalysisWorker(connection.db, queue);
  if (config.smtpUrl) await startMailWorker(queue, connection.db, config.smtpUrl);
  else console.warn("SMTP_URL is not set: e-mails are stored and wait in the queue until it is.");
  // The request log writes to standard output through a stream of its own, which fails the same way.
  const log = logDestination(config.logLevel);
  endWhenOutputGone(log);
  const app = await createApp({
    logDestination: log,
    queue,
    db: connection.db,
    pool: connection.pool,
    sessionSecret: config.sessionSecret,
    production: config.production,
    secureTransport: config.secureTransport,
    logLevel: config.logLevel,
    publicUrl: config.publicUrl,
    mailFolder: config.mailFolder,
    rateLimitNamespace: config.rateLimitNamespace,
    onVersionsChanged: config.purgeUrl ? (slug) => void requestPurge(queue, slug).catch((error: Error) => console.error("purge:", error.message)) : undefined,
  });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(config.port, config.host, () => resolve(listening));
  });
  return {
    url: `http://${config.host}:${config.port}`,
    /**
     * Stops taking requests, lets those under way finish (five seconds at most, then their connections
     * are cut), and closes the database pool. Idle keep-alive connections would otherwise hold it open.
     */
    async close() {
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeIdleConnections();
      const cut = setTimeout(() => server.closeAllConnections(), 5000);
      await closed;
      clearTimeout(cut);
      await queue.stop();
      await (app.locals.stopListening as (() => Promise<void>) | undefined)?.();
      await connection.close();
    },
  };
}

/**
 * WORKERS processes share the port through node:cluster: the primary migrates once, forks them, and
 * replaces one that dies; everything they must share lives in PostgreSQL (docs/operations.md).
 */
async function runCluster(config: ServerConfig): Promise<void> {
  const connection = connectDatabase(config.databaseUrl);
  await migrateDatabase(connection);
  await connection.close();
  let stopping = false;
  let listening = 0;
  const fork = () => cluster.fork({ FAIRWEIGH_CLUSTER_WORKER: "1" });
  cluster.on("listening", () => {
    listening += 1;
    if (listening === config.workers) console.log(`Fairweigh is serving http://${config.host}:${config.port} (${config.workers} processes)`);
  });
  cluster.on("exit", (worker, code, signal) => {
    if (stopping) return;
    // The processes share one output: when a process finds it gone, so has this one (whose console
    // ignores the failed writes), and nobody is left to read or to stop them.
    if (code === outputGone) {
      stop();
      return;
    }
    console.error(`a server process (${worker.process.pid}) ended (${signal ?? code}): starting another`);
    fork();
  });
  for (let i = 0; i < config.workers; i++) fork();
  const stop = () => {
    stopping = true;
    const workers = Object.values(cluster.workers ?? {});
    let left = workers.length;
    if (left === 0) process.exit(0);
    for (const worker of workers) {
      worker?.once("exit", () => {
        left -= 1;
        if (left === 0) process.exit(0);
      });
      worker?.process.kill("SIGTERM");
    }
  };
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);
}

const isEntryPoint = import.meta.url === `file://${process.argv[1]}`;
if (isEntryPoint) {
  endWhenOutputGone(process.stdout);
  endWhenOutputGone(process.stderr);
  const config = readConfig();
  if (cluster.isPrimary && config.workers > 1) {
    await runCluster(config);
  } else {
    const server = await startServer(config, { migrate: !cluster.isWorker });
    if (cluster.isPrimary) console.log(`Fairweigh is serving ${server.url}`);
    const stop = async () => {
      // A clean stop waits for requests under way and the queue; with the database gone that could be
      // forever, so after ten seconds the process ends anyway (what was committed is safe).
      setTimeout(() => process.exit(1), 10_000).unref();
      await server.close();
      process.exit(0);
    };
    process.once("SIGINT", stop);
    process.once("SIGTERM", stop);
    // A process of a cluster whose primary is gone takes no more requests: it ends.
    if (cluster.isWorker) process.once("disconnect", () => void stop());
  }
}
