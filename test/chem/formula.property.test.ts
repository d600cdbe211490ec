/** Property-based tests of the formula parser (fast-check). */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { ELEMENTS } from '../../server/src/chem/data/elements';
import { displayFormula, formulaAtoms } from '../../server/src/chem/formula/compute';
import { parseFormula } from '../../server/src/chem/formula/parse';

const symbols = ELEMENTS.map((e) => e.symbol);

/** A random formula text built from pieces, with the atom counts it must have. */
type Built = { text: string; atoms: Record<string, number> };
const add = (into: Record<string, number>, from: Record<string, number>, k = 1) => {
  for (const [el, n] of Object.entries(from)) into[el] = (into[el] ?? 0) + n * k;
  return into;
};

const count = fc.oneof(fc.constant(1), fc.integer({ min: 2, max: 40 }));
const elementPiece: fc.Arbitrary<Built> = fc
  .tuple(fc.constantFrom(...symbols), count)
  .map(([s, n]) => ({ text: s + (n === 1 ? '' : String(n)), atoms: { [s]: n } }));

const group: fc.Arbitrary<Built> = fc.letrec<{ seq: Built; item: Built }>((tie) => ({
  item: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    elementPiece,
    fc.tuple(tie('seq'), fc.constantFrom(['(', ')'], ['[', ']']), count).map(([inner, [o, c], n]) => ({
      text: o + inner.text + c + (n === 1 ? '' : String(n)),
      atoms: add({}, inner.atoms, n),
    })),
  ),
  seq: fc.array(tie('item'), { minLength: 1, maxLength: 4 }).map((items) => ({
    text: items.map((i) => i.text).join(''),
    atoms: items.reduce((acc, i) => add(acc, i.atoms), {} as Record<string, number>),
  })),
})).seq;

const formulaArb: fc.Arbitrary<Built> = fc
  .tuple(group, fc.option(fc.tuple(fc.integer({ min: 1, max: 12 }), group), { nil: undefined }))
  .map(([main, hyd]) => {
    if (!hyd) return main;
    const [m, g] = hyd;
    return { text: `${main.text}·${m === 1 ? '' : m}${g.text}`, atoms: add({ ...main.atoms }, g.atoms, m) };
  })
  // By definition a metal followed by a Roman numeral in brackets without a count is Stock notation (Fe(III)).
  .filter((b) => !/\([IVX]+\)(?![0-9])/.test(b.text))
  // By definition `OAc` is the acetate shorthand, not O followed by actinium.
  .filter((b) => !b.text.includes('OAc'));

describe('parser properties', () => {
  it('any string gives a result or a diagnostic, never a throw', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 60 }), (s) => {
        const r = parseFormula(s);
        expect(r.ok || r.diagnostics.length > 0).toBe(true);
        for (const d of r.diagnostics) {
          expect(d.start).toBeGreaterThanOrEqual(0);
          expect(d.end).toBeLessThanOrEqual(s.length);
          expect(d.end).toBeGreaterThanOrEqual(d.start);
        }
        const a = analyseFormula(s);
        if (a.molarMass) expect(Number.isFinite(a.molarMass.value) && a.molarMass.value > 0).toBe(true);
      }),
      { numRuns: 3000 },
    );
  });

  it('strings made of formula characters never throw either', () => {
    const chars = fc.constantFrom(...'HCNOClNaFe()[]{}0123456789.·*^+-²⁻₂₄½ (aq)'.split(''));
    fc.assert(
      fc.property(
        fc.array(chars, { maxLength: 40 }).map((a) => a.join('')),
        (s) => {
          const r = parseFormula(s);
          expect(r.ok || r.diagnostics.length > 0).toBe(true);
        },
      ),
      { numRuns: 5000 },
    );
  });

  it('generated formulas parse to the atoms they were built from', () => {
    fc.assert(
      fc.property(formulaArb, ({ text, atoms }) => {
        const r = parseFormula(text);
        expect(r.diagnostics).toEqual([]);
        expect(formulaAtoms(r.formula!)).toEqual(Object.fromEntries(Object.entries(formulaAtoms(r.formula!)).map(([k]) => [k, atoms[k]])));
        expect(Object.keys(formulaAtoms(r.formula!)).sort()).toEqual(Object.keys(atoms).sort());
      }),
      { numRuns: 2000 },
    );
  });

  it('the printed forms (Unicode and ASCII) parse back to the same atoms', () => {
    fc.assert(
      fc.property(formulaArb, ({ text }) => {
        const f = parseFormula(text).formula!;
        for (const printed of [displayFormula(f, true), displayFormula(f, false)]) {
          const back = parseFormula(printed);
          expect(back.diagnostics, printed).toEqual([]);
          expect(formulaAtoms(back.formula!)).toEqual(formulaAtoms(f));
        }
      }),
      { numRuns: 2000 },
    );
  });
});
