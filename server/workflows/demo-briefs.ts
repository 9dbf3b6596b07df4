// The two fictional demonstration briefs of the local seed. Every number is invented, drawn from a
// seeded generator around effects chosen for the story each brief tells; nothing here describes a
// real study or a real treatment.
import normal from "@stdlib/random-base-normal";

export interface DemoOutcome {
  name: string;
  kind: "binary" | "continuous";
  measure: "OR" | "MD";
  direction: "higher" | "lower";
  reference: string;
  baselineRisk: number | null;
  unit: string | null;
  /** On the decision scale (METHODS.md §9): more people per 1000 for binary outcomes, the outcome's units for continuous ones. */
  thresholds: { small: number; moderate: number; large: number };
  csv: string;
}

export interface DemoBrief {
  title: string;
  topic: string;
  condition: string;
  population: string;
  /** The editor's Markdown, as invented as the data. */
  laySummary: string;
  shortTake: string;
  treatmentNames: Record<string, string>;
  /** How an English sentence names a treatment, where the display name alone would not read well. */
  treatmentGrammar?: Record<string, { phrase?: string; number?: "singular" | "plural" }>;
  outcomes: DemoOutcome[];
}

type Design = string[];

/**
 * Invented risk-of-bias judgements (METHODS.md §13), one per study in turn: mostly low, some with
 * concerns, a few high and one in eight not assessed. They describe no real trial.
 */
const judgements = ["low", "low", "some concerns", "low", "high", "low", "some concerns", ""];

/** Arm-level rows around true effects: log odds for binary outcomes, means for continuous ones. */
function generate(kind: "binary" | "continuous", designs: Design[], truth: Record<string, number>, seed: number): string {
  const gaussian = normal.factory(0, 1, { seed });
  const rows = designs.flatMap((arms, s) => {
    const studyShift = 0.15 * gaussian();
    return arms.map((treatment) => {
      const n = 40 + Math.round(Math.abs(gaussian()) * 80);
      if (kind === "binary") {
        const logit = truth[treatment]! + studyShift + 0.1 * gaussian();
        const events = Math.max(1, Math.min(n - 1, Math.round(n / (1 + Math.exp(-logit)))));
        return `D${String(s + 1).padStart(3, "0")},${treatment},${events},${n},${judgements[s % judgements.length]}`;
      }
      const sd = 9 + Math.abs(gaussian()) * 2;
      const mean = truth[treatment]! + 2 * studyShift + (sd / Math.sqrt(n)) * gaussian();
      return `D${String(s + 1).padStart(3, "0")},${treatment},${mean.toFixed(2)},${sd.toFixed(2)},${n},${judgements[s % judgements.length]}`;
    });
  });
  const header = kind === "binary" ? "study,treatment,events,total,risk_of_bias" : "study,treatment,mean,sd,n,risk_of_bias";
  return `${header}\n${rows.join("\n")}\n`;
}

const shiftDesigns: Design[] = [
  ["usual_care", "light"], ["usual_care", "light"], ["usual_care", "nap_plan"], ["usual_care", "nap_plan"],
  ["usual_care", "drug_k"], ["usual_care", "drug_k"], ["usual_care", "drug_m"], ["light", "nap_plan"],
  ["light", "combined"], ["nap_plan", "combined"], ["usual_care", "combined"], ["drug_k", "drug_m"],
  ["usual_care", "light", "combined"], // the multi-arm study
  ["usual_care", "drug_m"], ["light", "drug_k"],
];

const smallBrief: DemoBrief = {
  title: "Sleeping well after night shifts (fictional demonstration)",
  topic: "Sleep",
  condition: "Poor sleep after night-shift work",
  population: "Adults who work night shifts",
  laySummary: `*This brief uses invented data to show how Fairweigh presents a network meta-analysis. No real study, person or product is described.*

People who work night shifts often sleep badly during the day. This fictional analysis brings together 15 invented trials of five ways to help — bright-light sessions, a planned-nap schedule, two sleep aids and light sessions combined with naps — and compares each with usual care and with each other, even where no trial compared them directly.

The groups below say which options the evidence supports and how sure we can be. They are not a ranking: options in the same group may not differ from each other at all.`,
  shortTake: `- Sleep aid K probably gives a large benefit for good sleep compared with usual care, and timed bright-light sessions probably a moderate one (moderate certainty).
- The planned-nap schedule and sleep aid M **may** help a little, but the certainty is low.
- For light sessions with nap schedule the evidence is very uncertain.
- Scores that place options "first" or "last" are not proof: read the groups and the certainty instead.`,
  treatmentNames: {
    usual_care: "Usual care",
    light: "Timed bright-light sessions",
    nap_plan: "Planned-nap schedule",
    drug_k: "Sleep aid K (fictional)",
    drug_m: "Sleep aid M (fictional)",
    combined: "Light sessions with nap schedule",
  },
  treatmentGrammar: {
    usual_care: { phrase: "usual care" },
    light: { phrase: "timed bright-light sessions", number: "plural" },
    nap_plan: { phrase: "the planned-nap schedule" },
    drug_k: { phrase: "sleep aid K" },
    drug_m: { phrase: "sleep aid M" },
    combined: { phrase: "light sessions with a nap schedule", number: "plural" },
  },
  outcomes: [
    {
      name: "Good sleep on most days at 4 weeks",
      kind: "binary",
      measure: "OR",
      direction: "higher",
      reference: "usual_care",
      baselineRisk: 0.3,
      unit: null,
      thresholds: { small: 30, moderate: 90, large: 190 },
      csv: generate("binary", shiftDesigns, { usual_care: -0.85, light: -0.3, nap_plan: -0.55, drug_k: -0.2, drug_m: -0.75, combined: 0.15 }, 11),
    },
    {
      name: "Daytime sleepiness score (0 to 100) at 4 weeks",
      kind: "continuous",
      measure: "MD",
      direction: "lower",
      reference: "usual_care",
      baselineRisk: null,
      unit: "points",
      thresholds: { small: 3, moderate: 6, large: 10 },
      csv: generate("continuous", shiftDesigns, { usual_care: 55, light: 49, nap_plan: 52, drug_k: 50, drug_m: 54, combined: 45 }, 12),
    },
  ],
};

/** 22 invented treatments, most of them close together: grouping says more than any ranking would. */
function largeBrief(): DemoBrief {
  const labels = ["inactive", ...Array.from({ length: 21 }, (_, i) => `compound_${String.fromCharCode(97 + i)}`)];
  const gaussian = normal.factory(0, 1, { seed: 21 });
  const truth: Record<string, number> = { inactive: -1.6 };
  labels.slice(1).forEach((label, i) => (truth[label] = -1.6 + 0.35 + 0.03 * i + 0.12 * gaussian()));
  const designs: Design[] = [];
  labels.slice(1).forEach((label, i) => {
    designs.push(["inactive", label], ["inactive", label]);
    if (i > 0) designs.push([labels[i]!, label]);
  });
  designs.push(["inactive", "compound_a", "compound_b"], ["compound_c", "compound_d", "compound_e"]);
  return {
    title: "Relief of an everyday tension headache: 22 options compared (fictional demonstration)",
    topic: "Headache",
    condition: "Episodic tension-type headache",
    population: "Adults with an occasional tension headache",
    laySummary: `*This brief uses invented data to show how Fairweigh presents a large network. No real study, person or product is described.*

Twenty-one fictional compounds for an everyday tension headache are compared with an inactive tablet and with each other. With this many options, a list from "best" to "worst" would suggest differences that the evidence does not show. The groups below keep together the compounds that the evidence cannot tell apart.`,
    shortTake: `- Ten of the 21 fictional compounds probably give a large benefit compared with the inactive tablet; nine more may give a smaller one, with low certainty.
- For compounds B and H the evidence is very uncertain.
- Most compounds cannot be told apart from each other: they fall in the same group.
- A compound's rank score can be high by chance; the groups and their certainty say more.`,
    treatmentNames: Object.fromEntries(labels.map((l) => [l, l === "inactive" ? "Inactive tablet" : `Compound ${l.slice(-1).toUpperCase()} (fictional)`])),
    treatmentGrammar: { inactive: { phrase: "the inactive tablet" }, ...Object.fromEntries(labels.slice(1).map((l) => [l, { phrase: `compound ${l.slice(-1).toUpperCase()}` }])) },
    outcomes: [
      {
        name: "Free of pain two hours after one dose",
        kind: "binary",
        measure: "OR",
        direction: "higher",
        reference: "inactive",
        baselineRisk: 0.17,
        unit: null,
        thresholds: { small: 15, moderate: 45, large: 100 },
        csv: generate("binary", designs, truth, 22),
      },
    ],
  };
}

export function demoBriefs(): DemoBrief[] {
  return [smallBrief, largeBrief()];
}
