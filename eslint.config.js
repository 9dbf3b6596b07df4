// Lint rules: the recommended sets of ESLint, typescript-eslint and the React hooks plugin, and the
// layers of docs/decisions/0015-layers.md, enforced by the local rule `layers/respect-layers`.
import path from "node:path";
import { fileURLToPath } from "node:url";
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";

const root = path.dirname(fileURLToPath(import.meta.url));

/**
 * The layers along the data's path, lowest first; a layer imports only from itself and those below.
 * The desk and the pages' components may use the API contract and route table (both browser-safe)
 * and types of the web layer.
 */
const layers = [
  { name: "core", folder: "server/core", alias: "#core", may: ["core"] },
  { name: "db", folder: "server/db", alias: "#db", may: ["core", "db"] },
  { name: "workflows", folder: "server/workflows", alias: "#workflows", may: ["core", "db", "workflows"] },
  { name: "web", folder: "server/web", alias: "#web", may: ["core", "db", "workflows", "web"] },
  { name: "components", folder: "components", alias: "#components", may: ["core", "components"] },
  // The pages are Vike's adapters: they may use every layer (a version's page reuses the latest one's files).
  { name: "pages", folder: "pages", alias: "#pages", may: ["core", "db", "workflows", "web", "components", "pages"] },
];
/** Packages a layer may not import: the pure core does no I/O, and only the stores speak to the database. */
const forbiddenPackages = {
  core: /^(drizzle-orm|pg|express|vike|node:fs|node:http|node:net)(\/|$)/,
  workflows: /^(drizzle-orm|pg|express|vike)(\/|$)/,
  components: /^(drizzle-orm|pg|express|node:)/,
};

const layerOfPath = (file) => layers.find((layer) => file === layer.folder || file.startsWith(`${layer.folder}/`));

function targetOf(fromFile, specifier) {
  const aliased = layers.find((layer) => specifier.startsWith(`${layer.alias}/`));
  if (aliased) return { file: path.join(aliased.folder, specifier.slice(aliased.alias.length + 1)), aliased: true };
  if (specifier.startsWith(".")) return { file: path.relative(root, path.resolve(path.dirname(path.join(root, fromFile)), specifier)), aliased: false };
  return null;
}

const respectLayers = {
  meta: { type: "problem", messages: { violation: "{{why}}" }, schema: [] },
  create(context) {
    const file = path.relative(root, context.filename);
    const from = layerOfPath(file);
    function check(node, specifier, typeOnly) {
      const report = (why) => context.report({ node, messageId: "violation", data: { why } });
      if (/^(\.\.\/){3}/.test(specifier)) return report(`"${specifier}" climbs more than two folders: import it by its layer's alias (#core/…, #db/…, #workflows/…, #web/…, #components/…, #pages/…).`);
      if (from && forbiddenPackages[from.name]?.test(specifier)) return report(`The ${from.name} layer may not import "${specifier}" (docs/decisions/0015-layers.md).`);
      const target = targetOf(file, specifier);
      const to = target && layerOfPath(target.file);
      if (!from || !to) return;
      const allowed = from.may.includes(to.name) || (from.name === "components" && to.name === "web" && (typeOnly || /^server\/web\/api\/(contract|routes)(\.ts)?$/.test(target.file)));
      if (!allowed) return report(`The ${from.name} layer may not import from the ${to.name} layer ("${specifier}"): lower layers never import higher ones (docs/decisions/0015-layers.md).`);
      if (from.name !== to.name && !target.aliased) report(`"${specifier}" reaches into the ${to.name} layer by a relative path: import it as ${to.alias}/….`);
    }
    const typeOnly = (node) => node.importKind === "type" || (node.specifiers?.length > 0 && node.specifiers.every((s) => s.importKind === "type"));
    return {
      ImportDeclaration: (node) => check(node, node.source.value, typeOnly(node)),
      ExportNamedDeclaration: (node) => node.source && check(node, node.source.value, node.exportKind === "type"),
      ExportAllDeclaration: (node) => check(node, node.source.value, node.exportKind === "type"),
      ImportExpression: (node) => node.source.type === "Literal" && check(node, node.source.value, false),
    };
  },
};

export default tseslint.config(
  { ignores: ["node_modules/", "dist/", ".data/", "drizzle/", "test-results/", "server/core/nma/kernels/assembly/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.tsx", "**/*.ts"],
    plugins: { "react-hooks": reactHooks, layers: { rules: { "respect-layers": respectLayers } } },
    rules: {
      ...reactHooks.configs.recommended.rules,
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_" }],
      "layers/respect-layers": "error",
    },
  },
  {
    // Vike's router must leave the desk's links alone: components/desk/DeskLink.tsx says why.
    files: ["components/**/*.tsx"],
    ignores: ["components/desk/DeskLink.tsx"],
    rules: {
      "no-restricted-imports": [
        "error",
        { paths: [{ name: "react-router", importNames: ["Link", "NavLink"], message: "Use DeskLink (components/desk/DeskLink.tsx), which Vike's router leaves alone." }] },
      ],
    },
  },
  {
    files: ["scripts/**/*.mjs"],
    languageOptions: { globals: { process: "readonly", console: "readonly" } },
  },
  {
    // The command line's launcher is CommonJS, which Node starts sooner (decision 0049).
    files: ["scripts/**/*.cjs"],
    languageOptions: { sourceType: "commonjs", globals: { process: "readonly", require: "readonly", module: "writable", __dirname: "readonly" } },
    rules: { "@typescript-eslint/no-require-imports": "off" },
  },
);
