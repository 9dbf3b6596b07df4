// Pairs of treatments, one way for the engine, the certainty rules, the pages and the desk. A pair
// "a vs b" is a relative to b (METHODS.md, sign convention): read the other way, the estimate changes
// sign and the interval's bounds swap.

/** The key of an unordered pair: the same for a vs b and b vs a. */
export function pairKey(a: string, b: string): string {
  return a < b ? `${a}\u0000${b}` : `${b}\u0000${a}`;
}

export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
}

/** The interval of b vs a from that of a vs b. */
export function flipInterval<T extends Interval>(x: T): T {
  return { ...x, estimate: -x.estimate, lower: -x.upper, upper: -x.lower };
}

type Finder<T> = (a: string, b: string) => { item: T; flipped: boolean } | null;

// Results and snapshots are never changed once made: one index per list of pairs serves every lookup.
const finders = new WeakMap<readonly object[], Finder<object>>();

/**
 * Finds "a vs b" among items that list each pair once, in either order: the item, and whether it is
 * listed the other way round (then its estimates must be flipped to read as a vs b). The index is
 * built once per list.
 */
export function pairFinder<T extends { treatment: string; comparator: string }>(items: readonly T[]): Finder<T> {
  const known = finders.get(items);
  if (known) return known as Finder<T>;
  const byKey = new Map(items.map((item) => [pairKey(item.treatment, item.comparator), item]));
  const find: Finder<T> = (a, b) => {
    const item = byKey.get(pairKey(a, b));
    if (!item || a === b) return null;
    return { item, flipped: item.treatment !== a };
  };
  finders.set(items, find as Finder<object>);
  return find;
}
