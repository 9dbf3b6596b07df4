// npm start: install what is missing, then scripts/start.ts does the rest.
import { ensurePackages, runTypeScript } from "./lib/bootstrap.mjs";

ensurePackages();
runTypeScript("scripts/start.ts", process.argv.slice(2));
