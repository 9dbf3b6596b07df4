// The open smoking-cessation network (tests/fixtures/reference/hasselblad1998.csv) as the engine's
// study blocks against its reference, as log odds ratios, beside metafor's results for it
// (hasselblad1998.expected.json; sources in tests/fixtures/reference/README.md).
import { readFileSync } from "node:fs";
import path from "node:path";
import { armEffects } from "#core/nma/contrasts";
import { studyBlocks } from "#core/nma/model";
import { treatmentsOf } from "#core/nma/network";
import { parseDataset } from "#core/nma/parse";

const folder = path.resolve(__dirname, "../fixtures/reference");

export const smokingExpected = JSON.parse(readFileSync(path.join(folder, "hasselblad1998.expected.json"), "utf8")) as {
  reference: string;
  heterogeneity: { Q: number; df: number; I2: number };
  random: { tau2: number };
};

export function smokingBlocks() {
  const { studies } = armEffects(parseDataset(readFileSync(path.join(folder, "hasselblad1998.csv")), "arm-binary").studies, "OR");
  const treatments = treatmentsOf(studies);
  const others = treatments.filter((t) => t !== smokingExpected.reference);
  const columnOf = (t: string) => others.indexOf(t); // −1 for the reference
  return { blocks: studyBlocks(studies, columnOf), parameters: others.length, treatments, columnOf };
}
