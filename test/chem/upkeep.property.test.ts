/**
 * Property tests of the upkeep readers (fast-check; fixed seed in test/setup.ts): any text is either a
 * reading or findings, never a throw; every offset lies inside the text given; tokens are in order and
 * do not overlap; and a reading's numbers are what its line says.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseUpkeep, computeTitre, planAdditions, readTank, readTitre } from '../../server/src/chem/upkeep';

/** Pieces a titre line is made of, and pieces that break it, for lines near the grammar. */
const PIECES = [
  'titre',
  'titration',
  'NiSO4·6H2O',
  'NiCl2·6H2O',
  'CuSO4·5H2O',
  'H2SO4',
  'nickel sulfate',
  'as',
  'Ni',
  'Cl-',
  ':',
  ',',
  ';',
  '5.00',
  '0',
  '-2',
  '1e400',
  'mL',
  'L',
  'µL',
  'M',
  'mM',
  'N',
  'sample',
  'diluted',
  'to',
  'taken',
  'blank',
  'less',
  'of',
  'EDTA',
  'AgNO3',
  'NaOH',
  '1:1',
  '2',
  'eq',
  '->',
  '+',
  'Ni2+',
  'EDTA4-',
  'NiEDTA2-',
  '#',
  '(',
  ']',
  '\u00a0',
  '\t',
  '€',
  '𝄞',
];

const nearGrammar = fc.array(fc.constantFrom(...PIECES), { maxLength: 24 }).map((xs) => xs.join(' '));
/** Well-formed lines with their parts shuffled and, half the time, one character replaced or cut. */
const OPTIONAL = ['blank 0.05 mL', '1:1', 'Ni2+ + EDTA4- -> NiEDTA2-', 'less NiCl2·6H2O', '2.00 mL sample'];
const nearValid = fc
  .tuple(
    fc.constantFrom('titre NiSO4·6H2O', 'titration NiSO4·6H2O as Ni', 'titre nickel sulfate hexahydrate'),
    fc.shuffledSubarray(OPTIONAL, { maxLength: 2 }).chain((extra) => {
      const all = ['2.00 mL sample', '18.40 mL 0.0500 M EDTA', ...extra];
      return fc.shuffledSubarray(all, { minLength: all.length });
    }),
    fc.option(fc.tuple(fc.nat(), fc.constantFrom('', 'x', ':', ',', '0', '-', '#', '→'))),
  )
  .map(([head, parts, cut]) => {
    const line = `${head}: ${parts.join(', ')}`;
    if (!cut) return line;
    const at = cut[0] % (line.length + 1);
    return line.slice(0, at) + cut[1] + line.slice(at + 1);
  });
const anyText = fc.oneof(fc.string({ maxLength: 80 }), fc.string({ unit: 'grapheme', maxLength: 40 }), nearGrammar, nearValid);

function checkSpans(text: string, offset: number, items: ReadonlyArray<{ start: number; end: number }>) {
  for (const d of items) {
    expect(d.start).toBeGreaterThanOrEqual(offset);
    expect(d.end).toBeGreaterThanOrEqual(d.start);
    expect(d.end).toBeLessThanOrEqual(offset + text.length);
  }
}

describe('readTitre on any text', () => {
  it('gives a reading or findings, with every offset inside the text, never a throw', () => {
    fc.assert(
      fc.property(anyText, fc.nat(10_000), (text, offset) => {
        const r = readTitre(text, offset);
        checkSpans(text, offset, r.diagnostics);
        checkSpans(text, offset, r.tokens);
        let last = offset;
        for (const t of r.tokens) {
          expect(t.start).toBeGreaterThanOrEqual(last);
          expect(text.slice(t.start - offset, t.end - offset)).toBe(t.text);
          last = t.end;
        }
        if (!r.ok) expect(r.diagnostics.some((d) => d.severity === 'error')).toBe(true);
        else {
          const c = computeTitre(r, { targetM: 0.5 });
          expect(Number.isFinite(c.concentrationM)).toBe(true);
          checkSpans(text, offset, c.diagnostics);
          for (const d of c.diagnostics) expect(d.message.length).toBeGreaterThan(0);
        }
        for (const d of r.diagnostics) {
          expect(d.message).not.toMatch(/undefined|NaN|\[object/);
          expect(d.message.length).toBeLessThan(400);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('reads the near-valid lines often enough for the first property to test readings too', () => {
    const lines = fc.sample(nearValid, 300);
    const ok = lines.filter((l) => readTitre(l, 0).ok).length;
    expect(ok).toBeGreaterThan(30);
    expect(ok).toBeLessThan(300);
  });

  it('reads back the numbers of a well-formed line', () => {
    const num = fc.integer({ min: 1, max: 99_999 }).map((n) => n / 100);
    fc.assert(
      fc.property(
        num,
        num,
        fc.integer({ min: 1, max: 5000 }).map((n) => n / 10_000),
        fc.constantFrom('', ', 1:1', ', 1 eq'),
        (sample, titre, c, ratio) => {
          const text = `titre CuSO4·5H2O: ${sample} mL sample, ${titre} mL ${c} M EDTA${ratio}`;
          const r = readTitre(text, 7);
          expect(r.ok).toBe(true);
          if (!r.ok) return;
          expect(r.sample.litres).toBeCloseTo(sample / 1000, 12);
          expect(r.titre.litres).toBeCloseTo(titre / 1000, 12);
          expect(r.titrantM.value).toBe(c);
          // 1:1 with EDTA: mol/L = titre × c ÷ sample.
          expect(computeTitre(r).concentrationM).toBeCloseTo((titre * c) / sample, 9);
        },
      ),
    );
  });
});

describe('readTank and the plan on any input', () => {
  it('readTank: a volume or a finding inside the text', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.string({ maxLength: 40 }),
          fc.string({ maxLength: 30 }).map((s) => `tank: ${s}`),
        ),
        fc.nat(1000),
        (text, offset) => {
          const r = readTank(text, offset);
          if (r.ok) {
            expect(r.tank.litres).toBeGreaterThan(0);
            checkSpans(text, offset, r.tank.tokens);
          } else checkSpans(text, offset, r.diagnostics);
        },
      ),
    );
  });

  it('planAdditions brings every analysed target to target and never removes a reagent', () => {
    const target = fc.record({
      formula: fc.constantFrom('NiSO4·6H2O', 'NiCl2·6H2O', 'H3BO3', 'CuSO4·5H2O', 'ZnCl2'),
      targetM: fc.double({ min: 0.01, max: 2, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.uniqueArray(target, { selector: (t) => t.formula, minLength: 1, maxLength: 5 }),
        fc.array(fc.double({ min: 0, max: 3, noNaN: true }), { minLength: 5, maxLength: 5 }),
        fc.double({ min: 1, max: 5000, noNaN: true }),
        fc.option(fc.double({ min: 1, max: 2, noNaN: true })),
        (targets, ratios, tankL, head) => {
          const measured = targets.map((t, k) => ({ formula: t.formula, concentrationM: t.targetM * ratios[k] }));
          const plan = planAdditions({ tankL, capacityL: head === null ? null : tankL * head, targets, measured });
          expect(plan.finalL).toBeGreaterThanOrEqual(plan.tankL - plan.drawOffL - 1e-9);
          if (plan.capacityL !== null) expect(plan.finalL).toBeLessThanOrEqual(plan.capacityL * (1 + 1e-12));
          plan.additions.forEach((a, k) => {
            expect(a.addMol).toBeGreaterThanOrEqual(0);
            const kept = plan.tankL - plan.drawOffL;
            const after = (measured[k].concentrationM * kept + (a.massG * a.reagent.assay) / a.reagent.molarMass) / plan.finalL;
            expect(after / targets[k].targetM).toBeCloseTo(1, 9);
          });
        },
      ),
    );
  });

  it('analyseUpkeep keeps every finding inside the lines it was given', () => {
    fc.assert(
      fc.property(fc.array(nearGrammar, { maxLength: 4 }), (lines) => {
        let pos = 0;
        const titreLines = lines.map((text) => {
          const l = { text, start: pos };
          pos += text.length + 1;
          return l;
        });
        const u = analyseUpkeep({ titreLines, tankLine: { text: 'tank: 100 L', start: pos }, targets: [{ formula: 'NiSO4·6H2O', targetM: 1 }] });
        for (const d of u.diagnostics) {
          expect(d.start).toBeGreaterThanOrEqual(0);
          expect(d.end).toBeLessThanOrEqual(pos + 11);
        }
      }),
    );
  });
});
