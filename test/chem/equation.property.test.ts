/**
 * Property-based tests of the equation parser and balancer (fast-check; fixed seed in test/setup.ts).
 *
 * Known balanced equations (common textbook examples, each re-checked below by counting atoms and charge)
 * are combined with random positive integer weights into one equation, species merged, coefficients
 * stripped; the balancer must find coefficients that balance every element and the charge.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseReaction, balanceEquation, parseEquation, rationalMath as Q, type ParsedEquation } from '../../server/src/chem/equation';

type Term = [number, string];
interface Known {
  reactants: Term[];
  products: Term[];
}

// Each: common textbook example.
const KNOWN: Known[] = [
  {
    reactants: [
      [2, 'H2'],
      [1, 'O2'],
    ],
    products: [[2, 'H2O']],
  },
  {
    reactants: [
      [1, 'CH4'],
      [2, 'O2'],
    ],
    products: [
      [1, 'CO2'],
      [2, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'C3H8'],
      [5, 'O2'],
    ],
    products: [
      [3, 'CO2'],
      [4, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'N2'],
      [3, 'H2'],
    ],
    products: [[2, 'NH3']],
  },
  {
    reactants: [
      [2, 'Na'],
      [1, 'Cl2'],
    ],
    products: [[2, 'NaCl']],
  },
  {
    reactants: [[1, 'CaCO3']],
    products: [
      [1, 'CaO'],
      [1, 'CO2'],
    ],
  },
  {
    reactants: [
      [4, 'Fe'],
      [3, 'O2'],
    ],
    products: [[2, 'Fe2O3']],
  },
  {
    reactants: [[2, 'KClO3']],
    products: [
      [2, 'KCl'],
      [3, 'O2'],
    ],
  },
  {
    reactants: [
      [1, 'MnO4^-'],
      [5, 'Fe^2+'],
      [8, 'H^+'],
    ],
    products: [
      [1, 'Mn^2+'],
      [5, 'Fe^3+'],
      [4, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'Cr2O7^2-'],
      [6, 'I^-'],
      [14, 'H^+'],
    ],
    products: [
      [2, 'Cr^3+'],
      [3, 'I2'],
      [7, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'Ag^+'],
      [1, 'Cl^-'],
    ],
    products: [[1, 'AgCl']],
  },
  {
    reactants: [
      [1, 'Zn'],
      [1, 'Cu^2+'],
    ],
    products: [
      [1, 'Zn^2+'],
      [1, 'Cu'],
    ],
  },
  {
    reactants: [
      [1, 'Fe^3+'],
      [1, 'e^-'],
    ],
    products: [[1, 'Fe^2+']],
  },
  {
    reactants: [[1, 'CuSO4·5H2O']],
    products: [
      [1, 'CuSO4'],
      [5, 'H2O'],
    ],
  },
  {
    reactants: [
      [3, 'Cu'],
      [8, 'HNO3'],
    ],
    products: [
      [3, 'Cu(NO3)2'],
      [2, 'NO'],
      [4, 'H2O'],
    ],
  },
  {
    reactants: [
      [2, 'KMnO4'],
      [16, 'HCl'],
    ],
    products: [
      [2, 'KCl'],
      [2, 'MnCl2'],
      [5, 'Cl2'],
      [8, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'NaOH'],
      [1, 'HCl'],
    ],
    products: [
      [1, 'NaCl'],
      [1, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'H^+'],
      [1, 'OH^-'],
    ],
    products: [[1, 'H2O']],
  },
  {
    reactants: [
      [2, 'C8H18'],
      [25, 'O2'],
    ],
    products: [
      [16, 'CO2'],
      [18, 'H2O'],
    ],
  },
  {
    reactants: [
      [1, 'MnO4^-'],
      [8, 'H^+'],
      [5, 'e^-'],
    ],
    products: [
      [1, 'Mn^2+'],
      [4, 'H2O'],
    ],
  },
];

/** Atoms and charge of a species, read independently of the equation code (the electron by hand). */
function speciesCounts(formula: string): { atoms: Record<string, number>; charge: number } {
  if (formula === 'e^-') return { atoms: {}, charge: -1 };
  const a = analyseFormula(formula);
  expect(a.ok, formula).toBe(true);
  return { atoms: a.atoms, charge: a.charge };
}

/** Net atoms and charge of signed terms (reactants positive, products negative); all zero when balanced. */
function netOf(terms: Array<{ formula: string; coefficient: number }>): { atoms: Record<string, number>; charge: number } {
  const atoms: Record<string, number> = {};
  let charge = 0;
  for (const t of terms) {
    const c = speciesCounts(t.formula);
    for (const [el, n] of Object.entries(c.atoms)) atoms[el] = (atoms[el] ?? 0) + t.coefficient * n;
    charge += t.coefficient * c.charge;
  }
  return { atoms, charge };
}
const isBalancedNet = (n: { atoms: Record<string, number>; charge: number }) =>
  Object.values(n.atoms).every((x) => Math.abs(x) < 1e-9) && Math.abs(n.charge) < 1e-9;

const signedTerms = (k: Known, w = 1) => [
  ...k.reactants.map(([c, f]) => ({ formula: f, coefficient: w * c })),
  ...k.products.map(([c, f]) => ({ formula: f, coefficient: -w * c })),
];

/** Signed terms of a parsed equation with the given coefficients. */
const parsedTerms = (eq: ParsedEquation, coefficients: readonly number[]) =>
  [...eq.reactants, ...eq.products].map((s, k) => ({
    formula: s.isElectron ? 'e^-' : s.formulaText,
    coefficient: (s.side === 'reactant' ? 1 : -1) * coefficients[k],
  }));

describe('the known equations', () => {
  it('each is balanced by its own coefficients', () => {
    for (const k of KNOWN) expect(isBalancedNet(netOf(signedTerms(k)))).toBe(true);
  });
});

describe('combinations of known equations', () => {
  it('the balancer balances a stripped positive combination of two equations', () => {
    const arb = fc.record({
      i: fc.nat({ max: KNOWN.length - 1 }),
      j: fc.nat({ max: KNOWN.length - 1 }),
      a: fc.integer({ min: 1, max: 7 }),
      b: fc.integer({ min: 1, max: 7 }),
      order: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 16, maxLength: 16 }),
      arrow: fc.constantFrom('->', '→', '=', '⇌'),
      cancel: fc.boolean(),
      pick: fc.nat(),
    });
    const seen: Record<string, number> = {};
    fc.assert(
      fc.property(arb, ({ i, j, a, b, order, arrow, cancel, pick }) => {
        // Two independent reactions always leave two independent solutions (ambiguous). Weighting them so
        // that a species on opposite sides cancels out usually leaves one, which the balancer must find.
        const ti = signedTerms(KNOWN[i]);
        const tj = signedTerms(KNOWN[j]);
        const shared = ti.flatMap((x) =>
          tj
            .filter((y) => y.formula === x.formula && Math.sign(y.coefficient) !== Math.sign(x.coefficient))
            .map((y) => [Math.abs(x.coefficient), Math.abs(y.coefficient)]),
        );
        if (cancel && i !== j && shared.length) {
          const [ci, cj] = shared[pick % shared.length];
          let g = ci;
          for (let y = cj; y;) [g, y] = [y, g % y];
          [a, b] = [(cj / g) * a, (ci / g) * a];
        }
        // Merge: net coefficient per formula (positive = reactant); species on both sides cancel.
        const net = new Map<string, number>();
        for (const t of [...signedTerms(KNOWN[i], a), ...signedTerms(KNOWN[j], b)]) net.set(t.formula, (net.get(t.formula) ?? 0) + t.coefficient);
        const species = [...net.entries()].filter(([, c]) => c !== 0);
        // Shuffle by random keys.
        const shuffled = species
          .map((s, k) => ({ s, key: order[k % order.length] + k * 1e-9 }))
          .sort((x, y) => x.key - y.key)
          .map((x) => x.s);
        const reactants = shuffled.filter(([, c]) => c > 0);
        const products = shuffled.filter(([, c]) => c < 0);
        fc.pre(reactants.length > 0 && products.length > 0);
        const text = `${reactants.map(([f]) => f).join(' + ')} ${arrow} ${products.map(([f]) => f).join(' + ')}`;
        const combo = [...reactants, ...products].map(([, c]) => Math.abs(c));

        const parsed = parseEquation(text);
        expect(parsed.ok, text).toBe(true);
        const r = balanceEquation(parsed);
        seen[r.status] = (seen[r.status] ?? 0) + 1;
        // The combination's own coefficients always balance.
        expect(isBalancedNet(netOf(parsedTerms(parsed, combo))), text).toBe(true);
        if (r.status === 'ambiguous') {
          expect(r.nullity!).toBeGreaterThanOrEqual(2);
          expect(r.coefficients).toBeNull();
          return;
        }
        expect(['balanced', 'already-balanced'], `${text}: ${r.message}`).toContain(r.status);
        const cs = r.coefficients as number[];
        expect(cs.every((c) => Number.isInteger(c) && c > 0)).toBe(true);
        expect(isBalancedNet(netOf(parsedTerms(parsed, cs))), text).toBe(true);
        // A one-dimensional solution space: the answer is the combination, reduced. (Already balanced means
        // that all-ones balances, which can hold in a larger solution space too.)
        if (r.status === 'balanced') {
          expect(r.nullity).toBe(1);
          const g = combo.reduce((x, y) => {
            while (y) [x, y] = [y, x % y];
            return x;
          });
          expect(cs).toEqual(combo.map((c) => c / g));
        }
        // Written back with its coefficients, it reads as balanced.
        if (r.balancedText) expect(balanceEquation(parseEquation(r.balancedText)).status).toBe('already-balanced');
      }),
      { numRuns: 400 },
    );
    // Both outcomes were exercised.
    expect(seen.balanced).toBeGreaterThan(5);
    expect(seen.ambiguous).toBeGreaterThan(5);
  });
});

describe('robustness', () => {
  const pieces = [
    'H',
    'O',
    'C',
    'N',
    'Na',
    'Cl',
    'Fe',
    'e',
    'a',
    'x',
    '2',
    '3',
    '0',
    '½',
    '/',
    '.',
    '·',
    '^',
    '+',
    '-',
    '−',
    '⁺',
    '⁻',
    '²',
    '₂',
    ' ',
    '  ',
    '(',
    ')',
    '[',
    ']',
    '{',
    '}',
    '(aq)',
    '(s)',
    '->',
    '→',
    '=',
    '<=>',
    '⇌',
    '<',
    '>',
    '\t',
    '\n',
    '\u0000',
    '😀',
    '\ud800',
  ];
  const chemString = fc.array(fc.constantFrom(...pieces), { maxLength: 40 }).map((xs) => xs.join(''));

  const wellFormed = (t: string) => {
    const a = analyseReaction(t);
    const p = a.parsed;
    for (const s of [...p.reactants, ...p.products]) {
      expect(t.slice(s.start, s.end)).toBe(s.text);
      expect(t.slice(s.formulaStart, s.formulaEnd)).toBe(s.formulaText);
      if (s.coefficientStart !== undefined) expect(t.slice(s.coefficientStart, s.coefficientEnd)).toBe(s.coefficientText);
      expect(s.start).toBeLessThanOrEqual(s.formulaStart);
      expect(s.formulaEnd).toBe(s.end);
    }
    for (const d of a.diagnostics) {
      expect(d.start).toBeGreaterThanOrEqual(0);
      expect(d.end).toBeLessThanOrEqual(t.length);
      expect(d.start).toBeLessThanOrEqual(d.end);
      expect(d.message.length).toBeGreaterThan(0);
    }
    expect(p.ok).toBe(!p.diagnostics.some((d) => d.severity === 'error'));
    expect(['balanced', 'already-balanced', 'impossible', 'ambiguous', 'too-large', 'invalid']).toContain(a.balance.status);
    if (a.balance.coefficients) expect(a.balance.coefficients.every((c) => Number.isSafeInteger(c) && c > 0)).toBe(true);
  };

  it('chemistry-like strings never throw and give well-formed results', () => {
    fc.assert(
      fc.property(chemString, (t) => wellFormed(t)),
      { numRuns: 1500 },
    );
  });

  it('arbitrary strings never throw', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 60 }), (t) => wellFormed(t)),
      { numRuns: 500 },
    );
  });

  it('a balanced result is balanced by its coefficients', () => {
    const formula = fc
      .array(fc.tuple(fc.constantFrom('H', 'O', 'C', 'N', 'S', 'Fe', 'Cl'), fc.integer({ min: 1, max: 4 })), { minLength: 1, maxLength: 3 })
      .map((xs) => xs.map(([e, n]) => (n === 1 ? e : e + n)).join(''));
    const charged = fc.tuple(formula, fc.constantFrom('', '', '', '^+', '^-', '^2+', '^2-')).map(([f, q]) => f + q);
    const side = fc.array(charged, { minLength: 1, maxLength: 4 });
    fc.assert(
      fc.property(side, side, (l, r) => {
        const text = `${l.join(' + ')} -> ${r.join(' + ')}`;
        const parsed = parseEquation(text);
        const res = balanceEquation(parsed);
        if (res.status === 'balanced' || res.status === 'already-balanced') {
          expect(isBalancedNet(netOf(parsedTerms(parsed, res.coefficients as number[]))), text).toBe(true);
        }
      }),
      { numRuns: 400 },
    );
  });

  it('40+ species and huge subscripts return within a bound', () => {
    const big = fc
      .array(
        fc.tuple(
          fc.constantFrom('H', 'He', 'Li', 'Be', 'B', 'C', 'N', 'O', 'F', 'Ne', 'Na', 'Mg', 'Al', 'Si', 'P', 'S'),
          fc.integer({ min: 1, max: 1_000_000 }),
        ),
        { minLength: 1, maxLength: 16 },
      )
      .map((xs) => xs.map(([e, n]) => e + n).join(''));
    fc.assert(
      fc.property(fc.array(big, { minLength: 2, maxLength: 60 }), fc.nat(), (species, cut) => {
        const k = 1 + (cut % (species.length - 1));
        const text = `${species.slice(0, k).join(' + ')} -> ${species.slice(k).join(' + ')}`;
        const t0 = performance.now();
        const r = analyseReaction(text);
        expect(performance.now() - t0).toBeLessThan(3000);
        if (species.length > 40 && r.balance.status !== 'already-balanced') expect(r.balance.status).toBe('too-large');
      }),
      { numRuns: 25 },
    );
  });

  it('a dense 40 × 39 system with six-digit subscripts returns within a bound', () => {
    const els = [
      'H',
      'He',
      'Li',
      'Be',
      'B',
      'C',
      'N',
      'O',
      'F',
      'Ne',
      'Na',
      'Mg',
      'Al',
      'Si',
      'P',
      'S',
      'Cl',
      'Ar',
      'K',
      'Ca',
      'Sc',
      'Ti',
      'V',
      'Cr',
      'Mn',
      'Fe',
      'Co',
      'Ni',
      'Cu',
      'Zn',
      'Ga',
      'Ge',
      'As',
      'Se',
      'Br',
      'Kr',
      'Rb',
      'Sr',
      'Y',
    ];
    let seed = 12345;
    const next = () => (seed = (seed * 48271) % 2147483647);
    const species = Array.from({ length: 40 }, () => els.map((e) => e + (1 + (next() % 999_999))).join(''));
    const text = `${species.slice(0, 20).join(' + ')} -> ${species.slice(20).join(' + ')}`;
    const t0 = performance.now();
    const r = analyseReaction(text);
    expect(performance.now() - t0).toBeLessThan(5000);
    expect(r.balance.nullity).not.toBeNull();
  });
});

describe('rational arithmetic', () => {
  const big = fc.bigInt({ min: -(10n ** 30n), max: 10n ** 30n });
  const nonZero = big.filter((x) => x !== 0n);
  const rat = fc.tuple(big, nonZero).map(([n, d]) => Q.rational(n, d));

  it('results are normalised', () => {
    fc.assert(
      fc.property(rat, rat, (a, b) => {
        for (const r of [Q.add(a, b), Q.sub(a, b), Q.mul(a, b), ...(Q.isZero(b) ? [] : [Q.div(a, b)])]) {
          expect(r.d > 0n).toBe(true);
          expect(Q.gcd(r.n, r.d)).toBe(r.n === 0n ? r.d : 1n);
        }
      }),
    );
  });

  it('field laws', () => {
    fc.assert(
      fc.property(rat, rat, rat, (a, b, c) => {
        expect(Q.equals(Q.add(a, b), Q.add(b, a))).toBe(true);
        expect(Q.equals(Q.mul(a, Q.add(b, c)), Q.add(Q.mul(a, b), Q.mul(a, c)))).toBe(true);
        expect(Q.equals(Q.sub(Q.add(a, b), b), a)).toBe(true);
        if (!Q.isZero(b)) expect(Q.equals(Q.mul(Q.div(a, b), b), a)).toBe(true);
      }),
    );
  });

  it('gcd and lcm', () => {
    fc.assert(
      fc.property(nonZero, nonZero, (a, b) => {
        const g = Q.gcd(a, b);
        const l = Q.lcm(a, b);
        expect(a % g).toBe(0n);
        expect(b % g).toBe(0n);
        expect(g * l).toBe(a < 0n === b < 0n ? a * b : -(a * b));
      }),
    );
  });

  it('reads numbers written in text, and doubles with small denominators', () => {
    expect(Q.parseRational('1/2')).toEqual(Q.rational(1n, 2n));
    expect(Q.parseRational('0.25')).toEqual(Q.rational(1n, 4n));
    expect(Q.parseRational('6/4')).toEqual(Q.rational(3n, 2n));
    expect(Q.parseRational('1/0')).toBeNull();
    expect(Q.parseRational('x')).toBeNull();
    expect(Q.fromNumber(0.95)).toEqual(Q.rational(19n, 20n));
    expect(Q.fromNumber(1 / 3)).toEqual(Q.rational(1n, 3n));
    expect(Q.fromNumber(NaN)).toBeNull();
    fc.assert(
      fc.property(fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: 1, max: 1000 }), (n, d) => {
        expect(Q.fromNumber(n / d)).toEqual(Q.rational(BigInt(n), BigInt(d)));
      }),
    );
  });
});
