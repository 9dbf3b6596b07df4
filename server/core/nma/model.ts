// The contrast-based network model of METHODS.md §3 (White, Barrett, Jackson & Higgins, Res Synth
// Methods 2012;3:111–125; Salanti, Res Synth Methods 2012;3:80–97): y = Xβ + δ + ε with
// ε ~ N(0, V) block-diagonal by study and δ ~ N(0, τ²P), P = 1 on the diagonal and ½ off it within a
// study (Higgins & Whitehead, Stat Med 1996;15:2733–2749). XᵀWX and XᵀWy are accumulated study by
// study; the full V is never formed.
import { fitStudies, type PackedStudies } from "./kernels";
import type { ArmEffects } from "./types";

/** One study's contrasts against its first arm (the baseline b): y_j = θ_j − θ_b (§2, Gleser & Olkin 2009). */
export interface StudyBlock {
  study: string;
  treatments: string[];
  y: number[];
  /** Var(y_j) = v_j + v_b on the diagonal, Cov(y_j, y_k) = v_b off it. */
  V: number[][];
  /** For each contrast, the parameter columns of +d_j and −d_b (−1 where the treatment is the reference). */
  plus: number[];
  minus: number[];
}

export function studyBlocks(studies: ArmEffects[], columnOf: (treatment: string) => number): StudyBlock[] {
  return studies.map((study) => {
    const vb = study.variances[0]!;
    const m = study.treatments.length - 1;
    const V = Array.from({ length: m }, (_, j) =>
      Array.from({ length: m }, (_, k) => vb + (j === k ? study.variances[j + 1]! : 0)),
    );
    const baseline = columnOf(study.treatments[0]!);
    return {
      study: study.study,
      treatments: study.treatments,
      y: study.effects.slice(1).map((theta) => theta - study.effects[0]!),
      V,
      plus: study.treatments.slice(1).map(columnOf),
      minus: Array.from({ length: m }, () => baseline),
    };
  });
}

/** (S + Sᵀ)/2: rounding leaves inverses a hair off symmetric, and the Cholesky factorisation insists. */
export function symmetrise(S: number[][]): number[][] {
  return S.map((row, i) => row.map((value, j) => (i === j ? value : (value + S[j]![i]!) / 2)));
}

export interface Fit {
  tau2: number;
  /** β̂: the basic parameters d_R,t, one per non-reference treatment. */
  beta: number[];
  /** Cov(β̂) = (XᵀWX)⁻¹. */
  covariance: number[][];
  /** (y − Xβ̂)ᵀ W (y − Xβ̂). */
  residual: number;
  /** The restricted log-likelihood up to its constant, and its first derivative and Fisher information in τ². */
  restrictedLogLikelihood: number;
  score: number;
  information: number;
}

/** The studies laid out for the fit kernel, once per list of blocks (REML fits the same list again and again). */
const packed = new WeakMap<StudyBlock[], PackedStudies>();

function pack(blocks: StudyBlock[]): PackedStudies {
  let studies = packed.get(blocks);
  if (!studies) {
    studies = {
      sizes: Int32Array.from(blocks, (block) => block.y.length),
      y: Float64Array.from(blocks.flatMap((block) => block.y)),
      V: Float64Array.from(blocks.flatMap((block) => block.V.flat())),
      plus: Int32Array.from(blocks.flatMap((block) => block.plus)),
      minus: Int32Array.from(blocks.flatMap((block) => block.minus)),
    };
    packed.set(blocks, studies);
  }
  return studies;
}

/**
 * Generalised least squares at a given τ² (§3): β̂ = (XᵀWX)⁻¹XᵀWy, Cov(β̂) = (XᵀWX)⁻¹, with W the
 * inverse of Σᵢ = Vᵢ + τ²Pᵢ (through a Cholesky factor for multi-arm studies). Also the REML criterion
 * and its derivatives (Harville, JASA 1977;72:320–338):
 *   ℓ_R = −½ [Σ log|Σᵢ| + log|XᵀWX| + rᵀWr]
 *   ∂ℓ_R/∂τ² = ½ [rᵀWPWr − tr(WP) + tr(H·XᵀWPWX)],  H = (XᵀWX)⁻¹
 *   I(τ²) = ½ tr(ΠPΠP), Π = W − WXHXᵀW, expanded study by study.
 * XᵀWX and XᵀWy are accumulated study by study; the full V is never formed. The arithmetic runs in
 * WebAssembly (./kernels/assembly/fit.ts).
 */
export function fitAt(blocks: StudyBlock[], parameters: number, tau2: number): Fit {
  const fit = fitStudies(pack(blocks), parameters, tau2);
  if (fit === "singular") throw new Error("XᵀWX is singular: the network is not connected");
  if ("notPositiveDefinite" in fit) throw new Error(`the covariance of study ${blocks[fit.notPositiveDefinite]!.study} is not positive definite`);
  return {
    tau2,
    beta: Array.from(fit.beta),
    covariance: Array.from({ length: parameters }, (_, i) => Array.from(fit.covariance.subarray(i * parameters, (i + 1) * parameters))),
    residual: fit.residual,
    restrictedLogLikelihood: fit.restrictedLogLikelihood,
    score: fit.score,
    information: fit.information,
  };
}
