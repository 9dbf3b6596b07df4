// Arm-level effects and their variances (METHODS.md §2), the zero-cell rule (Sweeting, Sutton &
// Lambert, Stat Med 2004;23:1351, common practice), and the least-squares reconstruction of arm
// effects for multi-arm studies given as contrasts (§1).
import { Matrix, solve } from "ml-matrix";
import { DatasetError, type ArmEffects, type BinaryArm, type DatasetIssue, type Measure, type ParsedStudy } from "./types";

/** The tolerance of the least-squares reconstruction of multi-arm contrast studies (§1). */
const reconstructionTolerance = 1e-4;

export interface Exclusion {
  study: string;
  reason: "no-events" | "all-events";
}

export interface ArmEffectsResult {
  studies: ArmEffects[];
  excluded: Exclusion[];
}

export function armEffects(parsed: ParsedStudy[], measure: Measure): ArmEffectsResult {
  const studies: ArmEffects[] = [];
  const excluded: Exclusion[] = [];
  const issues: DatasetIssue[] = [];
  for (const study of parsed) {
    const effects = studyEffects(study, measure);
    if ("issue" in effects) issues.push(effects.issue);
    else if ("reason" in effects) excluded.push(effects);
    // The judgement travels with the study; without the column there is none to carry.
    else studies.push(study.riskOfBias === undefined ? effects : { ...effects, riskOfBias: study.riskOfBias });
  }
  if (issues.length > 0) throw new DatasetError(issues);
  return { studies, excluded };
}

function studyEffects(study: ParsedStudy, measure: Measure): ArmEffects | Exclusion | { issue: DatasetIssue } {
  if (study.format === "arm-binary") {
    const exclusion = doubleZero(study.arms, measure);
    return exclusion ? { study: study.study, reason: exclusion } : binaryEffects(study.study, study.arms, measure);
  }
  if (study.format === "arm-continuous") {
    return {
      study: study.study,
      treatments: study.arms.map((a) => a.treatment),
      effects: study.arms.map((a) => a.mean),
      variances: study.arms.map((a) => (a.sd * a.sd) / a.n),
      participants: study.arms.map((a) => a.n),
    };
  }
  return contrastStudyEffects(study);
}

/** For OR and RR a study with no events in any arm, or events in every participant of every arm, carries no information. */
function doubleZero(arms: BinaryArm[], measure: Measure): Exclusion["reason"] | null {
  if (measure !== "OR" && measure !== "RR") return null;
  if (arms.every((a) => a.events === 0)) return "no-events";
  if (arms.every((a) => a.events === a.total)) return "all-events";
  return null;
}

function binaryEffects(study: string, arms: BinaryArm[], measure: Measure): ArmEffects {
  // Zero or full cells anywhere: add 0.5 to events and non-events of every arm of the study.
  const corrected = arms.some((a) => a.events === 0 || a.events === a.total);
  const effects: number[] = [];
  const variances: number[] = [];
  for (const arm of arms) {
    const e = corrected ? arm.events + 0.5 : arm.events;
    const n = corrected ? arm.total + 1 : arm.total;
    switch (measure) {
      case "OR":
        effects.push(Math.log(e / (n - e)));
        variances.push(1 / e + 1 / (n - e));
        break;
      case "RR":
        effects.push(Math.log(e / n));
        variances.push(1 / e - 1 / n);
        break;
      case "RD": {
        // The correction enters the variance only: the risk itself stays e/n.
        const p = e / n;
        effects.push(arm.events / arm.total);
        variances.push((p * (1 - p)) / n);
        break;
      }
      case "MD":
        throw new Error("MD is not a measure for binary arms");
    }
  }
  return { study, treatments: arms.map((a) => a.treatment), effects, variances, participants: arms.map((a) => a.total) };
}

/**
 * A two-arm contrast study is one contrast: treatment2 as the baseline arm with θ = 0, v = 0, and
 * treatment1 with θ = estimate, v = se². A study with k ≥ 3 arms gets the least-squares arm effects
 * μ (first arm 0) of estimate_jk = μ_j − μ_k and arm variances s of se_jk² = s_j + s_k.
 */
function contrastStudyEffects(study: Extract<ParsedStudy, { format: "contrast" }>): ArmEffects | { issue: DatasetIssue } {
  const rows = study.contrasts;
  if (rows.length === 1) {
    const [only] = rows;
    return {
      study: study.study,
      treatments: [only!.treatment2, only!.treatment1],
      effects: [0, only!.estimate],
      variances: [0, only!.se * only!.se],
      participants: [null, null],
    };
  }
  const treatments: string[] = [];
  for (const row of rows) for (const t of [row.treatment1, row.treatment2]) if (!treatments.includes(t)) treatments.push(t);
  const k = treatments.length;
  const index = (t: string) => treatments.indexOf(t);

  // μ_1 = 0: unknowns μ_2..μ_k.
  const design = Matrix.zeros(rows.length, k - 1);
  const variancesDesign = Matrix.zeros(rows.length, k);
  rows.forEach((row, r) => {
    const j = index(row.treatment1);
    const l = index(row.treatment2);
    if (j > 0) design.set(r, j - 1, 1);
    if (l > 0) design.set(r, l - 1, -1);
    variancesDesign.set(r, j, 1);
    variancesDesign.set(r, l, 1);
  });
  const mu = [0, ...solve(design, Matrix.columnVector(rows.map((r) => r.estimate))).to1DArray()];
  const s = solve(variancesDesign, Matrix.columnVector(rows.map((r) => r.se * r.se))).to1DArray();

  const worst = Math.max(...rows.map((row) => Math.abs(mu[index(row.treatment1)]! - mu[index(row.treatment2)]! - row.estimate)));
  if (worst > reconstructionTolerance || s.some((v) => v < 0)) {
    return {
      issue: {
        rule: "inconsistent-multi-arm",
        row: rows[0]!.row,
        column: "study",
        value: study.study,
        facts: worst > reconstructionTolerance ? { reason: "estimates", worst: Number(worst.toPrecision(3)), allowed: reconstructionTolerance } : { reason: "variance" },
        message:
          worst > reconstructionTolerance
            ? `the comparisons of study ${study.study} do not fit together: reconstructed estimates differ by up to ${worst.toPrecision(3)} (allowed ${reconstructionTolerance})`
            : `the standard errors of study ${study.study} imply a negative arm variance`,
      },
    };
  }
  return { study: study.study, treatments, effects: mu, variances: s, participants: treatments.map(() => null) };
}
