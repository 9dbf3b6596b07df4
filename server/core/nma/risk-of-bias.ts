// Risk of bias of a direct estimate (METHODS.md §13): the shares of the §5 inverse-variance weight
// (with the network τ² under random effects) of the studies holding both treatments that were judged
// low, some concerns or high (the overall judgements of RoB 2: Sterne et al., BMJ 2019;366:l4898),
// or not assessed; and the suggested levels for GRADE's risk-of-bias domain, common practice with
// no single source: the level carrying the largest share (low 0, some concerns 1, high 2; a tie
// goes to the worse level), no suggestion when more than half of the weight is not assessed.
import { pairKey } from "./pairs";
import type { ArmEffects, RiskOfBias } from "./types";

export interface RiskOfBiasShares {
  low: number;
  someConcerns: number;
  high: number;
  notAssessed: number;
  /** 0, 1 or 2 levels down; null when more than half of the weight is not assessed. */
  suggestedLevels: 0 | 1 | 2 | null;
}

const levelsOf = { low: 0, someConcerns: 1, high: 2 } as const;

/** The share (and the words) a study's judgement counts under: null or absent is "not assessed". */
export const riskOfBiasShareKey = (level: RiskOfBias | null | undefined): keyof Omit<RiskOfBiasShares, "suggestedLevels"> =>
  level === "some-concerns" ? "someConcerns" : (level ?? "notAssessed");

/** Two shares this close count as a tie (they come from sums of the same weights). */
const tie = 1e-12;

export function suggestedLevels(shares: Omit<RiskOfBiasShares, "suggestedLevels">): RiskOfBiasShares["suggestedLevels"] {
  if (shares.notAssessed > 0.5) return null;
  let best: keyof typeof levelsOf = "low";
  for (const level of ["someConcerns", "high"] as const) {
    if (shares[level] >= shares[best] - tie) best = level;
  }
  return levelsOf[best];
}

/** The shares for "a vs b" (symmetric); null where no study holds both, or the data have no risk-of-bias column. */
export function directRiskOfBias(studies: readonly ArmEffects[], tau2: number, judged: boolean): (a: string, b: string) => RiskOfBiasShares | null {
  const sums = new Map<string, Omit<RiskOfBiasShares, "suggestedLevels">>();
  if (judged) {
    for (const study of studies) {
      study.treatments.forEach((a, i) => {
        study.treatments.forEach((b, j) => {
          if (i >= j) return;
          const key = pairKey(a, b);
          const sum = sums.get(key) ?? { low: 0, someConcerns: 0, high: 0, notAssessed: 0 };
          sum[riskOfBiasShareKey(study.riskOfBias)] += 1 / (study.variances[i]! + study.variances[j]! + tau2);
          sums.set(key, sum);
        });
      });
    }
  }
  return (a, b) => {
    const sum = sums.get(pairKey(a, b));
    if (!sum) return null;
    const total = sum.low + sum.someConcerns + sum.high + sum.notAssessed;
    const shares = { low: sum.low / total, someConcerns: sum.someConcerns / total, high: sum.high / total, notAssessed: sum.notAssessed / total };
    return { ...shares, suggestedLevels: suggestedLevels(shares) };
  };
}
