/**
 * The speciation solver (chem/solution/solver.ts) by its properties: at the solution every mass balance and
 * the charge balance hold to 1e-10 relative; it converges from pH 0 to 14 and from 1 µM to 5 M; the pH moves
 * the right way when acid or base is added; a spectator salt moves the pH only through the activity
 * coefficients; at equilibrium with solids, each solid present is exactly saturated and none is over.
 * Property tests run with fast-check (fixed seed, test/setup.ts).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { batchSolution } from '../../server/src/chem/solution/batch';
import { solveEquilibrium, type Equilibrium } from '../../server/src/chem/solution/solver';
import { systemFor } from '../../server/src/chem/solution/system';

/** Salts, acids and bases of a formulation lab, each a valid reading of the tables. */
const SHELF = [
  'NaCl',
  'KCl',
  'CaCl2',
  'MgSO4',
  'Na2SO4',
  'KH2PO4',
  'Na2HPO4',
  'Na3PO4',
  'NaHCO3',
  'Na2CO3',
  'CH3COOH',
  'CH3COONa',
  'C6H8O7',
  'Na3C6H5O7',
  'H3BO3',
  'Na2B4O7',
  'NH4Cl',
  'NH3',
  'C4H11NO3',
  'C2H5NO2',
  'HCl',
  'H2SO4',
  'HNO3',
  'NaOH',
  'KOH',
  'NiSO4',
  'CuSO4',
  'ZnCl2',
  'FeCl3',
  'AlCl3',
  'C10H14N2Na2O8',
  'NaF',
  'HCOOH',
];

const solve = (ingredients: Array<[string, number]>, activity: 'davies' | 'ideal' = 'davies') =>
  batchSolution({ volumeL: 1, temperatureC: 25, ingredients: ingredients.map(([f, moles]) => ({ analysis: analyseFormula(f), moles })), activity });

/** Largest relative residual of the mass balances (solids included) and the charge balance. */
function balances(eq: Equilibrium): { mass: number; charge: number } {
  const { nc, ns, A, charge } = eq.system;
  let mass = 0;
  for (let j = 0; j < nc; j++) {
    let sum = -eq.totals[j];
    let scale = Math.abs(eq.totals[j]);
    for (let i = 0; i < ns; i++) {
      const v = A[i * nc + j] * Math.pow(10, eq.logC[i]);
      sum += v;
      scale += Math.abs(v);
    }
    for (const p of eq.precipitates) {
      sum += eq.system.solids[p.solid].b[j] * p.molPerL;
      scale += Math.abs(eq.system.solids[p.solid].b[j] * p.molPerL);
    }
    mass = Math.max(mass, Math.abs(sum) / scale);
  }
  let q = 0;
  let qs = 0;
  for (let i = 0; i < ns; i++) {
    const c = Math.pow(10, eq.logC[i]);
    q += charge[i] * c;
    qs += Math.abs(charge[i] * c);
  }
  for (const p of eq.precipitates) {
    // A solid is neutral: what it takes out carries no charge.
    expect(eq.system.solids[p.solid].b.reduce((s, b, j) => s + b * eq.system.species[j].charge, 0)).toBe(0);
  }
  return { mass, charge: Math.abs(q) / qs };
}

const recipe = fc.array(fc.tuple(fc.constantFrom(...SHELF), fc.double({ min: -6, max: Math.log10(2), noNaN: true })), { minLength: 1, maxLength: 6 });
const moles = (r: Array<[string, number]>): Array<[string, number]> => r.map(([f, lg]) => [f, Math.pow(10, lg)]);

describe('at the solution', () => {
  it('every mass balance and the charge balance hold to 1e-10 relative (random batches of the shelf, 1 µM to 2 M each)', () => {
    fc.assert(
      fc.property(recipe, (r) => {
        const s = solve(moles(r));
        expect(s.converged).toBe(true);
        const b = balances(s.equilibrium);
        expect(b.mass).toBeLessThan(1e-10);
        expect(b.charge).toBeLessThan(1e-10);
      }),
      { numRuns: 150 },
    );
  });

  it('with solids at equilibrium: the balances hold, each solid present is saturated (SI 0), none is over', () => {
    fc.assert(
      fc.property(recipe, (r) => {
        const s = solve(moles(r));
        const eq = s.equilibrium;
        if (!eq.si.some((x) => x > 1e-6)) return;
        const after = solveEquilibrium(eq.system, eq.totals, { precipitate: true, start: eq.X });
        if (!after.converged) return;
        const b = balances(after);
        expect(b.mass).toBeLessThan(1e-10);
        expect(b.charge).toBeLessThan(1e-10);
        for (const p of after.precipitates) {
          expect(p.molPerL).toBeGreaterThan(0);
          expect(Math.abs(after.si[p.solid])).toBeLessThan(1e-8);
        }
        for (const x of after.si) expect(x).toBeLessThan(1e-6);
      }),
      { numRuns: 100 },
    );
  });
});

describe('convergence', () => {
  it('from pH 0 to 14 and from 1 µM to 5 M: strong and weak acids and bases, salts', () => {
    const cases: Array<[string, number]> = [];
    for (const f of ['HCl', 'NaOH', 'CH3COOH', 'NH3', 'H3PO4', 'Na3PO4', 'H2SO4', 'Na2CO3', 'NiSO4', 'FeCl3'])
      for (const c of [1e-6, 1e-4, 1e-2, 1, 5]) cases.push([f, c]);
    for (const [f, c] of cases) {
      const s = solve([[f, c]]);
      expect(s.converged, `${f} ${c} M`).toBe(true);
      expect(s.pH, `${f} ${c} M`).toBeGreaterThan(-1.5);
      expect(s.pH, `${f} ${c} M`).toBeLessThan(15.5);
    }
    // The ends of the range: 1 M HCl about pH 0.1 (γ± 0.81; CRC Handbook "Mean activity coefficients", from memory), 1 M NaOH about 13.9.
    expect(solve([['HCl', 1]]).pH).toBeCloseTo(0.1, 1);
    expect(solve([['NaOH', 1]]).pH).toBeGreaterThan(13.8);
    // 1 µM HCl: pH 6.0 (water's own protons are a tenth of it).
    expect(solve([['HCl', 1e-6]]).pH).toBeCloseTo(5.996, 2);
  });

  it('says so when it does not converge (the iterations cut short)', () => {
    const sys = systemFor(
      [
        { label: 'Ni^2+', charge: 2 },
        { label: 'SO4^2-', charge: -2 },
        { label: 'NH3', charge: 0 },
      ],
      298.15,
    );
    const T = new Float64Array(sys.nc);
    sys.components.forEach((c, j) => (T[j] = { 'Ni^2+': 1, 'SO4^2-': 1, NH3: 2 }[c] ?? 0));
    expect(solveEquilibrium(sys, T, { maxIterations: 1 }).converged).toBe(false);
    expect(solveEquilibrium(sys, T).converged).toBe(true);
  });

  it('a pH held gives that pH (the species distribution over pH)', () => {
    const s = solve([['KH2PO4', 0.05]]);
    for (const pH of [1, 7.2, 12.5]) {
      const r = solveEquilibrium(s.equilibrium.system, s.equilibrium.totals, { fixedPH: pH, logGamma: s.equilibrium.logGamma });
      expect(r.converged).toBe(true);
      expect(r.pH).toBeCloseTo(pH, 10);
    }
  });
});

describe('the pH moves the right way', () => {
  it('adding acid lowers it and adding base raises it (random batches)', () => {
    fc.assert(
      fc.property(
        recipe,
        fc.double({ min: -5, max: -1, noNaN: true }),
        fc.constantFrom('HCl', 'H2SO4', 'CH3COOH'),
        fc.constantFrom('NaOH', 'NH3', 'Na2CO3'),
        (r, lg, acid, base) => {
          const m = moles(r);
          const p0 = solve(m).pH;
          const dose = Math.pow(10, lg);
          expect(solve([...m, [acid, dose]]).pH).toBeLessThan(p0 + 1e-9);
          expect(solve([...m, [base, dose]]).pH).toBeGreaterThan(p0 - 1e-9);
        },
      ),
      { numRuns: 80 },
    );
  });
});

describe('a spectator salt', () => {
  it('moves the pH only through the activities: nothing at all in an ideal solution, something with Davies', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<Array<[string, number]>>(
          [
            ['CH3COOH', 0.05],
            ['CH3COONa', 0.05],
          ],
          [['KH2PO4', 0.01]],
          [['NH4Cl', 0.02]],
          [['NaHCO3', 0.01]],
        ),
        fc.double({ min: 0.01, max: 0.4, noNaN: true }),
        fc.constantFrom('NaCl', 'KCl', 'NaNO3', 'KClO4'),
        (m, salt, spectator) => {
          const ideal = solve(m, 'ideal').pH;
          expect(solve([...m, [spectator, salt]], 'ideal').pH).toBeCloseTo(ideal, 9);
          const davies = solve(m).pH;
          expect(Math.abs(solve([...m, [spectator, salt]]).pH - davies)).toBeGreaterThan(1e-4);
        },
      ),
      { numRuns: 40 },
    );
  });
});
