// npm start: a local PostgreSQL cluster under .data/, migrations, the demo seed, a production
// build, and the server. With DATABASE_URL set, it uses that database and seeds nothing.
// `npm run dev` does the same with Vite's development server instead of a build. FAIRWEIGH_DATA
// moves the folder of the cluster and the mail (.data/ by default); SKIP_BUILD=1 serves the build
// already in dist/ (a quick restart; the test of stopping uses both).
import { spawn } from "node:child_process";
import path from "node:path";
import { demoAccounts, demoPassword } from "#workflows/seed";
import { ensureCluster, freePort, type Cluster } from "./lib/postgres";
import { startMailbox } from "./lib/mailbox";
import { build, localSecret, log, migrateAndSeed, projectRoot } from "./lib/steps";

const development = process.argv.includes("--dev");
const port = Number(process.env.PORT ?? 3000);
const dataFolder = process.env.FAIRWEIGH_DATA ? path.resolve(process.env.FAIRWEIGH_DATA) : path.join(projectRoot, ".data");

let cluster: Cluster | null = null;
let databaseUrl = process.env.DATABASE_URL;
if (databaseUrl) {
  log("Using the database in DATABASE_URL: no local cluster, no demo content");
} else {
  cluster = await ensureCluster({
    dataDir: path.join(dataFolder, "postgres"),
    port: Number(process.env.PGPORT ?? 54329),
    log,
  });
  databaseUrl = cluster.url;
  log(`PostgreSQL is listening on 127.0.0.1:${cluster.port}`);
}

try {
  await migrateAndSeed(databaseUrl, cluster !== null);
  if (!development && process.env.SKIP_BUILD !== "1") build();
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  cluster?.stop();
  process.exit(1);
}

// E-mail goes to a fake SMTP server on loopback that keeps every message under .data/mail/, unless
// SMTP_URL names a real one (docs/operations.md).
const mailbox = process.env.SMTP_URL ? null : await startMailbox({ port: await freePort(), folder: path.join(dataFolder, "mail") });

const sessionSecret =
  process.env.SESSION_SECRET ?? (cluster ? localSecret(path.join(dataFolder, "session-secret")) : undefined);
const server = spawn(path.join(projectRoot, "node_modules", ".bin", "tsx"), [path.join(projectRoot, "server/index.ts")], {
  cwd: projectRoot,
  stdio: ["inherit", "pipe", "inherit"],
  env: {
    ...process.env,
    NODE_ENV: development ? "development" : "production",
    DATABASE_URL: databaseUrl,
    PORT: String(port),
    ...(mailbox ? { SMTP_URL: mailbox.url, MAIL_FOLDER: path.join(dataFolder, "mail") } : {}),
    ...(sessionSecret ? { SESSION_SECRET: sessionSecret } : {}),
  },
});

// Request logs are JSON lines; the one plain line the server prints is its URL, followed here by the accounts.
server.stdout.on("data", (chunk: Buffer) => {
  process.stdout.write(chunk);
  if (chunk.toString().includes("Fairweigh is serving")) {
    console.log("");
    console.log(`  Open http://127.0.0.1:${port}`);
    if (mailbox) console.log(`  E-mail is kept, not sent: every message is a JSON file in ${path.relative(projectRoot, path.join(dataFolder, "mail"))}/`);
    if (cluster) {
      console.log(`  Demo accounts (password ${demoPassword}):`);
      for (const account of demoAccounts) console.log(`    ${account.email.padEnd(32)} ${account.roles.join(", ")}`);
    }
    console.log("  Press Ctrl-C to stop the server and the database.");
    console.log("");
  }
});

let stopping = false;
function stop(signal: NodeJS.Signals) {
  if (stopping) return;
  stopping = true;
  server.kill(signal);
}
process.on("SIGINT", () => stop("SIGINT"));
process.on("SIGTERM", () => stop("SIGTERM"));

server.on("exit", async (code) => {
  log(stopping ? "The web server has stopped" : `The web server ended by itself (exit code ${code})`);
  await mailbox?.stop();
  if (cluster) {
    log("Stopping PostgreSQL");
    cluster.stop();
    log("PostgreSQL has stopped");
  }
  process.exit(stopping ? 0 : (code ?? 1));
});
