// A large invented network for the queue's tests: more lines than the desk analyses in the request.
/** An invented binary network: a chain through every treatment, then random pairs (a seeded LCG); `split` cuts it in two parts. */
export function largeNetwork(treatments: number, studies: number, split = false): string {
  let seed = 20261202;
  const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  const name = (i: number) => `t${String(i).padStart(2, "0")}`;
  const half = Math.floor(treatments / 2);
  const rows: string[] = [];
  for (let s = 0; s < studies; s++) {
    const a = s < treatments - 1 ? s : Math.floor(next() * treatments);
    let b = s < treatments - 1 ? s + 1 : Math.floor(next() * treatments);
    if (a === b) b = (b + 1) % treatments;
    // Split: no study joins the first half to the second.
    if (split && a < half !== b < half) b = a < half ? (a + 1) % half : half + ((a + 1 - half) % (treatments - half));
    if (a === b) continue;
    for (const t of [a, b]) {
      const total = 80 + Math.floor(next() * 120);
      rows.push(`S${s},${name(t)},${5 + Math.floor(next() * (total - 10))},${total}`);
    }
  }
  return `study,treatment,events,total\n${rows.join("\n")}\n`;
}

