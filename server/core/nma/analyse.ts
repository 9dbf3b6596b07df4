// The whole analysis of METHODS.md §2–6 for one outcome: from parsed studies to the result object
// of §11. Pure: no I/O. docs/methods.md describes each step in words.
import { armEffects, type Exclusion } from "./contrasts";
import { degreesOfFreedom, heterogeneity, inconsistency, type Heterogeneity, type Inconsistency } from "./heterogeneity";
import { studyImportances, type StudyImportance } from "./importance";
import { fitAt, studyBlocks, type Fit } from "./model";
import { assertConnected, treatmentsOf } from "./network";
import { defaultDraws, defaultSeed, pScores, rankProbabilities } from "./ranking";
import { estimateTau2 } from "./reml";
import { directRiskOfBias, type RiskOfBiasShares } from "./risk-of-bias";
import { directEstimates, incoherence, indirectEstimate } from "./split";
import { DatasetError, type AnalysisOptions, type Estimate, type Measure, type Model, type ParsedDataset } from "./types";

/** Bumped whenever a change to the engine could change a number; stored with every result. */
export const engineVersion = "1.1.0";

/** The 97.5% point of the standard normal, as METHODS.md §3 fixes it. */
export const z975 = 1.959964;

export interface NetworkEstimate extends Estimate {
  lower: number;
  upper: number;
  /** The 95% prediction interval, under random effects only. */
  predictionLower: number | null;
  predictionUpper: number | null;
}

export interface Comparison {
  treatment: string;
  comparator: string;
  network: NetworkEstimate;
  direct: (Estimate & { studies: number }) | null;
  indirect: Estimate | null;
  incoherence: { z: number; p: number } | null;
  /** v_N / v_D: the share of the network estimate's information that is direct. */
  directShare: number | null;
  /** §13: the studies that matter most for this pair (importance ≥ 0.001, largest first, at most 10). */
  importance: StudyImportance[];
  /** §13: the risk of bias of the direct estimate; null without direct evidence or without the column. */
  riskOfBias: RiskOfBiasShares | null;
}

export interface AnalysisResult {
  engineVersion: string;
  treatments: string[];
  reference: string;
  measure: Measure;
  model: Model;
  better: AnalysisOptions["better"];
  studies: number;
  excludedStudies: string[];
  exclusions: Exclusion[];
  tau2: number;
  heterogeneity: Heterogeneity;
  inconsistency: Inconsistency;
  comparisons: Comparison[];
  ranking: {
    pScore: Record<string, number>;
    sucra: Record<string, number>;
    meanRank: Record<string, number>;
    rankProbabilities: Record<string, number[]>;
    draws: number;
    seed: number;
  };
  /** For the network diagram: participants per treatment (null where the format has none) and studies per edge. */
  network: {
    participants: Record<string, number | null>;
    edges: { treatment: string; comparator: string; studies: number }[];
  };
}

export function analyse(dataset: ParsedDataset, options: AnalysisOptions): AnalysisResult {
  const { measure, model, reference, better } = options;
  const { studies, excluded } = armEffects(dataset.studies, measure);
  if (studies.length === 0) {
    throw new DatasetError([{ rule: "no-informative-studies", message: "no study is left once studies without information are excluded" }]);
  }
  assertConnected(studies);
  const treatments = treatmentsOf(studies);
  if (!treatments.includes(reference)) {
    throw new DatasetError([{ rule: "unknown-reference", value: reference, facts: { treatments: treatments.join(", ") }, message: `the reference "${reference}" is not a treatment in the data (${treatments.join(", ")})` }]);
  }

  const others = treatments.filter((t) => t !== reference);
  const columnOf = (t: string) => others.indexOf(t); // −1 for the reference
  const blocks = studyBlocks(studies, columnOf);
  const parameters = others.length;

  const fixed = fitAt(blocks, parameters, 0);
  const df = degreesOfFreedom(studies, treatments.length);
  // With no residual degrees of freedom τ² cannot be estimated: the random-effects fit is the fixed one.
  const fit: Fit = model === "fixed" || df === 0 ? fixed : estimateTau2(blocks, parameters, fixed);
  const tau2 = fit.tau2;

  const network = (a: string, b: string): Estimate => {
    const ia = columnOf(a);
    const ib = columnOf(b);
    const da = ia >= 0 ? fit.beta[ia]! : 0;
    const db = ib >= 0 ? fit.beta[ib]! : 0;
    const cov = (i: number, j: number) => (i >= 0 && j >= 0 ? fit.covariance[i]![j]! : 0);
    return { estimate: da - db, se: Math.sqrt(cov(ia, ia) + cov(ib, ib) - 2 * cov(ia, ib)) };
  };
  const direct = directEstimates(studies, tau2);
  const importance = studyImportances(blocks, fit.covariance, tau2, treatments, columnOf);
  const riskOfBias = directRiskOfBias(studies, tau2, dataset.riskOfBiasColumn === true);

  const comparisons: Comparison[] = [];
  const edges: AnalysisResult["network"]["edges"] = [];
  treatments.forEach((a, i) => {
    treatments.forEach((b, j) => {
      if (j <= i) return;
      const n = network(a, b);
      const d = direct(a, b);
      const indirect = indirectEstimate(n, d);
      const predictionHalfWidth = z975 * Math.sqrt(n.se ** 2 + tau2);
      comparisons.push({
        treatment: a,
        comparator: b,
        network: {
          ...n,
          lower: n.estimate - z975 * n.se,
          upper: n.estimate + z975 * n.se,
          predictionLower: model === "random" ? n.estimate - predictionHalfWidth : null,
          predictionUpper: model === "random" ? n.estimate + predictionHalfWidth : null,
        },
        direct: d,
        indirect,
        incoherence: incoherence(d, indirect),
        directShare: d ? n.se ** 2 / d.se ** 2 : null,
        importance: importance(i, j),
        riskOfBias: riskOfBias(a, b),
      });
      if (d) edges.push({ treatment: a, comparator: b, studies: d.studies });
    });
  });

  const ranks = rankProbabilities(treatments, reference, fit.beta, fit.covariance, better, options.draws ?? defaultDraws, options.seed ?? defaultSeed);
  const participants: Record<string, number | null> = {};
  for (const t of treatments) participants[t] = null;
  for (const study of studies) {
    study.treatments.forEach((t, i) => {
      const n = study.participants[i];
      if (n !== null && n !== undefined) participants[t] = (participants[t] ?? 0) + n;
    });
  }

  return {
    engineVersion,
    treatments,
    reference,
    measure,
    model,
    better,
    studies: studies.length,
    excludedStudies: excluded.map((e) => e.study),
    exclusions: excluded,
    tau2,
    heterogeneity: heterogeneity(fixed.residual, df),
    inconsistency: inconsistency(studies, fixed.residual, df),
    comparisons,
    ranking: {
      pScore: pScores(treatments, network, better),
      sucra: ranks.sucra,
      meanRank: ranks.meanRank,
      rankProbabilities: ranks.probabilities,
      draws: ranks.draws,
      seed: ranks.seed,
    },
    network: { participants, edges },
  };
}

