// The command line of METHODS.md §11 (kept stable for outside checks):
//   npm run --silent nma -- --input FILE.csv --format arm-binary|arm-continuous|contrast \
//     --measure OR|RR|RD|MD --model fixed|random --reference NAME --better higher|lower [--draws N] [--seed S]
// One JSON object on stdout and exit 0; bad input: one line on stderr, exit 1; bad arguments: exit 2.
// Bundled to dist/cli/nma.cjs and started by scripts/nma.cjs, which calls `run`.
import { readFileSync } from "node:fs";
import { parseArgs } from "node:util";
// zod's tree-shakeable build: the full one is most of the bundle, and a run would spend its start compiling it.
import * as z from "zod/mini";
import { analyse } from "#core/nma/analyse";
import { measuresByFormat } from "#core/nma/options";
import { parseDataset } from "#core/nma/parse";
import { seedRange } from "#core/nma/ranking";
import { DatasetError, formats, measures } from "#core/nma/types";

function fail(code: 1 | 2, reason: string): never {
  process.stderr.write(`${reason.replace(/\s+/g, " ").trim()}\n`);
  process.exit(code);
}

const seedMessage = `--seed must be from ${seedRange.min} to ${seedRange.max}`;
const whole = (name: string) => z.refine<number>(Number.isInteger, `${name} must be a whole number`);
const argumentsSchema = z
  .object({
    input: z.string({ error: "--input FILE.csv is required" }),
    format: z.enum(formats, { error: `--format must be one of ${formats.join(", ")}` }),
    measure: z.enum(measures, { error: `--measure must be one of ${measures.join(", ")}` }),
    model: z.enum(["fixed", "random"], { error: "--model must be fixed or random" }),
    reference: z.string({ error: "--reference NAME is required" }).check(z.minLength(1, "--reference NAME is required")),
    better: z.enum(["higher", "lower"], { error: "--better must be higher or lower" }),
    draws: z.optional(z.coerce.number({ error: "--draws must be a number" }).check(whole("--draws"), z.minimum(1, "--draws must be at least 1"), z.maximum(10_000_000, "--draws must be at most 10000000"))),
    seed: z.optional(
      z.coerce
        .number({ error: "--seed must be a number" })
        .check(whole("--seed"), z.minimum(seedRange.min, seedMessage), z.maximum(seedRange.max, seedMessage)),
    ),
  })
  .check(
    z.refine((a) => measuresByFormat[a.format].includes(a.measure), {
      error: "--measure does not fit --format (arm-binary takes OR, RR or RD; arm-continuous takes MD)",
    }),
  );

/** Runs the command line on `args` (the arguments after the script). */
export function run(args: string[]): void {
  let raw;
  try {
    raw = parseArgs({
      args,
      options: Object.fromEntries(
        ["input", "format", "measure", "model", "reference", "better", "draws", "seed"].map((name) => [name, { type: "string" as const }]),
      ),
      strict: true,
      allowPositionals: false,
    }).values;
  } catch (error) {
    fail(2, (error as Error).message);
  }
  const parsed = argumentsSchema.safeParse(raw);
  if (!parsed.success) fail(2, parsed.error.issues.map((i) => i.message).join("; "));
  const options = parsed.data;

  let bytes: Buffer;
  try {
    bytes = readFileSync(options.input);
  } catch (error) {
    fail(1, `cannot read ${options.input}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  }

  try {
    const result = analyse(parseDataset(bytes, options.format), options);
    process.stdout.write(`${JSON.stringify(result)}\n`);
  } catch (error) {
    if (error instanceof DatasetError) fail(1, error.message);
    fail(1, `the analysis failed: ${(error as Error).message}`);
  }
}
