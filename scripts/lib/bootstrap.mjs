// Plain JavaScript, because it runs before the npm packages (TypeScript among them) are installed.
// Installs the packages when node_modules is missing or older than package-lock.json, then runs
// a TypeScript script with tsx.
import { spawn, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const stamp = path.join(root, "node_modules", ".fairweigh-lock-sha256");

export function ensurePackages() {
  const lock = readFileSync(path.join(root, "package-lock.json"));
  const digest = createHash("sha256").update(lock).digest("hex");
  if (existsSync(stamp) && readFileSync(stamp, "utf8") === digest) return;
  console.log("Installing npm packages (npm ci)…");
  const result = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (result.status !== 0) {
    console.error("npm ci failed; see the messages above.");
    process.exit(result.status ?? 1);
  }
  writeFileSync(stamp, digest);
}

/** Runs scripts/<name>.ts and exits with its exit code. Ctrl-C reaches the child, which cleans up. */
export function runTypeScript(script, args) {
  const child = spawn(path.join(root, "node_modules", ".bin", "tsx"), [path.join(root, script), ...args], {
    cwd: root,
    stdio: "inherit",
  });
  // The terminal sends Ctrl-C to the whole process group: the child handles it, this process waits.
  for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => child.kill(signal));
  child.on("exit", (code, signal) => process.exit(code ?? (signal ? 130 : 1)));
}
