import { defineConfig } from "drizzle-kit";

// Only `drizzle-kit generate` uses this file: it compares the schema with the committed
// migrations and writes the next SQL file. Migrations are applied by server/db/migrate.ts.
export default defineConfig({
  dialect: "postgresql",
  schema: "./server/db/schema.ts",
  out: "./drizzle",
});
