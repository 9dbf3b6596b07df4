// The engine's WebAssembly kernels (server/core/nma/kernels, decision 0049): built from their sources,
// and drawing the very normals the engine drew before them with @stdlib/random-base-normal.
import { spawnSync } from "node:child_process";
import path from "node:path";
import stdlibExp from "@stdlib/math-base-special-exp";
import stdlibLn from "@stdlib/math-base-special-ln";
import normal from "@stdlib/random-base-normal";
import { describe, expect, it } from "vitest";
import { fdlibm, standardNormals } from "#core/nma/kernels";

const root = path.resolve(__dirname, "../../../..");

describe("the kernels", () => {
  it("are committed as their AssemblyScript sources compile", () => {
    const check = spawnSync(process.execPath, [path.join(root, "scripts/lib/kernels.mjs"), "--check"], { encoding: "utf8" });
    expect(check.stderr).toBe("");
    expect(check.status).toBe(0);
  }, 60_000);

  it("compute exp and ln as stdlib does, to the bit, over the doubles' range and its edges", () => {
    // Seeded uniform exponents and significands: every binade from 2⁻¹⁰⁷⁴ to 2¹⁰²³, both signs.
    const uniform = normal.factory(0, 1, { seed: 11 }).PRNG as () => number;
    const inputs = [0, -0, 1, -1, 2 ** -1074, 2 ** -1022, Number.MAX_VALUE, Infinity, -Infinity, NaN, 709.782712893384, 709.79, -745.1332191019411, -745.14, 2 ** -28, -(2 ** -28)];
    for (let k = 0; k < 200_000; k++) inputs.push((uniform() < 0.5 ? -1 : 1) * (1 + uniform()) * 2 ** Math.floor(uniform() * 2098 - 1074));
    // exp's useful range, densely, where the ziggurat calls it.
    for (let k = 0; k < 100_000; k++) inputs.push(-12 + 12 * uniform());
    const differences = inputs.filter((x) => !Object.is(fdlibm.exp(x), stdlibExp(x)) || !Object.is(fdlibm.ln(x), stdlibLn(x)));
    expect(differences).toEqual([]);
  });

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
