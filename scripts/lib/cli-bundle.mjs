// The engine's command line as one JavaScript file (dist/cli/nma.mjs), bundled by esbuild from
// scripts/nma.ts: the project's import aliases (#core/…) resolve through package.json "imports".
import path from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
export const cliBundle = path.join(root, "dist/cli/nma.mjs");

export async function bundle() {
  try {
    await build({
      entryPoints: [path.join(root, "scripts/nma.ts")],
      outfile: cliBundle,
      bundle: true,
      platform: "node",
      format: "esm",
      target: "node20",
      // Packages that load CommonJS need require in an ES module.
      banner: { js: "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);" },
      minify: true,
      logLevel: "silent",
    });
    return { ok: true };
  } catch (error) {
    return { ok: false, reason: error instanceof Error ? error.message : String(error) };
  }
}

// `node scripts/lib/cli-bundle.mjs` builds it (npm run build does).
if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const built = await bundle();
  if (!built.ok) {
    console.error(built.reason);
    process.exit(1);
  }
}
