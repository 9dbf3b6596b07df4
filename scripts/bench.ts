// npm run bench: the full analysis (random effects with REML, every pair split, the design
// decomposition, study importances and risk-of-bias shares of §13, 10 000-draw ranking) on seeded synthetic networks of invented data, each size in a
// fresh process so that its peak memory is its own. Prints a table; asserts nothing.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import normal from "@stdlib/random-base-normal";
import { analyse } from "#core/nma/analyse";
import type { ContinuousArm, ParsedDataset } from "#core/nma/types";

const sizes = [
  { treatments: 27, studies: 300, target: "< 100 ms", runs: 7 },
  { treatments: 60, studies: 1500, target: "< 1 s", runs: 5 },
  { treatments: 100, studies: 5000, target: "< 5 s", runs: 3 },
];
const threeArmShare = 0.15;
/** The command line's peer: the same analysis by R with metafor (decision 0032). */
const peerScript = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "bench-peer.R");

/** Invented continuous-outcome data: a spanning chain keeps the network connected, the rest is random. */
export function syntheticNetwork(treatments: number, studies: number, seed: number): ParsedDataset {
  const gaussian = normal.factory(0, 1, { seed });
  const uniform = () => 0.5 * (1 + Math.tanh(gaussian())); // a seeded value in (0, 1)
  const pick = () => Math.min(treatments - 1, Math.floor(uniform() * treatments));
  const trueEffect = Array.from({ length: treatments }, () => 0.5 * gaussian());
  const names = Array.from({ length: treatments }, (_, i) => `t${String(i).padStart(3, "0")}`);
  const result: ParsedDataset = { format: "arm-continuous", studies: [], riskOfBiasColumn: true };
  const judgements = ["low", "some-concerns", "high", null] as const;
  for (let s = 0; s < studies; s++) {
    const arms = new Set<number>(s < treatments - 1 ? [s, s + 1] : []);
    const size = s >= treatments - 1 && uniform() < threeArmShare ? 3 : 2;
    while (arms.size < size) arms.add(pick());
    const studyEffect = 0.2 * gaussian();
    const list: ContinuousArm[] = [...arms].map((t, i) => {
      const n = 20 + Math.floor(uniform() * 200);
      const sd = 1 + uniform();
      return { treatment: names[t]!, mean: trueEffect[t]! + (i > 0 ? studyEffect : 0) + (sd / Math.sqrt(n)) * gaussian(), sd, n, row: 0 };
    });
    result.studies.push({ format: "arm-continuous", study: `S${s}`, arms: list, riskOfBias: judgements[Math.min(3, Math.floor(uniform() * 4))] ?? null });
  }
  return result;
}

function measureOne(treatments: number, studies: number, runs: number) {
  const dataset = syntheticNetwork(treatments, studies, 20261201);
  const times: number[] = [];
  let tau2 = 0;
  for (let run = 0; run < runs; run++) {
    const start = performance.now();
    const result = analyse(dataset, { measure: "MD", model: "random", reference: "t000", better: "lower", draws: 10_000, seed: 1 });
    times.push(performance.now() - start);
    tau2 = result.tau2;
  }
  times.sort((a, b) => a - b);
  return {
    medianMs: times[Math.floor(times.length / 2)]!,
    minMs: times[0]!,
    peakRssMiB: process.resourceUsage().maxRSS / 1024,
    heapMiB: process.memoryUsage().heapUsed / 2 ** 20,
    tau2,
  };
}

const one = process.argv.indexOf("--one");
if (one >= 0) {
  const [treatments, studies, runs] = process.argv.slice(one + 1, one + 4).map(Number);
  process.stdout.write(JSON.stringify(measureOne(treatments!, studies!, runs!)));
} else {
  const self = fileURLToPath(import.meta.url);
  const tsx = path.resolve(path.dirname(self), "../node_modules/.bin/tsx");
  console.log("Full analysis: random effects (REML), all pairs split, design decomposition, study importances and risk-of-bias shares (§13), 10 000 draws; median of runs\n");
  console.log("| network (treatments × studies) | median | fastest | runs | peak RSS | heap after | target |");
  console.log("|---|---|---|---|---|---|---|");
  for (const size of sizes) {
    const child = spawnSync(tsx, [self, "--one", String(size.treatments), String(size.studies), String(size.runs)], { encoding: "utf8" });
    if (child.status !== 0) throw new Error(child.stderr);
    const m = JSON.parse(child.stdout);
    console.log(
      `| ${size.treatments} × ${size.studies} | ${m.medianMs.toFixed(0)} ms | ${m.minMs.toFixed(0)} ms | ${size.runs} | ${m.peakRssMiB.toFixed(0)} MiB | ${m.heapMiB.toFixed(0)} MiB | ${size.target} |`,
    );
  }
  commandLine();
}

/** Whether R and metafor are here to run the command line's peer. */
function peerAvailable(): boolean {
  return spawnSync("Rscript", ["-e", "library(metafor)"], { encoding: "utf8" }).status === 0;
}

/** The median time of `runs` runs of a child process that must succeed. */
function medianMs(runs: number, run: () => ReturnType<typeof spawnSync>): number {
  const times = Array.from({ length: runs }, () => {
    const start = performance.now();
    const child = run();
    if (child.status !== 0) throw new Error(String(child.stderr));
    return performance.now() - start;
  });
  return times.sort((a, b) => a - b)[Math.floor(runs / 2)]!;
}

/**
 * The whole command-line process (METHODS.md §11) on the same networks written as CSV: start-up,
 * reading, analysis and printing, as a script calling `npm run nma` would see it (without npm's own
 * start-up). The prebuilt bundle is built first, so no run pays for it.
 */
function commandLine() {
  const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-bench-"));
  const cli = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "nma.cjs");
  const peer = peerAvailable();
  // Where NODE_EXTRA_CA_CERTS is set (this machine sets it for its package proxy), Node reads that
  // whole certificate bundle at every start, which no analysis needs and R does not pay: ours is timed
  // both without it (as on a machine that does not set it) and with it (as this machine starts it).
  const plainEnvironment = { ...process.env, NODE_EXTRA_CA_CERTS: "" };
  const certificates = process.env.NODE_EXTRA_CA_CERTS ? process.env : null;
  console.log("\nThe command line, whole process (node scripts/nma.cjs, default 10 000 draws); median of 7 runs (R: 5), in rounds of ours and R's");
  console.log(
    peer
      ? "beside its peer on the same file: R with metafor (scripts/bench-peer.R), once doing §2–§6 only (less than ours, which also computes §13's importances and shares: a conservative ratio), once the whole of §2–§6 and §13 as the reference values were computed (the same output: like for like; one run); on the smaller network only\n"
      : "(no peer: Rscript with metafor is not installed; `apt-get install r-base-core r-cran-metafor` to measure the ratio)\n",
  );
  console.log("| network (treatments × studies) | ours | ours with NODE_EXTRA_CA_CERTS | peak RSS | R, §2–§6 | ratio | ratio with the certificates | R, §2–§6 and §13 | ratio | target |");
  console.log("|---|---|---|---|---|---|---|---|---|---|");
  for (const size of sizes.slice(0, 2)) {
    const file = path.join(folder, `${size.treatments}x${size.studies}.csv`);
    const rows = syntheticNetwork(size.treatments, size.studies, 20261201).studies.flatMap((study) =>
      ("arms" in study ? (study.arms as ContinuousArm[]) : []).map((arm) => `${study.study},${arm.treatment},${arm.mean},${arm.sd},${arm.n},${study.riskOfBias?.replace("-", " ") ?? ""}`),
    );
    writeFileSync(file, `study,treatment,mean,sd,n,risk_of_bias\n${rows.join("\n")}\n`);
    const args = [cli, "--input", file, "--format", "arm-continuous", "--measure", "MD", "--model", "random", "--reference", "t000", "--better", "lower"];
    spawnSync(process.execPath, args); // builds the bundle if it is missing or stale
    const ours = (env: NodeJS.ProcessEnv) => {
      const start = performance.now();
      const child = spawnSync("/usr/bin/time", ["-f", "%M", process.execPath, ...args], { encoding: "utf8", maxBuffer: 2 ** 28, env });
      if (child.status !== 0) throw new Error(child.stderr);
      return { ms: performance.now() - start, rssKiB: Number(child.stderr.trim().split("\n").at(-1)) };
    };
    const small = size.treatments === 27;
    const r = (mode: string[]) => () => spawnSync("Rscript", [peerScript, file, "t000", ...mode], { encoding: "utf8", env: plainEnvironment });
    // In rounds (ours, ours with the certificates, R): this shared machine's speed drifts by a fifth
    // from one minute to the next, and a slow minute then slows both sides of the ratio alike.
    const plainRuns: { ms: number; rssKiB: number }[] = [];
    const certificateRuns: number[] = [];
    const peerRuns: number[] = [];
    for (let round = 0; round < 7; round++) {
      plainRuns.push(ours(plainEnvironment));
      if (certificates) certificateRuns.push(ours(certificates).ms);
      // R needs minutes for the larger network (its dense covariance of every contrast): the peer runs on the smaller one.
      if (peer && small && round < 5) peerRuns.push(medianMs(1, r([])));
    }
    const plain = plainRuns.sort((a, b) => a.ms - b.ms)[3]!;
    const withCertificates = certificates ? certificateRuns.sort((a, b) => a - b)[3]! : null;
    const partial = peerRuns.length > 0 ? peerRuns.sort((a, b) => a - b)[2]! : null;
    const whole = peer && small ? medianMs(1, r(["all"])) : null;
    const shown = (ms: number | null) => (ms === null ? "—" : `${(ms / 1000).toFixed(1)} s`);
    const ratio = (peerMs: number | null, oursMs: number | null) => (peerMs === null || oursMs === null ? "—" : `${(peerMs / oursMs).toFixed(1)}×`);
    const target = small ? "≥ 20× faster than R" : "< 1 s whole";
    const withShown = withCertificates === null ? "— (not set)" : `${withCertificates.toFixed(0)} ms`;
    console.log(
      `| ${size.treatments} × ${size.studies} | ${plain.ms.toFixed(0)} ms | ${withShown} | ${(plain.rssKiB / 1024).toFixed(0)} MiB | ${shown(partial)} | ${ratio(partial, plain.ms)} | ${ratio(partial, withCertificates)} | ${shown(whole)} | ${ratio(whole, plain.ms)} | ${target} |`,
    );
  }
  rmSync(folder, { recursive: true, force: true });
}
