/**
 * The species distribution of a batch over pH: the batch's totals held, the pH set from `from` to `to`
 * (the proton condition replaced by a fixed a(H⁺)), the activity coefficients held at the batch's own, and
 * for each component the share of its total in each species. What the report charts: which form of each
 * acid–base system and each metal dominates where, and where the batch itself stands.
 */
import { COMPONENTS } from './model';
import { solveEquilibrium, type Equilibrium } from './solver';

export interface DistributionSeries {
  label: string;
  display: string;
  /** Share 0–1 of the component's total, at each pH of the grid. */
  fraction: number[];
}

export interface DistributionGroup {
  /** The component (the basis form, `PO4^3-`, or the metal ion) and what to call it. */
  component: string;
  display: string;
  name: string;
  totalM: number;
  series: DistributionSeries[];
}

export interface SpeciesDistribution {
  pH: number[];
  groups: DistributionGroup[];
  /** The batch's own pH. */
  batchPH: number;
  /** Grid points where the solver did not converge (left out of the series as NaN). */
  unconverged: number;
}

export interface DistributionOptions {
  from?: number;
  to?: number;
  step?: number;
  /** At most this many components (the most concentrated with something to show). */
  maxGroups?: number;
  /** A species is drawn where its share reaches this somewhere; the rest are summed as "other". */
  minShare?: number;
}

/** Names of the components for the chart's panels. */
function componentName(eq: Equilibrium, j: number): string {
  const c = COMPONENTS.get(eq.system.components[j]);
  if (c?.system) return c.system.system;
  return c?.name ?? eq.system.species[j].display;
}

export function speciesDistribution(eq: Equilibrium, options: DistributionOptions = {}): SpeciesDistribution {
  const from = options.from ?? 0;
  const to = options.to ?? 14;
  const step = options.step ?? 0.25;
  const minShare = options.minShare ?? 0.02;
  const sys = eq.system;
  const { nc, ns, A } = sys;
  const grid: number[] = [];
  for (let k = 0; from + k * step <= to + 1e-9; k++) grid.push(Math.round((from + k * step) * 1e6) / 1e6);
  // share[j][i][p]: component j's share in species i at grid point p.
  const share = Array.from({ length: nc }, () => Array.from({ length: ns }, () => new Array<number>(grid.length).fill(NaN)));
  let unconverged = 0;
  // From the batch's own pH outwards, each point starting from its neighbour's answer.
  const start = grid.reduce((best, p, k) => (Math.abs(p - eq.pH) < Math.abs(grid[best] - eq.pH) ? k : best), 0);
  const order = [...grid.keys()].filter((k) => k >= start).concat([...grid.keys()].filter((k) => k < start).reverse());
  let X = eq.X;
  let previous = start;
  for (const k of order) {
    if (k === start - 1) X = eq.X;
    const r = solveEquilibrium(sys, eq.totals, { fixedPH: grid[k], logGamma: eq.logGamma, start: Math.abs(k - previous) <= 1 ? X : eq.X, maxIterations: 100 });
    previous = k;
    if (!r.converged) {
      unconverged++;
      continue;
    }
    X = r.X;
    for (let j = 1; j < nc; j++) {
      const T = eq.totals[j];
      if (!(T > 0)) continue;
      for (let i = 0; i < ns; i++) {
        const a = A[i * nc + j];
        if (a > 0) share[j][i][k] = (a * Math.pow(10, r.logC[i])) / T;
      }
    }
  }
  const groups: DistributionGroup[] = [];
  for (let j = 1; j < nc; j++) {
    if (sys.species[j].kind === 'inert' || !(eq.totals[j] > 0)) continue;
    const series: DistributionSeries[] = [];
    const other = new Array<number>(grid.length).fill(0);
    let hasOther = false;
    for (let i = 0; i < ns; i++) {
      const f = share[j][i];
      if (f.every((x) => Number.isNaN(x))) continue;
      const peak = Math.max(...f.filter((x) => !Number.isNaN(x)));
      if (peak >= minShare) series.push({ label: sys.species[i].label, display: sys.species[i].display, fraction: f.map((x) => (Number.isNaN(x) ? NaN : x)) });
      else if (peak > 0) {
        hasOther = true;
        f.forEach((x, p) => (other[p] += Number.isNaN(x) ? 0 : x));
      }
    }
    // A component whose species hardly change over the range (a spectator ion) has nothing to chart.
    const swing = Math.max(
      ...series.map((x) => Math.max(...x.fraction.filter((v) => !Number.isNaN(v))) - Math.min(...x.fraction.filter((v) => !Number.isNaN(v)))),
    );
    if (series.length < 2 || !(swing >= 0.1)) continue;
    if (hasOther && Math.max(...other) >= minShare / 2) series.push({ label: 'other', display: 'other species', fraction: other });
    groups.push({ component: sys.components[j], display: sys.species[j].display, name: componentName(eq, j), totalM: eq.totals[j], series });
  }
  groups.sort((a, b) => b.totalM - a.totalM);
  return { pH: grid, groups: groups.slice(0, options.maxGroups ?? 4), batchPH: eq.pH, unconverged };
}
