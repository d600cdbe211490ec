/**
 * Charging a segmentation: the cheapest choice of ion charges (usual first) whose sum is the written
 * charge, with mixed valence for a metal written with a count (Fe3O4: Fe²⁺ + 2 Fe³⁺) and averages for
 * non-stoichiometric phases (Fe0.95O).
 */
import type { Segment } from './segments';

export interface SegmentCharge {
  segment: Segment;
  /** Total charge of the segment (all its units). */
  total: number;
  /** Per-atom states for metal segments, else per-unit charges (all equal). */
  unitCharges: number[];
  cost: number;
}

export interface IonicSolution {
  segments: SegmentCharge[];
  cost: number;
  sum: number;
}

interface Opt {
  total: number;
  unitCharges: number[];
  cost: number;
}

const key = (x: number) => Math.round(x * 1e6);
const MAX_MIX = 24;

/** The ways a segment can be charged, over all its units. */
function segmentOptions(s: Segment): Opt[] {
  const m = s.multiplicity;
  const out: Opt[] = s.unitOptions.map((o) => ({
    total: o.charge * m,
    unitCharges: Number.isInteger(m) && m <= MAX_MIX ? Array(m).fill(o.charge) : [o.charge],
    cost: o.cost,
  }));
  // Mixed valence: a metal written with a whole count may carry two of its states.
  if (s.kind === 'metal' && Number.isInteger(m) && m >= 2 && m <= MAX_MIX) {
    const u = s.unitOptions;
    for (let a = 0; a < u.length; a++) {
      for (let b = a + 1; b < u.length; b++) {
        for (let j = 1; j < m; j++) {
          out.push({
            total: j * u[a].charge + (m - j) * u[b].charge,
            unitCharges: [...Array(j).fill(u[a].charge), ...Array(m - j).fill(u[b].charge)],
            // Neighbouring states first: Mn3O4 is Mn²⁺ + 2 Mn³⁺ (hausmannite), not 2 Mn²⁺ + Mn⁴⁺.
            cost: Math.max(u[a].cost, u[b].cost) + 0.5 + 0.05 * (Math.abs(u[a].charge - u[b].charge) - 1),
          });
        }
      }
    }
  }
  return out;
}

/** Is this a metal segment that should absorb a fractional balance (only in non-stoichiometric formulas)? */
const isAbsorber = (s: Segment) => s.kind === 'metal' && s.unitOptions.length > 1;

/**
 * The cheapest charging of the segments that sums to `target`, or null.
 * With `continuous`, metals with several states may take a non-integer average (non-stoichiometric phases).
 */
export function solve(segs: Segment[], target: number, continuous: boolean): IonicSolution | null {
  const absorbers = continuous ? segs.filter(isAbsorber) : [];
  const discrete = segs.filter((s) => !absorbers.includes(s));
  type Cell = { cost: number; picks: Opt[] };
  let layer = new Map<number, Cell & { sum: number }>([[0, { cost: 0, picks: [], sum: 0 }]]);
  for (const s of discrete) {
    const next = new Map<number, Cell & { sum: number }>();
    for (const v of layer.values()) {
      for (const o of segmentOptions(s)) {
        const sum = v.sum + o.total;
        const k = key(sum);
        const cost = v.cost + o.cost;
        const at = next.get(k);
        if (!at || cost < at.cost) next.set(k, { cost, picks: [...v.picks, o], sum });
      }
    }
    layer = next;
    if (layer.size > 50000) return null;
  }
  const build = (cell: Cell, absorbed: Map<Segment, Opt>): IonicSolution => {
    let d = 0;
    const segments: SegmentCharge[] = segs.map((segment) => {
      const o = absorbers.includes(segment) ? (absorbed.get(segment) as Opt) : cell.picks[d++];
      return { segment, total: o.total, unitCharges: o.unitCharges, cost: o.cost };
    });
    return { segments, cost: segments.reduce((a, s) => a + s.cost, 0), sum: segments.reduce((a, s) => a + s.total, 0) };
  };
  if (absorbers.length === 0) {
    const hit = layer.get(key(target));
    return hit ? build(hit, new Map()) : null;
  }
  // Absorbers: all but one at their usual state, the last takes the average that balances.
  let best: IonicSolution | null = null;
  for (const cell of layer.values()) {
    const rest = target - cell.sum;
    for (const last of absorbers) {
      const absorbed = new Map<Segment, Opt>();
      let r = rest;
      for (const a of absorbers) {
        if (a === last) continue;
        const q = a.unitOptions[0].charge;
        absorbed.set(a, { total: q * a.multiplicity, unitCharges: [q], cost: 0 });
        r -= q * a.multiplicity;
      }
      const avg = r / last.multiplicity;
      const qs = last.unitOptions.map((o) => o.charge);
      if (avg < Math.min(...qs) - 1e-9 || avg > Math.max(...qs) + 1e-9) continue;
      const exact = last.unitOptions.find((o) => Math.abs(o.charge - avg) < 1e-9);
      absorbed.set(last, { total: r, unitCharges: [avg], cost: exact ? exact.cost : 1 });
      const sol = build(cell, absorbed);
      if (!best || sol.cost < best.cost) best = sol;
    }
  }
  return best;
}
