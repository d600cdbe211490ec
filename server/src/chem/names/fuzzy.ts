/**
 * Edit distance (Levenshtein: insertions, deletions, substitutions, each costing 1), bounded: the answer
 * is exact up to `max` and `max + 1` beyond it, and the work stops as soon as the bound is passed.
 */
export function distanceWithin(a: string, b: string, max: number): number {
  if (Math.abs(a.length - b.length) > max) return max + 1;
  if (a === b) return 0;
  let prev = new Array<number>(b.length + 1);
  let cur = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    cur[0] = i;
    let best = cur[0];
    const ca = a.charCodeAt(i - 1);
    for (let j = 1; j <= b.length; j++) {
      const sub = prev[j - 1] + (ca === b.charCodeAt(j - 1) ? 0 : 1);
      const v = Math.min(sub, prev[j] + 1, cur[j - 1] + 1);
      cur[j] = v;
      if (v < best) best = v;
    }
    if (best > max) return max + 1;
    [prev, cur] = [cur, prev];
  }
  return Math.min(prev[b.length], max + 1);
}
