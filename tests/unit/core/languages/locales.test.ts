// Every locale says everything English says, with the same placeholders, and every plural form its
// language needs (CLDR plural rules through Intl.PluralRules: Arabic has six, zero to other).
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { locales } from "#core/languages/locales";

const root = path.resolve(import.meta.dirname, "../../../../locales");
const namespaces = readdirSync(path.join(root, "en")).filter((file) => file.endsWith(".json"));
const pluralSuffix = /_(zero|one|two|few|many|other)$/;
/** Agreement of a statement with its subject (server/core/languages/grammar.ts): each language has the contexts its grammar marks. */
const contextSuffix = /_(plural|feminine)$/;

/** Every leaf as "a.b.c" → text. */
function flatten(value: unknown, prefix = ""): Map<string, string> {
  const out = new Map<string, string>();
  for (const [key, inner] of Object.entries(value as Record<string, unknown>)) {
    const name = prefix ? `${prefix}.${key}` : key;
    if (typeof inner === "string") out.set(name, inner);
    else for (const [k, v] of flatten(inner, name)) out.set(k, v);
  }
  return out;
}

const read = (locale: string, file: string) => flatten(JSON.parse(readFileSync(path.join(root, locale, file), "utf8")));
/**
 * The placeholders a text fills in ({{name}}, {{p, number(…)}} → p), and the tags that mark its glossary
 * terms (<ci>…</ci> → <ci>); count may be spelled out in a plural form.
 */
const placeholders = (text: string) => new Set([...[...text.matchAll(/\{\{\s*([\w.]+)/g)].map((m) => m[1]!), ...[...text.matchAll(/<([a-z0-9]+)>/g)].map((m) => `<${m[1]}>`)]);

describe.each(namespaces)("locales/*/%s", (file) => {
  const english = read("en", file);
  const plurals = new Set([...english.keys()].filter((key) => pluralSuffix.test(key)).map((key) => key.replace(pluralSuffix, "")));

  it.each(locales.filter((l) => l !== "en"))("%s has every key, no stray key, and the same placeholders", (locale) => {
    const words = read(locale, file);
    // A context form stands beside its base key, with the same placeholders; English need not have it.
    for (const [key, text] of words) {
      if (!contextSuffix.test(key)) continue;
      const base = english.get(key.replace(contextSuffix, ""));
      expect(base, `${locale} ${key} has no base key`).toBeDefined();
      expect([...placeholders(text)].sort(), `${locale} ${key}`).toEqual([...placeholders(base!)].sort());
      words.delete(key);
    }
    for (const key of [...english.keys()].filter((k) => contextSuffix.test(k))) english.delete(key);
    const categories = new Intl.PluralRules(locale).resolvedOptions().pluralCategories;
    const expected = new Set([...english.keys()].filter((key) => !plurals.has(key.replace(pluralSuffix, ""))));
    for (const base of plurals) for (const category of categories) expected.add(`${base}_${category}`);
    expect([...expected].filter((key) => !words.has(key)), "missing").toEqual([]);
    expect([...words.keys()].filter((key) => !expected.has(key) && !plurals.has(key.replace(pluralSuffix, ""))), "not in English").toEqual([]);
    for (const [key, text] of words) {
      const base = key.replace(pluralSuffix, "");
      const source = plurals.has(base) ? english.get(`${base}_other`)! : english.get(key);
      if (source === undefined) continue;
      const theirs = placeholders(text);
      const ours = placeholders(source);
      // A plural form may write its number in words ("one", "two"): only count may be left out.
      if (plurals.has(base)) {
        theirs.delete("count");
        ours.delete("count");
      }
      expect([...theirs].sort(), `${locale} ${key}`).toEqual([...ours].sort());
    }
  });
});
