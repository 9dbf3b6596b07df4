// npm run nma: the engine's command line (METHODS.md §11) from prebuilt JavaScript (decisions 0026,
// 0047), so that a run spends its time on the analysis rather than on compiling. The bundle is built
// with the site (`npm run build`) and rebuilt here when it is missing or older than a source it was
// built from. It is compiled through V8's code cache (dist/cli/nma.cjs.cache, written by the first
// run after each build or Node upgrade), which spares a run most of the compiling of its code.
// CommonJS: Node starts a CommonJS entry about 8 ms sooner than an ES module (decision 0049).
const { readFileSync, renameSync, rmSync, statSync, writeFileSync } = require("node:fs");
const { createRequire } = require("node:module");
const path = require("node:path");
const vm = require("node:vm");
const cli = require("./lib/cli-paths.cjs");

/** The bundle's modification time, or null when it or its list of sources is missing or older than a source. */
function builtAt() {
  try {
    const built = statSync(cli.bundle).mtimeMs;
    const sources = JSON.parse(readFileSync(cli.inputs, "utf8"));
    return sources.every((source) => statSync(path.join(cli.root, source)).mtimeMs <= built) ? built : null;
  } catch {
    return null;
  }
}

/** The code cache, unless it is missing or older than the bundle. */
function cachedCode(built) {
  try {
    return statSync(cli.codeCache).mtimeMs >= built ? readFileSync(cli.codeCache) : undefined;
  } catch {
    return undefined;
  }
}

function run(built) {
  const cachedData = cachedCode(built);
  const script = new vm.Script(`(function (exports, require, module, __filename, __dirname) {${readFileSync(cli.bundle, "utf8")}\n})`, {
    filename: cli.bundle,
    cachedData,
  });
  if (cachedData === undefined || script.cachedDataRejected) {
    // Written on the way out of a run that analysed a file, when the functions it compiled are in it
    // (a run stopped by bad arguments compiles few). A folder the run may not write to only costs the
    // next run the compiling.
    process.once("exit", (code) => {
      if (code !== 0) return;
      const partial = `${cli.codeCache}.${process.pid}`;
      try {
        writeFileSync(partial, script.createCachedData());
        renameSync(partial, cli.codeCache);
      } catch {
        rmSync(partial, { force: true });
      }
    });
  }
  const bundled = { exports: {} };
  script.runInThisContext()(bundled.exports, createRequire(cli.bundle), bundled, cli.bundle, path.dirname(cli.bundle));
  bundled.exports.run(process.argv.slice(2));
}

const built = builtAt();
if (built !== null) run(built);
else {
  // The builder is an ES module and loads esbuild: only when there is something to build.
  import("./lib/cli-bundle.mjs").then(async ({ bundle }) => {
    const result = await bundle();
    if (!result.ok) {
      process.stderr.write(`the command line could not be built: ${result.reason}\n`);
      process.exit(2);
    }
    run(statSync(cli.bundle).mtimeMs);
  });
}
