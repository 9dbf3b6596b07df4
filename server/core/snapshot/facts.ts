// The facts of an outcome that its public pages show, computed once when a version is published (and
// by the upgrade of a version frozen before they were stored): every interval, participants per
// comparison as the engine counted them, the certainty footnotes, the network and the methods. Pure:
// the page model then only projects them and does no statistics (docs/decisions/0012-snapshot-contract.md).
import { certaintyFootnotes } from "../grade/footnotes";
import { certaintyPath } from "../grade/path";
import type { ComparisonCertainty } from "../grade/assess";
import { z975, type AnalysisResult } from "../nma/analyse";
import { directParticipants } from "../nma/participants";
import { pairKey } from "../nma/pairs";
import { riskOfBiasShareKey } from "../nma/risk-of-bias";
import type { Estimate, ParsedStudy } from "../nma/types";
import type { OutcomeSnapshot } from "./schema";

/** METHODS.md §9: an unrated comparison says so in a footnote, and counts as not convincingly different. */
const notAssessed = { domainKey: "certainty.footnote.notAssessed", levels: 0, reason: null, because: null };

const withCi = (x: Estimate) => ({ estimate: x.estimate, se: x.se, lower: x.estimate - z975 * x.se, upper: x.estimate + z975 * x.se });


/**
 * How much of the evidence comes from studies at each risk of bias: the studies the analysis used,
 * counted and, where the format has arm sizes, their participants. Null without judgements.
 */
export function evidenceByRiskOfBias(studies: readonly ParsedStudy[], excludedStudies: readonly string[]): OutcomeSnapshot["riskOfBias"] {
  if (!studies.some((study) => study.riskOfBias !== undefined)) return null;
  const excluded = new Set(excludedStudies);
  const counts = { low: 0, someConcerns: 0, high: 0, notAssessed: 0 };
  const participants = { low: 0, someConcerns: 0, high: 0, notAssessed: 0 };
  let sized = true;
  for (const study of studies) {
    if (excluded.has(study.study)) continue;
    const key = riskOfBiasShareKey(study.riskOfBias);
    counts[key] += 1;
    if (study.format === "contrast") sized = false;
    else participants[key] += (study.arms as { total?: number; n?: number }[]).reduce((sum, arm) => sum + (arm.total ?? arm.n ?? 0), 0);
  }
  return { studies: counts, participants: sized ? participants : null };
}

export function outcomeFacts(result: AnalysisResult, certainty: readonly ComparisonCertainty[], studies: readonly ParsedStudy[]): Pick<OutcomeSnapshot, "pairs" | "network" | "methods" | "riskOfBias"> {
  const assessed = new Map(certainty.map((c) => [pairKey(c.treatment, c.comparator), c]));
  const judged = new Map(studies.map((study) => [study.study, study.riskOfBias ?? null]));
  return {
    pairs: result.comparisons.map((c) => {
      const assessment = assessed.get(pairKey(c.treatment, c.comparator)) ?? null;
      return {
        treatment: c.treatment,
        comparator: c.comparator,
        network: { estimate: c.network.estimate, se: c.network.se, lower: c.network.lower, upper: c.network.upper },
        direct: c.direct ? { ...withCi(c.direct), studies: c.direct.studies, participants: directParticipants(studies, result.excludedStudies, c.treatment, c.comparator) } : null,
        indirect: c.indirect ? withCi(c.indirect) : null,
        incoherenceP: c.incoherence?.p ?? null,
        certainty: assessment?.network ?? null,
        path: assessment ? certaintyPath(assessment, (x, y) => assessed.get(pairKey(x, y))?.direct ?? null) : null,
        footnotes: assessment?.network ? certaintyFootnotes(assessment) : [notAssessed],
        // Results computed before engine 1.1.0 have neither (§13).
        importance: c.importance?.map((s) => ({ study: s.study, value: s.value, riskOfBias: judged.get(s.study) ?? null })) ?? null,
        riskOfBias: c.riskOfBias ?? null,
      };
    }),
    riskOfBias: evidenceByRiskOfBias(studies, result.excludedStudies),
    network: {
      nodes: result.treatments.map((treatment) => ({ treatment, participants: result.network.participants[treatment] ?? null })),
      edges: result.network.edges.map((e) => ({ treatment: e.treatment, comparator: e.comparator, studies: e.studies })),
    },
    methods: {
      treatments: result.treatments,
      reference: result.reference,
      studies: result.studies,
      excludedStudies: result.excludedStudies,
      tau2: result.tau2,
      I2: result.heterogeneity.I2,
      Q: result.heterogeneity.Q,
      df: result.heterogeneity.df,
      Qbetween: result.inconsistency.Qbetween,
      dfBetween: result.inconsistency.dfBetween,
      pBetween: result.inconsistency.pBetween,
      engineVersion: result.engineVersion,
    },
  };
}
