// Changes to what released pages show, announced by the database itself (triggers of migration 0021
// notify the channel fairweigh_versions with the brief's slug on commit) and heard by every server
// process, which then forgets what it remembered of that brief.
import type pg from "pg";

export const versionsChannel = "fairweigh_versions";

/**
 * Listens on one connection of the pool for as long as the process runs; a lost connection is
 * replaced after a second (what changed meanwhile shows within the memo's two seconds anyway).
 */
export function listenForVersionChanges(pool: pg.Pool, onChange: (slug: string) => void, onError: (error: Error) => void = () => {}): { stop(): Promise<void> } {
  let client: pg.PoolClient | null = null;
  let stopped = false;
  let retry: NodeJS.Timeout | null = null;
  const connect = async () => {
    try {
      const connection = await pool.connect();
      if (stopped) return connection.release();
      client = connection;
      connection.on("notification", (message) => {
        if (message.channel === versionsChannel && message.payload) onChange(message.payload);
      });
      connection.on("error", (error) => {
        onError(error);
        connection.release(true);
        client = null;
        if (!stopped) retry = setTimeout(() => void connect(), 1000);
      });
      await connection.query(`LISTEN ${versionsChannel}`);
    } catch (error) {
      onError(error as Error);
      if (!stopped) retry = setTimeout(() => void connect(), 1000);
    }
  };
  void connect();
  return {
    async stop() {
      stopped = true;
      if (retry) clearTimeout(retry);
      if (client) {
        await client.query(`UNLISTEN ${versionsChannel}`).catch(() => {});
        client.release();
        client = null;
      }
    },
  };
}
