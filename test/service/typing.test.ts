/**
 * The features for typing and finding one's way, called on the language service directly: completion in
 * batch blocks, inlay hints, semantic tokens, folding ranges, workspace symbols, definitions and the
 * weighing-list lens. Molar masses are checked against the IUPAC/CIAAW 2021 standard atomic weights.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { BATCH_UNITS } from '../../server/src/chem/batch/units';
import { REAGENT_UNITS } from '../../server/src/chem/reagents';
import { headerKeys } from '../../server/src/service/completion';
import { readSettings } from '../../server/src/service/config';
import { createLanguageService, type NoteSummary } from '../../server/src/service/languageService';
import { decodeTokens, SEMANTIC_TOKENS_LEGEND } from '../../server/src/service/semanticTokens';

const ls = createLanguageService();

/** A note with a `|` marking the cursor: the analysed note and the cursor's position. */
function at(marked: string, language: 'markdown' | 'fnote' = 'markdown') {
  const i = marked.indexOf('|');
  const text = marked.slice(0, i) + marked.slice(i + 1);
  const doc = ls.analyse(text, language);
  return { text, doc, position: doc.lines.positionAt(i) };
}

const labels = (marked: string, others?: NoteSummary[]) => {
  const { doc, position } = at(marked);
  const vocabulary = others ? ls.mergeVocabularies(others.map((n) => n.vocabulary)) : undefined;
  return ls.completion(doc, position, vocabulary)?.items.map((i) => i.label) ?? null;
};

describe('completion', () => {
  const batch = (line: string) => '# Bench\n\nWe weighed `KNO3` twice: `KNO3`.\n\n```batch\nvolume: 1 L\n' + line + '\n```\n';

  it('offers the header keys not yet given that the batch reader reads, then substances, at the start of a batch line', () => {
    const l = labels(batch('|'))!;
    const keys = headerKeys().map((h) => `${h.key}:`);
    expect(keys.slice(0, 3)).toEqual(['name:', 'volume:', 'total:']);
    expect(l.slice(0, keys.length - 1)).toEqual(keys.filter((k) => k !== 'volume:'));
    // The note's own substance comes before the tool's tables.
    expect(l[keys.length - 1]).toBe('KNO3');
    expect(l).toContain('NaCl');
  });

  it('offers pH: and temperature: exactly when the batch reader takes them as headers', () => {
    for (const key of ['pH', 'temperature']) {
      // A header line is never an ingredient, whatever its value.
      const header =
        analyseBatch([{ text: `${key}: 7`, start: 0 }]).ingredients.length === 0 &&
        analyseBatch([{ text: `${key}: 7`, start: 0 }]).skipped.every((s) => s.kind === 'header');
      expect(labels(batch('|'))!.includes(`${key}:`), key).toBe(header);
    }
  });

  it('ranks the workspace notes’ substances by use and gives the molar mass as detail', () => {
    const other = ls.analyse('`NaHCO3` `NaHCO3` `NaHCO3` and `NaCl`\n', 'markdown');
    const { doc, position } = at(batch('Na|'));
    const list = ls.completion(doc, position, ls.noteSummary(other, 'file:///other.md').vocabulary)!;
    const formulas = list.items.filter((i) => i.kind === 12).map((i) => i.label);
    // Written three times, then once, then the tool's tables.
    expect(formulas.slice(0, 2)).toEqual(['NaHCO3', 'NaCl']);
    const nacl = list.items.find((i) => i.label === 'NaCl')!;
    // CIAAW 2021: Na 22.990 + Cl 35.45 = 58.44 g/mol.
    expect(nacl.detail).toBe('58.44 g/mol');
    // The text edit replaces the typed prefix `Na` (line 6, characters 0–2).
    expect(nacl.textEdit).toEqual({ range: { start: { line: 6, character: 0 }, end: { line: 6, character: 2 } }, newText: 'NaCl ' });
  });

  it('finds a substance by its name, inserting its formula', () => {
    const { doc, position } = at(batch('potassium ni|'));
    const items = ls.completion(doc, position)!.items;
    const kno3 = items.find((i) => i.label === 'potassium nitrate')!;
    // CIAAW 2021: K 39.098 + N 14.007 + 3 × O 15.999 = 101.10 g/mol.
    expect(kno3.detail).toBe('KNO₃ · 101.10 g/mol');
    expect(kno3.textEdit.newText).toBe('KNO3 ');
    expect(kno3.textEdit.range.start.character).toBe(0);
    expect(items.every((i) => i.label.startsWith('potassium ni'))).toBe(true);
  });

  it('offers the units an ingredient line accepts after its amount, and those of volume: and total:', () => {
    // The batch units of an ingredient line, then the bench's (chem/reagents: g/L, %w/v, N, mL …).
    const ingredient = [
      ...BATCH_UNITS.filter((u) => (u.places as readonly string[]).includes('ingredient')).map((u) => u.unit),
      ...REAGENT_UNITS.map((u) => u.unit),
    ];
    expect(new Set(labels(batch('NaCl 5 |')))).toEqual(new Set(ingredient));
    expect(labels(batch('NaCl 5 m|'))).toEqual(expect.arrayContaining(['mg', 'mol', 'mmol', 'mM']));
    expect(labels(batch('NaCl 5 m|'))).toEqual(expect.arrayContaining(['mg/L', 'mL', 'mN', 'mol/kg']));
    expect(labels(batch('NaCl 5 m|'))).not.toContain('g');
    // Written together with the number.
    const { doc, position } = at(batch('NaCl 5m|'));
    const mg = ls.completion(doc, position)!.items.find((i) => i.label === 'mg')!;
    expect(mg.textEdit.range).toEqual({ start: { line: 6, character: 6 }, end: { line: 6, character: 7 } });
    expect(labels('```batch\nvolume: 500 |\n```\n')).toEqual(['L', 'mL', 'µL']);
    expect(labels('```batch\ntotal: 250 |\n```\n')).toEqual(['g', 'kg', 'mg']);
  });

  it('offers the trade names the batch reader reads, inserted as written', () => {
    const { doc, position } = at(batch('bor|'));
    const items = ls.completion(doc, position)!.items;
    const borax = items.find((i) => i.label === 'borax')!;
    expect(borax.textEdit.newText).toBe('borax ');
    // Na2B4O7·10H2O: the decahydrate, as the reader takes borax (the shelf-name table).
    expect(borax.detail).toMatch(/Na₂B₄O₇·10H₂O/);
    expect(labels(batch('caustic s|'))).toContain('caustic soda');
  });

  it('offers the other batches of the note after `from batch "`', () => {
    const text =
      '```batch\nname: Nickel stock\nvolume: 1 L\nNiSO4 1.5 M\n```\n\n```batch\nname: Nickel strike\nvolume: 2 L\nNiSO4 0.1 M from batch "Ni|\n```\n';
    const { doc, position } = at(text);
    const items = ls.completion(doc, position)!.items;
    expect(items.map((i) => i.label)).toEqual(['Nickel stock']);
    expect(items[0].textEdit.newText).toBe('"Nickel stock"');
  });

  it('offers pH after `to `', () => {
    expect(labels(batch('NaOH to |'))).toEqual(['pH']);
    expect(labels(batch('NaOH to p|'))).toEqual(['pH']);
  });

  it('offers nothing outside batch blocks, in a comment or after a unit', () => {
    expect(labels('We weighed `Na|Cl`.\n')).toBeNull();
    expect(labels(batch('NaCl 5 g # fr|'))).toBeNull();
    expect(labels(batch('NaCl 5 g |'))).toBeNull();
    expect(labels('```python\nNa|\n```\n')).toBeNull();
  });

  it('works in .fnote batch blocks', () => {
    const { doc, position } = at('batch Strike\nvolume: 2 L\nNiSO4 0.1 |\nend\n', 'fnote');
    expect(ls.completion(doc, position)!.items.map((i) => i.label)).toContain('M');
  });
});

describe('completion on any batch line (property)', () => {
  it('never throws, and every edit ends at the cursor on its line and starts where the typed word does', () => {
    let answered = 0;
    const piece = fc.constantFrom(
      'NaCl',
      'Na',
      ' ',
      '  ',
      '5',
      '0.1',
      'g',
      'M',
      'mM',
      'to',
      'pH',
      'volume:',
      'total:',
      'name:',
      '#',
      '@',
      '99%',
      'sodium',
      'ch',
      '(II)',
      '·',
      'é',
      '🧪',
      '\t',
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 8 }), fc.nat(), (parts, cut) => {
        const line = parts.join('');
        const at = line.length === 0 ? 0 : cut % (line.length + 1);
        const text = '```batch\nvolume: 1 L\n' + line + '\n```\n';
        const doc = ls.analyse(text, 'markdown');
        const list = ls.completion(doc, { line: 2, character: at });
        if (list?.items.length) answered++;
        for (const item of list?.items ?? []) {
          const r = item.textEdit.range;
          expect(r.end).toEqual({ line: 2, character: at });
          expect(r.start.line).toBe(2);
          expect(r.start.character).toBeLessThanOrEqual(at);
          // What the edit replaces is what was typed of the item (case aside): a prefix of a word of it.
          const typed = line.slice(r.start.character, at).toLowerCase();
          expect(
            item.filterText
              .toLowerCase()
              .split(' ')
              .some((w, k, all) => all.slice(k).join(' ').startsWith(typed) || w.startsWith(typed)),
          ).toBe(true);
          expect(item.textEdit.newText.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 500 },
    );
    // Not vacuous: many of the lines got items.
    expect(answered).toBeGreaterThan(100);
  });
});

describe('the inlay hints setting', () => {
  it('is on unless ionwright.inlayHints.enabled is false', () => {
    expect(readSettings(undefined).inlayHints).toBe(true);
    expect(readSettings({ inlayHints: { enabled: false } }).inlayHints).toBe(false);
    expect(readSettings({ inlayHints: { enabled: 'no' } }).inlayHints).toBe(true);
  });
});

describe('inlay hints', () => {
  const text = '```batch\nname: Rinse A\nvolume: 500 mL\nNaCl 0.1 M\nKCl 2 g\nKNO3 10 mmol @ 99.5%  # fresh\n```\n';
  const doc = ls.analyse(text, 'markdown');
  const whole = { start: { line: 0, character: 0 }, end: { line: 99, character: 0 } };

  it('show the mass to weigh beside each target line, at the end of its content', () => {
    const hints = ls.inlayHints(doc, whole);
    // 0.1 mol/L × 0.5 L × 58.44 g/mol = 2.922 g; 0.010 mol × 101.10 g/mol / 0.995 = 1.016 g (CIAAW 2021).
    expect(hints.slice(1).map((h) => [h.position, h.label])).toEqual([
      [{ line: 3, character: 10 }, '⇒ 2.922 g'],
      [{ line: 5, character: 20 }, '⇒ 1.016 g'],
    ]);
    expect(hints[2].tooltip.value).toContain('divided by the assay, 99.5 %');
  });

  it('show the batch pH after the opening line: neutral salts in water are at about pH 7 (common practice)', () => {
    const [ph] = ls.inlayHints(doc, whole);
    expect(ph.position).toEqual({ line: 0, character: 8 });
    expect(Number(ph.label.replace('pH ≈ ', ''))).toBeCloseTo(7, 0);
    expect(ph.tooltip.value).toMatch(/estimate/);
  });

  it('show the volume to pour beside a liquid target and the stock volume beside a dilution', () => {
    const d = ls.analyse('```batch\nvolume: 500 mL\nHCl 0.5 M @ 37%\nNiSO4 0.1 M from 1.5 M\nH2SO4 10 mL @ 96%\n```\n', 'markdown');
    const labels = ls.inlayHints(d, whole).map((h) => h.label);
    // 0.25 mol HCl ÷ about 12 M (37 %, CRC from memory) ≈ 20.8 mL; 0.1 M × 500 mL ÷ 1.5 M = 33.33 mL.
    expect(labels).toContain('⇒ 20.81 mL');
    expect(labels).toContain('⇒ 33.33 mL');
    // A line that is itself a volume gets no volume hint, and nothing poured gets a mass to weigh.
    expect(labels.filter((l) => l.startsWith('⇒'))).toHaveLength(2);
  });

  it('leave out what lies outside the range asked for', () => {
    expect(ls.inlayHints(doc, { start: { line: 4, character: 0 }, end: { line: 5, character: 30 } }).map((h) => h.label)).toEqual(['⇒ 1.016 g']);
    expect(ls.inlayHints(doc, { start: { line: 0, character: 0 }, end: { line: 0, character: 30 } }).map((h) => h.label)).toHaveLength(1);
  });

  it('show nothing where nothing was computed (a concentration without a volume)', () => {
    const d = ls.analyse('```batch\nNaCl 0.1 M\n```\n', 'markdown');
    expect(ls.inlayHints(d, whole)).toEqual([]);
  });
});

describe('semantic tokens', () => {
  const text =
    'Rinse with NaCl and `CuSO4·5H2O`.\n\n```reaction\n2 H2 + O2 -> 2 H2O(l)\nFe^3+ + e^- -> Fe^2+\n```\n\n```batch\nvolume: 1 L\nKCl 2 g # stock\n```\n';
  const doc = ls.analyse(text, 'markdown');
  const lines = text.split('\n');
  const tokens = decodeTokens(ls.semanticTokens(doc).data).map((t) => [lines[t.line].slice(t.character, t.character + t.length), t.type]);

  it('use only the standard token types of the protocol', () => {
    const standard = ['namespace', 'type', 'class', 'enum', 'interface', 'struct', 'typeParameter', 'parameter', 'variable', 'property', 'enumMember', 'event'];
    const more = ['function', 'method', 'macro', 'keyword', 'modifier', 'comment', 'string', 'number', 'regexp', 'operator', 'decorator'];
    for (const t of SEMANTIC_TOKENS_LEGEND.tokenTypes) expect([...standard, ...more]).toContain(t);
  });

  it('mark formulas in prose and code, coefficients, arrows, charges, states and batch pieces', () => {
    expect(tokens).toEqual([
      ['NaCl', 'type'],
      ['CuSO4', 'type'],
      ['·', 'operator'],
      ['5', 'number'],
      ['H2O', 'type'],
      ['2', 'number'],
      ['H2', 'type'],
      ['+', 'operator'],
      ['O2', 'type'],
      ['->', 'operator'],
      ['2', 'number'],
      ['H2O', 'type'],
      ['(l)', 'enumMember'],
      ['Fe', 'type'],
      ['^3+', 'modifier'],
      ['+', 'operator'],
      ['e^-', 'type'],
      ['->', 'operator'],
      ['Fe', 'type'],
      ['^2+', 'modifier'],
      ['volume', 'property'],
      ['KCl', 'type'],
      ['2', 'number'],
      ['# stock', 'comment'],
    ]);
  });

  it('mark a titre line: its keyword, the substances and the figures', () => {
    const t = '```batch\nvolume: 1 L\nNiSO4 0.5 M\ntank: 200 L\ntitre NiSO4: 2.00 mL sample, 19.20 mL 0.0500 M EDTA\n```\n';
    const d = ls.analyse(t, 'markdown');
    const ls2 = t.split('\n');
    const got = decodeTokens(ls.semanticTokens(d).data).map((x) => [ls2[x.line].slice(x.character, x.character + x.length), x.type]);
    expect(got).toEqual(
      expect.arrayContaining([
        ['tank', 'property'],
        ['titre', 'property'],
        ['NiSO4', 'type'],
        ['2.00', 'number'],
        ['19.20', 'number'],
        ['0.0500', 'number'],
        ['EDTA', 'type'],
      ]),
    );
  });

  it('give the same tokens for a range as for the whole note, within the range', () => {
    const range = { start: { line: 3, character: 0 }, end: { line: 4, character: 30 } };
    const part = decodeTokens(ls.semanticTokens(doc, range).data);
    const all = decodeTokens(ls.semanticTokens(doc).data).filter((t) => t.line >= 3 && t.line <= 4);
    expect(part).toEqual(all);
  });

  it('never overlap, never run across a line, on any text (property)', () => {
    const piece = fc.constantFrom(
      'NaCl',
      ' ',
      '\n',
      '`',
      '`Fe^3+`',
      '```reaction\n',
      '```batch\n',
      '```\n',
      '2 H2 + O2 -> 2 H2O',
      'CuSO4·5H2O',
      'volume: 1 L',
      '# x',
      'é',
      '🧪',
      '\r\n',
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 40 }), (parts) => {
        const t = parts.join('');
        const d = ls.analyse(t, 'markdown');
        const lns = t.split(/\r\n|\r|\n/);
        let prevEnd = { line: -1, character: 0 };
        for (const tok of decodeTokens(ls.semanticTokens(d).data)) {
          expect(tok.length).toBeGreaterThan(0);
          expect(tok.character + tok.length).toBeLessThanOrEqual(lns[tok.line].length);
          if (tok.line === prevEnd.line) expect(tok.character).toBeGreaterThanOrEqual(prevEnd.character);
          else expect(tok.line).toBeGreaterThan(prevEnd.line);
          prevEnd = { line: tok.line, character: tok.character + tok.length };
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('folding ranges', () => {
  it('fold batches, reaction blocks and sections with their subsections', () => {
    const text = [
      '# Lab',
      '',
      '## Baths',
      '',
      '```batch',
      'name: A',
      'KCl 2 g',
      '```',
      '',
      '### Notes',
      'text',
      '',
      '## Reactions',
      '```reaction',
      'H2 + O2 -> H2O',
      '```',
      '',
    ].join('\n');
    const f = ls.foldingRanges(ls.analyse(text, 'markdown'));
    expect(f.map((r) => [r.startLine, r.endLine, r.collapsedText])).toEqual([
      [0, 15, 'Lab'],
      [2, 10, 'Baths'],
      [4, 7, 'batch A · 1 ingredient'],
      [9, 10, 'Notes'],
      [12, 15, 'Reactions'],
      [13, 15, 'reaction · 1 equation'],
    ]);
  });

  it('fold a .fnote batch … end block', () => {
    const f = ls.foldingRanges(ls.analyse('batch Strike\nvolume: 2 L\nNiSO4 0.1 M\nend\n', 'fnote'));
    expect(f.map((r) => [r.startLine, r.endLine])).toEqual([[0, 3]]);
  });
});

describe('workspace symbols and definitions', () => {
  const a = ls.analyse('# Baths\n\n```batch\nname: Rinse A\nKCl 2 g\n```\n\n```batch Strike 2\nNiSO4 5 g\n```\n', 'markdown');
  const b = ls.analyse('Used Rinse A on panel 3; Rinse AB is another. See `Strike 2`.\n', 'markdown');
  const notes = [ls.noteSummary(a, 'file:///a.md'), ls.noteSummary(b, 'file:///b.md')];

  it('list the batches of every note by name, matched loosely', () => {
    expect(ls.workspaceSymbols(notes, '').map((s) => [s.name, s.location.uri, s.containerName])).toEqual([
      ['Rinse A', 'file:///a.md', 'Baths'],
      ['Strike 2', 'file:///a.md', 'Baths'],
    ]);
    expect(ls.workspaceSymbols(notes, 'rna').map((s) => s.name)).toEqual(['Rinse A']);
    expect(ls.workspaceSymbols(notes, 'rinse').map((s) => s.location.range)).toEqual([{ start: { line: 3, character: 6 }, end: { line: 3, character: 13 } }]);
    expect(ls.workspaceSymbols(notes, 'zz')).toEqual([]);
  });

  it('lead from a batch’s name in another note to the batch, by the whole name only', () => {
    const line = b.text.split('\n')[0];
    const def = (needle: string, k = 1) => ls.definition(b, { line: 0, character: line.indexOf(needle) + k }, notes);
    expect(def('Rinse A')).toEqual([{ uri: 'file:///a.md', range: { start: { line: 3, character: 6 }, end: { line: 3, character: 13 } } }]);
    expect(def('Strike 2', 3)).toEqual([{ uri: 'file:///a.md', range: { start: { line: 7, character: 9 }, end: { line: 7, character: 17 } } }]);
    // `Rinse AB` is not `Rinse A`.
    expect(def('Rinse AB', 7)).toEqual([]);
    expect(def('panel')).toEqual([]);
  });
});
