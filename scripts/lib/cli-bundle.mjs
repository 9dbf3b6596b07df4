// The engine's command line as prebuilt CommonJS files in dist/cli (decisions 0026, 0047), bundled by
// esbuild; the project's import aliases (#core/…) resolve through package.json "imports":
//   nma.cjs        scripts/nma.ts, run by scripts/nma.cjs through V8's code cache;
//   inputs.json    every source file it was built from, so that the launcher can tell when it is
//                  stale without loading esbuild.
// A rebuild removes the code cache, which V8 would otherwise accept for a new bundle of the same length.
import { rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import cli from "./cli-paths.cjs";

export async function bundle() {
  try {
    const { build } = await import("esbuild");
    const result = await build({
      entryPoints: [path.join(cli.root, "scripts/nma.ts")],
      outfile: cli.bundle,
      bundle: true,
      platform: "node",
      format: "cjs",
      target: "node20",
      minify: true,
      metafile: true,
      logLevel: "silent",
    });
    const sources = Object.keys(result.metafile.inputs).filter((input) => !input.startsWith("node_modules/"));
    writeFileSync(cli.inputs, `${JSON.stringify(["package.json", ...sources].sort(), null, 2)}\n`);
    rmSync(cli.codeCache, { force: true });
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
