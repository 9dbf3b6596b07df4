// Where the command line's prebuilt files live (decisions 0026, 0047): CommonJS, so that the launcher
// (scripts/nma.cjs, itself CommonJS to start sooner) and the builder (cli-bundle.mjs) share them.
const path = require("node:path");

const root = path.resolve(__dirname, "../..");
const folder = path.join(root, "dist/cli");

module.exports = {
  /** The project's folder: the sources in inputs.json are relative to it. */
  root,
  /** scripts/nma.ts bundled, exporting run(args). */
  bundle: path.join(folder, "nma.cjs"),
  /** Every source file the bundle was built from. */
  inputs: path.join(folder, "inputs.json"),
  /** V8's code cache of the bundle, written by the first run after each build. */
  codeCache: path.join(folder, "nma.cjs.cache"),
};
