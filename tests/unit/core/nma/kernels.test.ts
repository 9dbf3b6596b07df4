// The engine's WebAssembly kernels (server/core/nma/kernels, decision 0049): built from their sources,
// and drawing the very normals the engine drew before them with @stdlib/random-base-normal.
import { spawnSync } from "node:child_process";
import path from "node:path";
import normal from "@stdlib/random-base-normal";
import { describe, expect, it } from "vitest";
import { standardNormals } from "#core/nma/kernels";

const root = path.resolve(__dirname, "../../../..");

describe("the kernels", () => {
  it("are committed as their AssemblyScript sources compile", () => {
    const check = spawnSync(process.execPath, [path.join(root, "scripts/lib/kernels.mjs"), "--check"], { encoding: "utf8" });
    expect(check.stderr).toBe("");
    expect(check.status).toBe(0);
  }, 60_000);

  it.each([1, 7, 2 ** 32 - 1])("draw stdlib's normal stream for seed %i, a million draws to the bit, tails included", (seed) => {
    const count = 1_000_000;
    const ours = standardNormals(seed, count);
    const theirs = normal.factory(0, 1, { seed });
    let first = -1;
    for (let k = 0; k < count && first < 0; k++) if (ours[k] !== theirs()) first = k;
    expect(first).toBe(-1);
    // The ziggurat's base block draws from beyond R = 3.442619855899: about 580 in a million.
    expect(ours.filter((z) => Math.abs(z) > 3.442619855899).length).toBeGreaterThan(400);
  });
});
