// Study importance (server/core/nma/importance.ts, METHODS.md §13): the engine reaches each study's
// importance by a rank update; here it is checked against the definition itself (Rücker et al., BMC
// Med Res Methodol 2020;20:190), I_s = 1 − v_N / v_N without s, by fitting the smoking network again
// without each study, τ² held at the full-data estimate.
import { describe, expect, it } from "vitest";
import { importanceFloor, importanceListLength, studyImportances } from "#core/nma/importance";
import { fitAt } from "#core/nma/model";
import { estimateTau2 } from "#core/nma/reml";
import { smokingBlocks } from "#tests/support/smoking-network";

describe("study importance", () => {
  const { blocks, parameters, treatments, columnOf } = smokingBlocks();
  const fit = estimateTau2(blocks, parameters, fitAt(blocks, parameters, 0));
  const importances = studyImportances(blocks, fit.covariance, fit.tau2, treatments, columnOf);
  const varianceOf = (H: number[][], a: string, b: string) => {
    const [i, j] = [columnOf(a), columnOf(b)];
    const entry = (p: number, q: number) => (p >= 0 && q >= 0 ? H[p]![q]! : 0);
    return entry(i, i) + entry(j, j) - 2 * entry(i, j);
  };

  it("is, for every listed study of every pair, the precision the network estimate loses without it", () => {
    let checked = 0;
    for (let i = 0; i < treatments.length; i++) {
      for (let j = i + 1; j < treatments.length; j++) {
        const listed = importances(i, j);
        expect(listed.length).toBeLessThanOrEqual(importanceListLength);
        for (const { study, value } of listed) {
          expect(value).toBeGreaterThanOrEqual(importanceFloor);
          const without = fitAt(blocks.filter((block) => block.study !== study), parameters, fit.tau2);
          const expected = 1 - varianceOf(fit.covariance, treatments[i]!, treatments[j]!) / varianceOf(without.covariance, treatments[i]!, treatments[j]!);
          expect(value, `${study} for ${treatments[i]} vs ${treatments[j]}`).toBeCloseTo(expected, 6);
          checked += 1;
        }
      }
    }
    expect(checked).toBeGreaterThan(20);
  });

  it("lists the most important first", () => {
    const listed = importances(0, 1);
    expect(listed.map((entry) => entry.value)).toEqual([...listed.map((entry) => entry.value)].sort((a, b) => b - a));
  });
});
