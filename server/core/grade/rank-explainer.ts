// The rank-score explainer (PRODUCT.md; METHODS.md §6): P-scores and SUCRA are only ever shown
// next to the three reasons they are not proof — chance, size of the difference, certainty.
// Treatments are listed in a stable, alphabetical order, never sorted by score.
import type { AnalysisResult } from "../nma/analyse";

export const rankCautionKeys = ["rankScores.caution.chance", "rankScores.caution.size", "rankScores.caution.certainty"] as const;

export interface RankExplainer {
  titleKey: "rankScores.title";
  introKey: "rankScores.intro";
  cautionKeys: typeof rankCautionKeys;
  rows: { treatment: string; pScore: number; sucra: number }[];
  draws: number;
  seed: number;
}

export function rankExplainer(result: AnalysisResult): RankExplainer {
  return {
    titleKey: "rankScores.title",
    introKey: "rankScores.intro",
    cautionKeys: rankCautionKeys,
    rows: [...result.treatments].sort().map((treatment) => ({
      treatment,
      pScore: result.ranking.pScore[treatment]!,
      sucra: result.ranking.sucra[treatment]!,
    })),
    draws: result.ranking.draws,
    seed: result.ranking.seed,
  };
}
