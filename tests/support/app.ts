// An in-process server on a free port, against the test cluster that scripts/test.ts started.
import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import pg from "pg";
import { afterAll, beforeAll } from "vitest";
import { createApp, type AppOptions } from "#web/app";
import { connectDatabase, type DatabaseConnection } from "#db/client";

export function testDatabaseUrl(): string {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error("TEST_DATABASE_URL is not set: run the tests with `npm test`");
  return url;
}

/**
 * Reads of a test file straight from the test database (what e-mails were queued, a version's id):
 * a small pool opened before the file's tests and closed after them.
 */
export function withTestDatabase(): { query: pg.Pool["query"] } {
  let pool: pg.Pool | undefined;
  beforeAll(() => {
    pool = new pg.Pool({ connectionString: testDatabaseUrl(), max: 2 });
  });
  afterAll(async () => {
    await pool?.end();
  });
  return { query: ((...args: Parameters<pg.Pool["query"]>) => pool!.query(...args)) as pg.Pool["query"] };
}

/**
 * A database of a test's own on the test cluster, for a test whose rows nobody else's may touch (a
 * migration, a count of administrators); `drop` removes it and its connections.
 */
export async function ownDatabase(name: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const admin = new pg.Client({ connectionString: testDatabaseUrl() });
  await admin.connect();
  const database = `${name}_${process.pid}`;
  await admin.query(`create database ${database}`);
  const url = new URL(testDatabaseUrl());
  url.pathname = `/${database}`;
  return {
    url: url.toString(),
    drop: async () => {
      try {
        await admin.query(`drop database ${database} with (force)`);
      } finally {
        await admin.end();
      }
    },
  };
}

export const testSessionSecret = "a-session-secret-used-only-by-the-tests-0123456789";

export interface TestApp {
  url: string;
  connection: DatabaseConnection;
  close(): Promise<void>;
}

/** `databaseUrl` defaults to the test cluster; a test of an unreachable database passes its own. */
export async function startTestApp(databaseUrl = testDatabaseUrl(), options: Partial<AppOptions> = {}): Promise<TestApp> {
  const connection = connectDatabase(databaseUrl);
  const app = await createApp({
    db: connection.db,
    pool: connection.pool,
    sessionSecret: testSessionSecret,
    production: false,
    secureTransport: false,
    logLevel: "silent",
    pages: false,
    // Rate-limited attempts counted apart from every other test server's.
    rateLimitNamespace: `test-${randomUUID()}:`,
    ...options,
  });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(0, "127.0.0.1", () => resolve(listening));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    connection,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await connection.close();
    },
  };
}
