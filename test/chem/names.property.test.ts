/** Property tests of the names (fast-check): a name read back gives the formula it was made from. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { nameOf, readName } from '../../server/src/chem/names';
import { squash } from '../../server/src/chem/names/words';

/** Cations with their charges (IUPAC 2005, IR-5.4; the usual states of the metals, common practice). */
const CATIONS: Array<[string, number]> = [
  ['Li', 1],
  ['Na', 1],
  ['K', 1],
  ['Cs', 1],
  ['Ag', 1],
  ['NH4', 1],
  ['Mg', 2],
  ['Ca', 2],
  ['Sr', 2],
  ['Ba', 2],
  ['Zn', 2],
  ['Cd', 2],
  ['Cu', 2],
  ['Ni', 2],
  ['Co', 2],
  ['Mn', 2],
  ['Fe', 2],
  ['Fe', 3],
  ['Al', 3],
  ['Cr', 3],
  ['Pb', 2],
  ['Sn', 2],
];
/** Anions with their charges (IUPAC 2005, Table IX). */
const ANIONS: Array<[string, number]> = [
  ['Cl', -1],
  ['Br', -1],
  ['I', -1],
  ['F', -1],
  ['NO3', -1],
  ['NO2', -1],
  ['SO4', -2],
  ['SO3', -2],
  ['S2O3', -2],
  ['CO3', -2],
  ['HCO3', -1],
  ['HSO4', -1],
  ['H2PO4', -1],
  ['HPO4', -2],
  ['PO4', -3],
  ['ClO3', -1],
  ['ClO4', -1],
  ['ClO', -1],
  ['BrO3', -1],
  ['IO3', -1],
  ['CH3COO', -1],
  ['C2O4', -2],
  ['OH', -1],
  ['CN', -1],
  ['SCN', -1],
  ['MnO4', -1],
  ['CrO4', -2],
  ['Cr2O7', -2],
  ['BF4', -1],
];

const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);
/** The criss-cross, written independently of the code under test. */
function saltFormula([c, qc]: [string, number], [a, qa]: [string, number], water: number): string {
  const g = gcd(qc, -qa);
  const nc = -qa / g;
  const na = qc / g;
  const multi = (s: string) => (s.match(/[A-Z]/g) ?? []).length > 1;
  const part = (s: string, n: number) => (n === 1 ? s : multi(s) ? `(${s})${n}` : `${s}${n}`);
  return part(c, nc) + part(a, na) + (water ? `·${water === 1 ? '' : water}H2O` : '');
}

const salts = fc.tuple(fc.constantFrom(...CATIONS), fc.constantFrom(...ANIONS), fc.constantFrom(0, 0, 1, 2, 3, 4, 5, 6, 7, 10, 12));

/** The name written as a person might: any case, spaces or hyphens around the parts. */
const scribble = (name: string) =>
  fc.tuple(fc.array(fc.boolean(), { minLength: name.length, maxLength: name.length }), fc.constantFrom(' ', '-', '  ', '')).map(([upper, sep]) =>
    [...name]
      .map((ch, i) => (upper[i] ? ch.toUpperCase() : ch))
      .join('')
      .replace(/ /g, sep === '' ? ' ' : sep),
  );

describe('names, property-based', () => {
  it('name(formula) read back gives the same formula, for every salt of the usual ions', () => {
    fc.assert(
      fc.property(salts, ([c, a, water]) => {
        const formula = saltFormula(c, a, water);
        const analysis = analyseFormula(formula);
        const name = nameOf(analysis);
        expect(name, formula).toBeDefined();
        const back = readName(name as string);
        expect([formula, back.status, back.hill]).toEqual([formula, 'exact', analysis.hill]);
      }),
      { numRuns: 400 },
    );
  });

  it('binary compounds of non-metals and complexes read back too', () => {
    // Non-metal pairs (IUPAC 2005, IR-5.2: multiplying prefixes), counts 1–10.
    const pairs: Array<[string, string]> = [
      ['N', 'O'],
      ['S', 'F'],
      ['P', 'Cl'],
      ['C', 'S'],
      ['Xe', 'F'],
      ['Si', 'Cl'],
      ['B', 'Br'],
      ['I', 'F'],
      ['Se', 'O'],
    ];
    const binary = fc
      .tuple(fc.constantFrom(...pairs), fc.integer({ min: 1, max: 10 }), fc.integer({ min: 1, max: 10 }))
      .map(([[x, y], m, n]) => `${x}${m === 1 ? '' : m}${y}${n === 1 ? '' : n}`);
    // Complexes (IUPAC 2005, IR-9): a central metal, ligands, counter-ions to balance.
    const complex = fc
      .tuple(
        fc.constantFrom<[string, number]>(['Co', 3], ['Cr', 3], ['Ni', 2], ['Cu', 2], ['Pt', 2], ['Fe', 2], ['Fe', 3]),
        fc.constantFrom<[string, number]>(['NH3', 0], ['H2O', 0], ['CN', -1], ['Cl', -1], ['OH', -1], ['en', 0]),
        fc.integer({ min: 1, max: 6 }),
      )
      .map(([[m, q], [l, lq], n]) => {
        const charge = q + lq * n;
        const lig = l.length === 2 && /^[A-Z][a-z]$/.test(l) ? `${l}${n === 1 ? '' : n}` : `(${l})${n === 1 ? '' : n}`;
        const ion = `[${m}${lig}]`;
        return charge > 0 ? `${ion}Cl${charge === 1 ? '' : charge}` : charge < 0 ? `K${-charge === 1 ? '' : -charge}${ion}` : ion;
      });
    fc.assert(
      fc.property(fc.oneof(binary, complex), (formula) => {
        const a = analyseFormula(formula);
        const name = nameOf(a);
        if (name === undefined) return; // not every draw is a compound the reading names (e.g. SeO10)
        const back = readName(name);
        expect([formula, name, back.status, back.hill]).toEqual([formula, name, 'exact', a.hill]);
      }),
      { numRuns: 400 },
    );
    // And the draws are named often enough for the property to mean something.
    expect(['N2O5', 'SF6', 'PCl3', '[Co(NH3)6]Cl3', 'K3[Fe(CN)6]', '[Ni(H2O)6]Cl2'].every((f) => nameOf(analyseFormula(f)))).toBe(true);
  });

  it('a name read back is independent of case, spacing and hyphens', () => {
    fc.assert(
      fc.property(
        salts.chain(([c, a, water]) => {
          const formula = saltFormula(c, a, water);
          return fc.tuple(fc.constant(formula), scribble(nameOf(analyseFormula(formula)) as string));
        }),
        ([formula, written]) => {
          expect([written, readName(written).hill]).toEqual([written, analyseFormula(formula).hill]);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('a one-letter slip in a name is never read as another compound: it is read as written, or not at all', () => {
    const letters = 'abcdefghijklmnopqrstuvwxyz';
    fc.assert(
      fc.property(salts, fc.nat(), fc.constantFrom(...letters), fc.constantFrom('substitute', 'delete', 'insert'), ([c, a, water], at, letter, edit) => {
        const formula = saltFormula(c, a, water);
        const name = nameOf(analyseFormula(formula)) as string;
        const i = at % name.length;
        const slipped =
          edit === 'substitute'
            ? name.slice(0, i) + letter + name.slice(i + 1)
            : edit === 'delete'
              ? name.slice(0, i) + name.slice(i + 1)
              : name.slice(0, i) + letter + name.slice(i);
        const r = readName(slipped);
        if (r.status !== 'exact') {
          expect(r.formula).toBeUndefined();
          return;
        }
        // Read exactly: then what was written is itself that compound's name (or the original's, where the
        // slip touched only a separator), never a correction to a neighbour.
        if (r.hill !== analyseFormula(formula).hill) expect([slipped, squash(r.name as string)]).toEqual([slipped, squash(slipped)]);
      }),
      { numRuns: 600 },
    );
  });

  it('any text is read without a throw, with offsets inside it, and a formula only when exact', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 60, unit: 'binary' }), (text) => {
        const r = readName(text);
        expect(['exact', 'ambiguous', 'near', 'unknown']).toContain(r.status);
        expect(r.start).toBeGreaterThanOrEqual(0);
        expect(r.end).toBeLessThanOrEqual(text.length);
        if (r.status === 'exact') expect(analyseFormula(r.formula as string).ok).toBe(true);
        else expect(r.formula).toBeUndefined();
        if (r.status !== 'exact') expect(r.message).toBeTruthy();
      }),
      { numRuns: 500 },
    );
  });
});
