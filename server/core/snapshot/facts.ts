// The facts of an outcome that its public pages show, computed once when a version is published (and
// by the upgrade of a version frozen before they were stored): every interval, participants per
// comparison as the engine counted them, the certainty footnotes, the network and the methods. Pure:
// the page model then only projects them and does no statistics (docs/decisions/0012-snapshot-contract.md).
import { certaintyFootnotes } from "../grade/footnotes";
import type { ComparisonCertainty } from "../grade/assess";
import { z975, type AnalysisResult } from "../nma/analyse";
import { directParticipants } from "../nma/participants";
import { pairKey } from "../pairs";
import type { Estimate, ParsedStudy } from "../nma/types";
import type { OutcomeSnapshot } from "./schema";

/** METHODS.md §9: an unrated comparison says so in a footnote, and counts as not convincingly different. */
const notAssessed = { domainKey: "certainty.footnote.notAssessed", levels: 0, reason: null, because: null };

const withCi = (x: Estimate) => ({ estimate: x.estimate, se: x.se, lower: x.estimate - z975 * x.se, upper: x.estimate + z975 * x.se });

export function outcomeFacts(result: AnalysisResult, certainty: readonly ComparisonCertainty[], studies: readonly ParsedStudy[]): Pick<OutcomeSnapshot, "pairs" | "network" | "methods"> {
  const assessed = new Map(certainty.map((c) => [pairKey(c.treatment, c.comparator), c]));
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
        footnotes: assessment?.network ? certaintyFootnotes(assessment) : [notAssessed],
      };
    }),
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
