// Seeded standard normal draws, the same stream as @stdlib/random-base-normal with the same seed (the
// engine's generator before decision 0049; tests/unit/core/nma/kernels.test.ts compares them):
// - uniform integers from the Mersenne Twister MT19937 (Matsumoto & Nishimura, ACM Trans Model Comput
//   Simul 1998;8:3–30), seeded by init_genrand;
// - uniform doubles in [0, 1) from two of them (27 and 26 bits: 53 bits);
// - normals by the improved ziggurat method (Doornik, "An improved ziggurat method to generate normal
//   random samples", 2005), 128 blocks, as @stdlib/random-base-improved-ziggurat lays them out.
// exp and ln are fdlibm's, as stdlib computes them (./fdlibm.ts), so that the tables and the rare
// wedge and tail draws round exactly as before.
import { exp, ln } from "./fdlibm";

const N: i32 = 624;
const M: i32 = 397;
const state = memory.data(N * 4, 4);
let position: i32 = N;

@inline function word(i: i32): u32 {
  return load<u32>(state + (<usize>i << 2));
}
@inline function setWord(i: i32, value: u32): void {
  store<u32>(state + (<usize>i << 2), value);
}
@inline function mix(upper: u32, lower: u32, other: u32): u32 {
  const y = (upper & 0x80000000) | (lower & 0x7fffffff);
  return other ^ (y >>> 1) ^ ((0 - (y & 1)) & 0x9908b0df);
}

/** The next N words of the generator's state. */
function twist(): void {
  let i = 0;
  for (; i < N - M; i++) setWord(i, mix(word(i), word(i + 1), word(i + M)));
  for (; i < N - 1; i++) setWord(i, mix(word(i), word(i + 1), word(i + M - N)));
  setWord(N - 1, mix(word(N - 1), word(0), word(M - 1)));
  position = 0;
}

/** The next tempered 32-bit output. */
@inline function next(): u32 {
  if (position >= N) twist();
  let y = word(position++);
  y ^= y >>> 11;
  y ^= (y << 7) & 0x9d2c5680;
  y ^= (y << 15) & 0xefc60000;
  return y ^ (y >>> 18);
}

/** A uniform double in [0, 1) with 53 random bits. */
@inline function uniform(): f64 {
  const high = next() >>> 5;
  const low = next() >>> 6;
  return (<f64>high * 67108864.0 + <f64>low) / 9007199254740992.0;
}

const BLOCKS: i32 = 128;
/** Where the right tail starts (R), and the common area of the blocks (V). */
const TAIL: f64 = 3.442619855899;
const AREA: f64 = 9.91256303526217e-3;
/** X[i]: the blocks' right edges, X[0] = V / f(R) for the base block; RATIO[i] = X[i + 1] / X[i]. */
const X = memory.data((BLOCKS + 1) * 8, 8);
const RATIO = memory.data(BLOCKS * 8, 8);

@inline function edge(i: i32): f64 {
  return load<f64>(X + (<usize>i << 3));
}
@inline function ratio(i: i32): f64 {
  return load<f64>(RATIO + (<usize>i << 3));
}

/** Restarts the stream at `seed` (1 to 2³² − 1). */
export function seedNormals(seed: u32): void {
  setWord(0, seed);
  for (let i = 1; i < N; i++) {
    const previous = word(i - 1);
    setWord(i, (previous ^ (previous >>> 30)) * 1812433253 + <u32>i);
  }
  position = N;
  let f = exp(-0.5 * TAIL * TAIL);
  store<f64>(X, AREA / f);
  store<f64>(X + 8, TAIL);
  for (let i = 2; i < BLOCKS; i++) {
    const x = Math.sqrt(-2.0 * ln(AREA / edge(i - 1) + f));
    store<f64>(X + (<usize>i << 3), x);
    f = exp(-0.5 * x * x);
  }
  store<f64>(X + (<usize>BLOCKS << 3), 0.0);
  for (let i = 0; i < BLOCKS; i++) store<f64>(RATIO + (<usize>i << 3), edge(i + 1) / edge(i));
}

/** One standard normal draw. */
export function normal(): f64 {
  while (true) {
    const u = 2.0 * uniform() - 1.0;
    const i = <i32>(next() & 127);
    // Inside a block: by far the most common case.
    if (Math.abs(u) < ratio(i)) return u * edge(i);
    if (i == 0) {
      // The base block: a draw from the tail beyond R (Marsaglia's method).
      let x: f64, y: f64;
      do {
        x = ln(uniform()) / TAIL;
        y = ln(uniform());
      } while (-2.0 * y < x * x);
      return u < 0.0 ? x - TAIL : TAIL - x;
    }
    // In a wedge: accept under the density, otherwise draw again.
    const x = u * edge(i);
    const x2 = x * x;
    const f0 = exp(-0.5 * (edge(i) * edge(i) - x2));
    const f1 = exp(-0.5 * (edge(i + 1) * edge(i + 1) - x2));
    if (f1 + uniform() * (f0 - f1) < 1.0) return x;
  }
}

/** Fills count doubles at z with the next normals of the stream. */
export function fillNormals(z: usize, count: i32): void {
  for (let k = 0; k < count; k++) store<f64>(z + (<usize>k << 3), normal());
}
