// Heterogeneity and inconsistency (METHODS.md §4): Q and I² from the fixed-effect fit (Higgins &
// Thompson, Stat Med 2002;21:1539), and Q split into within- and between-design parts (Krahn,
// Binder & König, BMC Med Res Methodol 2013;13:35). A design is the set of treatments of a study.
import chisquareCdf from "@stdlib/stats-base-dists-chisquare-cdf";
import { fitAt, studyBlocks } from "./model";
import type { ArmEffects } from "./types";

export interface Heterogeneity {
  Q: number;
  df: number;
  I2: number;
  p: number | null;
}

export interface Inconsistency {
  Qwithin: number;
  dfWithin: number;
  pWithin: number | null;
  Qbetween: number;
  dfBetween: number;
  pBetween: number | null;
}

/** The upper tail of χ² with df degrees of freedom; null where df is 0 and there is nothing to test. */
export function chiSquareUpper(q: number, df: number): number | null {
  return df > 0 ? 1 - chisquareCdf(Math.max(q, 0), df) : null;
}

export function heterogeneity(Q: number, df: number): Heterogeneity {
  return { Q, df, I2: Q > 0 ? Math.max(0, (Q - df) / Q) : 0, p: chiSquareUpper(Q, df) };
}

/** Σ (kᵢ − 1) − (T − 1): contrasts minus parameters. */
export function degreesOfFreedom(studies: ArmEffects[], treatmentCount: number): number {
  return studies.reduce((sum, s) => sum + s.treatments.length - 1, 0) - (treatmentCount - 1);
}

/** Q_within: the sum over designs of the Q of a fixed-effect model fitted to that design's studies alone. */
export function inconsistency(studies: ArmEffects[], Q: number, df: number): Inconsistency {
  const designs = new Map<string, ArmEffects[]>();
  for (const study of studies) {
    const key = [...study.treatments].sort().join("\u0000");
    designs.set(key, [...(designs.get(key) ?? []), study]);
  }
  let Qwithin = 0;
  let dfWithin = 0;
  for (const [key, members] of designs) {
    const treatments = key.split("\u0000");
    const designDf = degreesOfFreedom(members, treatments.length);
    if (designDf === 0) continue; // one study of its design: it fits its own contrasts exactly
    const columnOf = (t: string) => treatments.indexOf(t) - 1; // the design's first treatment is its reference
    Qwithin += fitAt(studyBlocks(members, columnOf), treatments.length - 1, 0).residual;
    dfWithin += designDf;
  }
  const Qbetween = Q - Qwithin;
  const dfBetween = df - dfWithin;
  return {
    Qwithin,
    dfWithin,
    pWithin: chiSquareUpper(Qwithin, dfWithin),
    Qbetween,
    dfBetween,
    pBetween: chiSquareUpper(Qbetween, dfBetween),
  };
}
