// Migrations that change stored data, each tested on a database holding rows of the shape before it.
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { connectDatabase, type DatabaseConnection } from "#db/client";
import { migrateDatabase, migrationsFolder } from "#db/migrate";
import { ownDatabase } from "../support/app";

let database: Awaited<ReturnType<typeof ownDatabase>>;
let connection: DatabaseConnection;
let folderBefore: string;

/** The committed migrations up to and including `tag`, as drizzle's migrator reads them. */
function migrationsUpTo(tag: string): string {
  const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-migrations-"));
  cpSync(migrationsFolder, folder, { recursive: true });
  const journalPath = path.join(folder, "meta/_journal.json");
  const journal = JSON.parse(readFileSync(journalPath, "utf8")) as { entries: { tag: string }[] };
  journal.entries = journal.entries.slice(0, journal.entries.findIndex((e) => e.tag === tag) + 1);
  writeFileSync(journalPath, JSON.stringify(journal));
  return folder;
}

beforeAll(async () => {
  database = await ownDatabase("migration_test");
  connection = connectDatabase(database.url);
  folderBefore = migrationsUpTo("0007_review-and-withdrawal");
});
afterAll(async () => {
  await connection.close();
  await database.drop();
  rmSync(folderBefore, { recursive: true, force: true });
});

describe("0008: thresholds of binary outcomes become differences per 1000 (docs/decisions/0017-thresholds-per-1000.md)", () => {
  it("converts log odds ratio, log risk ratio and risk difference thresholds at the baseline risk, clears those without one, leaves continuous ones", async () => {
    await migrateDatabase(connection, folderBefore);
    const { pool } = connection;
    const [{ id: person }] = (await pool.query<{ id: string }>("insert into people (email, display_name, password_hash) values ('m@x.example', 'M', 'x') returning id")).rows as [{ id: string }];
    const [{ id: brief }] = (await pool.query<{ id: string }>("insert into briefs (slug, title, topic, condition, population, created_by) values ('m', 'M', 't', 'c', 'p', $1) returning id", [person])).rows as [{ id: string }];
    const outcome = (name: string, kind: string, measure: string, baseline: number | null, small: number) =>
      pool.query(
        "insert into outcomes (brief_id, position, name, kind, measure, model, reference_treatment, direction, baseline_risk, threshold_small) values ($1, (select count(*) + 1 from outcomes), $2, $3, $4, 'random', 'r', 'higher', $5, $6)",
        [brief, name, kind, measure, baseline, small],
      );
    await outcome("odds", "binary", "OR", 0.3, Math.log(2));
    await outcome("risks", "binary", "RR", 0.2, Math.log(1.5));
    await outcome("difference", "binary", "RD", 0.1, 0.05);
    await outcome("no baseline", "binary", "OR", null, 0.4);
    await outcome("points", "continuous", "MD", null, 3);

    await migrateDatabase(connection);
    const rows = (await pool.query<{ name: string; threshold_small: number | null }>("select name, threshold_small from outcomes")).rows;
    const small = Object.fromEntries(rows.map((r) => [r.name, r.threshold_small]));
    // OR 2 at p₀ = 0.3: p₁ = 0.6/1.3 = 0.461538…, so 161.5 more per 1000 (worked by hand, METHODS.md §7).
    expect(small.odds).toBe(161.5);
    // RR 1.5 at p₀ = 0.2: p₁ = 0.3, so 100 more per 1000.
    expect(small.risks).toBe(100);
    // RD 0.05: 50 per 1000.
    expect(small.difference).toBe(50);
    expect(small["no baseline"]).toBeNull();
    expect(small.points).toBe(3);
  });
});

describe("0024: the author team and the short take under the product's own names (docs/decisions/0034-product-names.md)", () => {
  it("keeps a brief's author and short take, and moves translated short takes to the new field name", async () => {
    const named = await ownDatabase("migration_names");
    const machine = connectDatabase(named.url);
    const before = migrationsUpTo("0023_search-documents");
    try {
      await migrateDatabase(machine, before);
      const { pool } = machine;
      const [{ id: person }] = (await pool.query<{ id: string }>("insert into people (email, display_name, password_hash) values ('n@x.example', 'N', 'x') returning id")).rows as [{ id: string }];
      const [{ id: brief }] = (
        await pool.query<{ id: string }>(
          "insert into briefs (slug, title, topic, condition, population, created_by, review_group, key_messages) values ('n', 'N', 't', 'c', 'p', $1, 'Northfield Evidence Unit (fictional)', '- Walking may help.') returning id",
          [person],
        )
      ).rows as [{ id: string }];
      const [{ id: version }] = (await pool.query<{ id: string }>("insert into brief_versions (brief_id, number, release_at, snapshot) values ($1, 1, now(), $2) returning id", [brief, { brief: { title: "N" }, treatments: [] }])).rows as [{ id: string }];
      const field = { text: "Caminar puede ayudar.", sourceHash: "h", sourceText: "Walking may help." };
      await pool.query("insert into version_translations (version_id, locale, state, fields, published_fields, published_at) values ($1, 'es', 'published', $2, $3, now())", [
        version,
        { keyMessages: field, title: { ...field, text: "Título" } },
        { keyMessages: "Caminar puede ayudar.", title: "Título" },
      ]);

      await migrateDatabase(machine);
      const row = (await pool.query<{ author_team: string; short_take: string }>("select author_team, short_take from briefs where id = $1", [brief])).rows[0]!;
      expect(row).toEqual({ author_team: "Northfield Evidence Unit (fictional)", short_take: "- Walking may help." });
      const translation = (await pool.query<{ fields: unknown; published_fields: unknown }>("select fields, published_fields from version_translations where version_id = $1", [version])).rows[0]!;
      expect(translation.fields).toEqual({ shortTake: field, title: { ...field, text: "Título" } });
      expect(translation.published_fields).toEqual({ shortTake: "Caminar puede ayudar.", title: "Título" });
    } finally {
      await machine.close();
      await named.drop();
      rmSync(before, { recursive: true, force: true });
    }
  });
});

describe("machines that start at once", () => {
  it("migrate a new database once between them: three at the same moment all start, and every migration is recorded once", async () => {
    const fresh = await ownDatabase("migration_race");
    const machines = [0, 1, 2].map(() => connectDatabase(fresh.url));
    try {
      await Promise.all(machines.map((machine) => migrateDatabase(machine)));
      const journal = JSON.parse(readFileSync(path.join(migrationsFolder, "meta/_journal.json"), "utf8")) as { entries: unknown[] };
      const applied = await machines[0]!.pool.query<{ count: string }>("select count(*) from drizzle.__drizzle_migrations");
      expect(Number(applied.rows[0]!.count)).toBe(journal.entries.length);
    } finally {
      await Promise.all(machines.map((machine) => machine.close()));
      await fresh.drop();
    }
  });
});
