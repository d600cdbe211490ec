/** The shelf file: reagents by label, with exact offsets and a finding for every line not read. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { labelAtStart, parseShelf, shelfEntry } from '../../server/src/chem/reagents';

// An invented lab's shelf.
const SHELF = [
  '# Bench 4, acids cabinet',
  'Acid A:        H2SO4 @ 96 %; density 1.835 g/mL; lot SA-2231; supplier Northwind',
  'Nickel jar 3:  nickel sulfate hexahydrate @ 99.0 %; lot N-0447',
  'Caustic 50:    NaOH @ 50 %; d 1.52 g/mL',
  'Sulfate, dry:  Na2SO4; hydrate 0; grade ACS   # opened in May',
  'Borax tub:     borax',
  'Nickel bare:   NiSO4; hydrate hexahydrate',
  '',
].join('\n');

describe('the shelf', () => {
  it('reads every field of every line, with the substance as a formula', () => {
    const s = parseShelf(SHELF);
    expect(s.findings).toEqual([]);
    expect(s.entries.map((e) => e.label)).toEqual(['Acid A', 'Nickel jar 3', 'Caustic 50', 'Sulfate, dry', 'Borax tub', 'Nickel bare']);
    const acid = s.entries[0];
    expect([acid.substance.formula, acid.assayPercent, acid.densityGPerML, acid.lot, acid.supplier]).toEqual(['H2SO4', 96, 1.835, 'SA-2231', 'Northwind']);
    const nickel = s.entries[1];
    expect([nickel.substance.via, nickel.substance.hill, nickel.assayPercent]).toEqual(['name', analyseFormula('NiSO4·6H2O').hill, 99]);
    expect(s.entries[3].grade).toBe('ACS');
    expect(s.entries[4].substance.hill).toBe(analyseFormula('Na2B4O7·10H2O').hill);
    expect(s.entries[5].substance.formula).toBe('NiSO4·6H2O');
  });

  it('gives exact offsets, shifted by the offset of the block', () => {
    const s = parseShelf(SHELF, 100);
    const acid = s.entries[0];
    const at = SHELF.indexOf('Acid A');
    expect(acid.labelSpan).toEqual({ start: 100 + at, end: 100 + at + 6 });
    const sub = SHELF.indexOf('H2SO4');
    expect(acid.substance.span).toEqual({ start: 100 + sub, end: 100 + sub + 5 });
    expect(acid.line).toBe(1);
  });

  it('asks for the assay of a solution reagent, and reads a formula followed by "solution"', () => {
    const s = parseShelf('HCl jar: HCl\nBleach: bleach\nLye: NaOH solution @ 50 %\nAcid: H2SO4');
    expect(s.findings.map((f) => [f.kind, s.entries.find((e) => e.substance.span.start === f.start)?.label])).toEqual([
      ['assay-needed', 'HCl jar'],
      ['assay-needed', 'Bleach'],
    ]);
    expect(s.entries[2].substance).toMatchObject({ formula: 'NaOH', solution: true });
    expect(s.entries[2].assayPercent).toBe(50);
  });

  it('finds an entry by its label, case and spacing ignored', () => {
    const s = parseShelf(SHELF);
    expect(shelfEntry(s, 'nickel  JAR 3')?.substance.formula).toBe('NiSO4·6H2O');
    expect(shelfEntry(s, 'Acid B')).toBeUndefined();
  });

  it('finds the label a batch line begins with, and where it ends', () => {
    const s = parseShelf(SHELF);
    const a = labelAtStart(s, 'Acid A 10 mL');
    expect([a?.entry.substance.formula, a?.end]).toEqual(['H2SO4', 6]);
    const b = labelAtStart(s, '  "Nickel jar 3" 25 g');
    expect([b?.entry.label, b?.start, b?.end]).toEqual(['Nickel jar 3', 2, 16]);
    expect(labelAtStart(s, 'Acid B 10 mL')).toBeUndefined();
    expect(labelAtStart(s, 'NaCl 5 g')).toBeUndefined();
  });

  it('reports each line it cannot read, at the offending text', () => {
    const bad = [
      'no colon here',
      'Acid B: H2SO4 @ 120 %',
      'Mystery: sodium chlorade',
      'Odd: NaCl; colour white',
      'Dense: HCl @ 37 %; density heavy',
      'Wet: CuSO4·5H2O; hydrate 3',
      'Acid A: HNO3 @ 65 %',
      'Acid A: HCl @ 37 %',
    ].join('\n');
    const s = parseShelf(bad);
    const byLine = s.findings.map((f) => [bad.slice(0, f.start ?? 0).split('\n').length - 1, f.kind]);
    expect(byLine).toEqual([
      [0, 'shelf-syntax'],
      [1, 'shelf-syntax'],
      [2, 'shelf-substance'],
      [3, 'shelf-syntax'],
      [4, 'shelf-syntax'],
      [5, 'shelf-syntax'],
      [7, 'shelf-duplicate'],
    ]);
    const colour = s.findings[3];
    expect(bad.slice(colour.start, colour.end)).toBe('colour white');
    expect(s.findings[2].message).toMatch(/sodium chloride/);
  });

  it('reads any text without a throw, every finding inside the text (fast-check)', () => {
    const piece = fc.constantFrom(
      'Acid A',
      ':',
      ' ',
      'H2SO4',
      '@',
      '96',
      '%',
      ';',
      'density',
      '1.84',
      'g/mL',
      'lot',
      'X-1',
      '#',
      '\n',
      '\r\n',
      'borax',
      'hydrate',
      '6',
      'Na',
      'é',
      '🧪',
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 30 }), fc.nat({ max: 1000 }), (parts, offset) => {
        const text = parts.join('');
        const s = parseShelf(text, offset);
        for (const f of s.findings) {
          expect(f.start).toBeGreaterThanOrEqual(offset);
          expect(f.end).toBeLessThanOrEqual(offset + text.length);
        }
        for (const e of s.entries) {
          expect(text.slice(e.labelSpan.start - offset, e.labelSpan.end - offset)).toBe(e.label);
          expect(text.slice(e.substance.span.start - offset, e.substance.span.end - offset)).toBe(e.substance.text);
        }
        // Every non-blank, non-comment line is an entry or has a finding.
        const lines = text.split('\n').filter((l) => l.replace(/#.*/, '').trim());
        expect(s.entries.length + new Set(s.findings.map((f) => text.slice(0, (f.start ?? offset) - offset).split('\n').length)).size).toBeGreaterThanOrEqual(
          lines.length,
        );
      }),
      { numRuns: 400 },
    );
  });
});
