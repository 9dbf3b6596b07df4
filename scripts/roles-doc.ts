// npm run docs:roles: writes docs/roles.md from the access table (server/core/access.ts).
// tests/integration/role-matrix.test.ts fails when the file and the table differ.
import { writeFileSync } from "node:fs";
import path from "node:path";
import { rolesDocument } from "#core/access";
import { projectRoot } from "./lib/steps";

writeFileSync(path.join(projectRoot, "docs/roles.md"), rolesDocument());
console.log("docs/roles.md written from server/core/access.ts");
