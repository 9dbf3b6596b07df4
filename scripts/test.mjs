// npm test: install what is missing, then scripts/test.ts runs every check.
import { ensurePackages, runTypeScript } from "./lib/bootstrap.mjs";

ensurePackages();
runTypeScript("scripts/test.ts", process.argv.slice(2));
