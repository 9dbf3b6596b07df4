// Comments and documents that name a file of the project name one that exists: a renamed or removed
// file leaves no reader looking for it (four such comments were found once).
import { readdirSync, readFileSync, existsSync, statSync } from "node:fs";
import path from "node:path";
import { expect, it } from "vitest";

const root = path.resolve(__dirname, "../..");
const folders = ["server", "components", "pages", "tests", "scripts", "docs", "locales", "drizzle", ".ci"];
const named = /\b(?:server|components|pages|tests|scripts|docs|locales|drizzle)\/[A-Za-z0-9_./@()+-]+\.(?:ts|tsx|md|mjs|json|csv|R)\b/g;

function textFiles(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const file = path.join(folder, name);
    if (statSync(file).isDirectory()) return name === "node_modules" ? [] : textFiles(file);
    return /\.(ts|tsx|md|mjs|R)$/.test(name) || name === "run" ? [file] : [];
  });
}

it("every project file named in the code and the documents exists", () => {
  const files = [...folders.flatMap((folder) => textFiles(path.join(root, folder))), path.join(root, "README.md"), path.join(root, "DEVELOPERS.md")];
  expect(files.length).toBeGreaterThan(100);
  const missing = files.flatMap((file) =>
    [...readFileSync(file, "utf8").matchAll(named)].map((match) => match[0]).filter((name) => !existsSync(path.join(root, name))).map((name) => `${path.relative(root, file)} names ${name}`),
  );
  expect(missing).toEqual([]);
});
