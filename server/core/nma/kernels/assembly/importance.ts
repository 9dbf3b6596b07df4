// The pair loop of the study importances (METHODS.md §13; ../../importance.ts documents the
// formulas): for one study, every pair's loss of precision without it, kept in each pair's list of
// the most important studies. Same arithmetic, order and ties as the loop it replaced (decision 0049).
import { at, index, put } from "./linear";

/** Below this, an eigenvalue of N is a direction the network loses entirely without the study. */
const LOST_DIRECTION: f64 = 1e-9;

/**
 * Scores study `study` (whose label ranks `rank` in code-point order) for every pair i < j of the T
 * options: h = rows[·][column i] − rows[·][column j] over its m directions (column −1: the
 * reference, 0), I = 1 when a lost direction (λ ≤ 1e-9) carries some of h, otherwise
 * Σ h²/λ / (v_N + Σ h²/λ). A value ≥ floor enters the pair's list: `length` entries at most, largest
 * first, equal values by label. Lists are stored per pair (i·T + j) as `length` values, studies and
 * ranks, with their fill in `filled`. `h` is scratch for T·m doubles.
 */
export function scoreStudy(
  study: i32,
  rank: i32,
  m: i32,
  rows: usize,
  lambda: usize,
  p: i32,
  T: i32,
  column: usize,
  variance: usize,
  floor: f64,
  length: i32,
  values: usize,
  studies: usize,
  ranks: usize,
  filled: usize,
  h: usize,
): void {
  // Each option's coordinates in the study's directions, read once.
  for (let t = 0; t < T; t++) {
    const c = index(column, t);
    for (let k = 0; k < m; k++) put(h, t * m + k, c >= 0 ? at(rows, k * p + c) : 0);
  }
  for (let i = 0; i < T; i++) {
    for (let j = i + 1; j < T; j++) {
      const vN = at(variance, i * T + j);
      let extra = 0.0;
      let lost = false;
      for (let k = 0; k < m; k++) {
        const d = at(h, i * m + k) - at(h, j * m + k);
        const l = at(lambda, k);
        if (l > LOST_DIRECTION) extra += (d * d) / l;
        else if (Math.abs(d) > 1e-6 * Math.sqrt(vN)) lost = true;
      }
      const value = lost ? 1 : extra / (vN + extra);
      if (value >= floor) insert(i * T + j, value, study, rank, length, values, studies, ranks, filled);
    }
  }
}

/** Whether (value, rank) goes before entry e of the list: largest first, equal values by label. */
@inline function precedes(value: f64, rank: i32, values: usize, ranks: usize, e: i32): bool {
  const other = at(values, e);
  return value > other || (value == other && rank < index(ranks, e));
}

function insert(pair: i32, value: f64, study: i32, rank: i32, length: i32, values: usize, studies: usize, ranks: usize, filled: usize): void {
  const first = pair * length;
  const count = index(filled, pair);
  if (count == length && !precedes(value, rank, values, ranks, first + length - 1)) return;
  let i = count < length ? count : length - 1;
  while (i > 0 && precedes(value, rank, values, ranks, first + i - 1)) {
    put(values, first + i, at(values, first + i - 1));
    store<i32>(studies + (<usize>(first + i) << 2), index(studies, first + i - 1));
    store<i32>(ranks + (<usize>(first + i) << 2), index(ranks, first + i - 1));
    i--;
  }
  put(values, first + i, value);
  store<i32>(studies + (<usize>(first + i) << 2), study);
  store<i32>(ranks + (<usize>(first + i) << 2), rank);
  if (count < length) store<i32>(filled + (<usize>pair << 2), count + 1);
}
