// npm run docs:roles: writes docs/roles.md from the API's route table (server/web/api/routes.ts) and
// the access table of the files and pages (server/core/access/access.ts).
// tests/integration/role-matrix.test.ts fails when the file and the tables differ.
import { writeFileSync } from "node:fs";
import path from "node:path";
import { rolesDocument } from "#core/access/access";
import { apiRoutes } from "#web/api/routes";
import { projectRoot } from "./lib/steps";

writeFileSync(path.join(projectRoot, "docs/roles.md"), rolesDocument(apiRoutes));
console.log("docs/roles.md written from server/web/api/routes.ts and server/core/access/access.ts");
