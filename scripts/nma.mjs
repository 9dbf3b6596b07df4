// npm run nma: the engine's command line (METHODS.md §11) from a prebuilt JavaScript bundle, so that
// a run spends its time on the analysis rather than on compiling TypeScript. The bundle is built
// with the site (`npm run build`) and rebuilt here when it is missing or older than its sources.
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { bundle, cliBundle } from "./lib/cli-bundle.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

/** The newest modification time among the engine's sources and this command line. */
function newestSource() {
  const times = [statSync(path.join(root, "scripts/nma.ts")).mtimeMs, statSync(path.join(root, "package.json")).mtimeMs];
  const walk = (folder) => {
    for (const entry of readdirSync(folder, { withFileTypes: true })) {
      const file = path.join(folder, entry.name);
      if (entry.isDirectory()) walk(file);
      else if (entry.name.endsWith(".ts")) times.push(statSync(file).mtimeMs);
    }
  };
  walk(path.join(root, "server/core"));
  return Math.max(...times);
}

if (!existsSync(cliBundle) || statSync(cliBundle).mtimeMs < newestSource()) {
  const built = await bundle();
  if (!built.ok) {
    process.stderr.write(`the command line could not be built: ${built.reason}\n`);
    process.exit(2);
  }
}
// The bundle reads process.argv itself, as scripts/nma.ts does.
await import(pathToFileURL(cliBundle).href);
