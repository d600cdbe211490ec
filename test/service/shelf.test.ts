import { afterEach, describe, expect, it, vi } from 'vitest';
import * as batch from '../../server/src/chem/batch';
import { parseShelf } from '../../server/src/chem/reagents';
import { analyseDocument, updateDocument } from '../../server/src/service/document';
import { createLanguageService } from '../../server/src/service/languageService';
import { cardJson } from '../../server/src/service/card';
import { analyseFormula } from '../../server/src/chem/analyse';

// An invented lab: the Harrowgate plating bench.
const SHELF_MD = [
  '# Harrowgate bench',
  '',
  '```shelf',
  'Acid A:       H2SO4 @ 96 %; density 1.835 g/mL; lot SA-2231',
  'Nickel jar 3: NiSO4·6H2O @ 99.0 %; lot N-0447',
  'Mystery:      H2SO4; colour blue',
  'no label here',
  'acid a:       H2SO4 @ 98 %',
  '```',
  '',
].join('\n');

describe('shelf blocks', () => {
  it('are found in Markdown, and their findings are diagnostics at exact offsets', () => {
    const doc = analyseDocument(SHELF_MD, 'markdown');
    expect(doc.shelves).toHaveLength(1);
    expect(doc.shelves[0].shelf.entries.map((e) => e.label)).toEqual(['Acid A', 'Nickel jar 3', 'Mystery', 'acid a']);
    const byCode = (c: string) => doc.diagnostics.filter((d) => d.code === c).map((d) => doc.text.slice(d.start, d.end));
    expect(byCode('shelf-syntax')).toEqual(['colour blue', 'no label here']);
    expect(byCode('shelf-duplicate')).toEqual(['acid a']);
    // The offsets are those parseShelf gives for the body at its place in the document.
    const bodyStart = SHELF_MD.indexOf('Acid A');
    const direct = parseShelf(SHELF_MD.slice(bodyStart, SHELF_MD.indexOf('\n```', bodyStart)), bodyStart);
    expect(doc.shelves[0].shelf.entries.map((e) => e.span)).toEqual(direct.entries.map((e) => e.span));
  });

  it('are found in .fnote between `shelf` and `end`, and an unclosed one says so', () => {
    const note = 'section: Stores\nshelf\nCaustic 50: NaOH @ 50 %; d 1.52 g/mL\nJar 9: unobtainium chloride\nend\nformula: NaCl\n';
    const doc = analyseDocument(note, 'fnote');
    expect(doc.shelves[0].shelf.entries.map((e) => e.label)).toEqual(['Caustic 50']);
    const d = doc.diagnostics.find((x) => x.code === 'shelf-substance');
    expect(d && note.slice(d.start, d.end)).toBe('unobtainium chloride');
    expect(doc.formulas.map((f) => f.ref.text)).toEqual(['NaCl']);
    const open = analyseDocument('shelf\nAcid A: H2SO4 @ 96 %\n', 'fnote');
    expect(open.diagnostics.map((x) => x.code)).toContain('batch-unclosed');
  });

  it('hover over a shelf line shows the entry as read', () => {
    const doc = analyseDocument(SHELF_MD, 'markdown');
    const service = createLanguageService();
    const h = service.hover(doc, doc.lines.positionAt(SHELF_MD.indexOf('SA-2231')));
    expect(h?.markdown).toContain('Acid A');
    expect(h?.markdown).toContain('Assay: 96 %');
    expect(h?.markdown).toContain('Density: 1.835 g/mL');
    expect(h?.markdown).toContain('Lot: SA-2231');
  });

  it('stays equal to a full analysis when edited incrementally', () => {
    const doc = analyseDocument(SHELF_MD, 'markdown');
    const edited = SHELF_MD.replace('lot N-0447', 'lot N-0448');
    const inc = updateDocument(doc, edited);
    const full = analyseDocument(edited, 'markdown');
    expect(inc.diagnostics).toEqual(full.diagnostics);
    expect(inc.shelves).toEqual(full.shelves);
  });
});

describe('batches read with the shelf and the stocks', () => {
  afterEach(() => vi.restoreAllMocks());

  it('hand the document’s shelf (else the workspace’s) to every batch', () => {
    const spy = vi.spyOn(batch, 'analyseBatch');
    analyseDocument(SHELF_MD + '```batch\nvolume: 1 L\nNaCl 5 g\n```\n', 'markdown');
    const ctx = spy.mock.calls.at(-1)?.[4];
    expect(ctx?.shelf?.entries.map((e) => e.label)).toContain('Acid A');
    spy.mockClear();
    const ws = { shelf: parseShelf('Lab acid: HCl @ 37 %'), source: 'file:///lab/shelf.md' };
    const doc = analyseDocument('```batch\nvolume: 1 L\nNaCl 5 g\n```\n', 'markdown', undefined, undefined, { workspaceShelf: ws });
    expect(spy.mock.calls.at(-1)?.[4]?.shelf?.entries[0].label).toBe('Lab acid');
    expect(doc.shelf?.source).toBe('file:///lab/shelf.md');
  });

  it('re-reads a batch when the stock batch it takes from changes, not from a stale cache', () => {
    // A reader that records what the stock gives it, as the dilution line will.
    const real = batch.analyseBatch;
    vi.spyOn(batch, 'analyseBatch').mockImplementation((lines, name, settings, open, context) => {
      const a = real(lines, name, settings, open, context);
      if (lines.some((l) => l.text.includes('from batch'))) {
        const s = context?.stockOf?.('Acid stock');
        return { ...a, notes: [...a.notes, `stock ${s ? s.ingredients.map((i) => `${i.formula} ${i.concentrationM}`).join(',') : 'none'}`] };
      }
      return a;
    });
    const dil = '```batch\nname: Rinse\nvolume: 1 L\nH2SO4 0.01 M from batch "Acid stock"\n```\n\n';
    const stock = (m: string) => `\`\`\`batch\nname: Acid stock\nvolume: 1 L\nH2SO4 ${m} M\n\`\`\`\n`;
    const v1 = dil + stock('1');
    const doc1 = analyseDocument(v1, 'markdown');
    const notes = (d: ReturnType<typeof analyseDocument>) => d.batches[0].analysis.notes.filter((n) => n.startsWith('stock'));
    // The stock is further down: found in the second pass.
    expect(notes(doc1)).toEqual(['stock H₂SO₄ 1']);
    const v2 = dil + stock('2');
    const doc2 = updateDocument(doc1, v2);
    expect(notes(doc2)).toEqual(['stock H₂SO₄ 2']);
    // And with the same block cache, a fresh analysis of the old text gives the old stock again.
    expect(notes(updateDocument(doc2, v1))).toEqual(['stock H₂SO₄ 1']);
    const doc3 = updateDocument(doc2, dil);
    expect(notes(doc3)).toEqual(['stock none']);
  });
});

describe('dilution from another batch, through the real reader', () => {
  it('takes the stock batch’s computed concentration, and follows it when the stock changes (c₁V₁ = c₂V₂ by hand)', () => {
    const dil = '```batch\nname: Rinse\nvolume: 1 L\nH2SO4 0.01 M from batch "Acid stock"\n```\n\n';
    const stock = (m: string) => `\`\`\`batch\nname: Acid stock\nvolume: 1 L\nH2SO4 ${m} M\n\`\`\`\n`;
    const stockML = (d: ReturnType<typeof analyseDocument>) => d.batches[0].analysis.ingredients[0]?.volumeML ?? null;
    const doc1 = analyseDocument(dil + stock('1'), 'markdown');
    // 0.01 M × 1000 mL ÷ 1 M = 10 mL; ÷ 2 M = 5 mL.
    expect(stockML(doc1)).toBeCloseTo(10, 9);
    const doc2 = updateDocument(doc1, dil + stock('2'));
    expect(stockML(doc2)).toBeCloseTo(5, 9);
    expect(stockML(analyseDocument(dil + stock('2'), 'markdown'))).toBeCloseTo(5, 9);
    const doc3 = updateDocument(doc2, dil);
    expect(stockML(doc3)).toBeNull();
    expect(doc3.diagnostics.some((d) => d.code === 'batch-stock')).toBe(true);
  });

  it('a circle of stocks ends: each line taken from the other is a finding, never a hang', () => {
    const text =
      '```batch\nname: A\nNaCl 0.1 M from batch "B"\nwater to 1 L\n```\n```batch\nname: B\nNaCl 0.5 M from batch "A"\nwater to 1 L\n```\n```batch\nname: Self\nKCl 0.1 M from batch "Self"\nwater to 1 L\n```\n';
    const doc = analyseDocument(text, 'markdown');
    const found = doc.diagnostics.filter((d) => d.code === 'batch-stock');
    expect(found.map((d) => text.slice(d.start, d.end))).toEqual(['from batch "B"', 'from batch "A"', 'from batch "Self"']);
    expect(found[0].message).toMatch(/no counted NaCl/);
  });

  it('reads a shelf label on a batch line with the entry’s assay and density', () => {
    const doc = analyseDocument('```shelf\nAcid A: H2SO4 @ 96 %; density 1.84 g/mL\n```\n\n```batch\nvolume: 1 L\nAcid A 10 mL\n```\n', 'markdown');
    const [i] = doc.batches[0].analysis.ingredients;
    expect(i.via).toBe('shelf');
    // 10 mL × 1.84 g/mL (the label's density) = 18.4 g.
    expect(i.massG).toBeCloseTo(18.4, 9);
  });
});

describe('go to the shelf entry from a label on a batch line', () => {
  it('in the same note, and in the workspace shelf file', () => {
    const ls = createLanguageService();
    const text = '```shelf\nAcid A: H2SO4 @ 96 %\n```\n\n```batch\nvolume: 1 L\nAcid A 10 mL\n```\n';
    const doc = ls.analyse(text, 'markdown');
    const at = doc.lines.positionAt(text.lastIndexOf('Acid A') + 2);
    expect(ls.definition(doc, at, [], 'file:///lab/monday.md')).toEqual([
      { uri: 'file:///lab/monday.md', range: { start: { line: 1, character: 0 }, end: { line: 1, character: 6 } } },
    ]);
    const shelfText = '# Shelf\n\n```shelf\nAcid A: H2SO4 @ 96 %\n```\n';
    const shelfDoc = ls.analyse(shelfText, 'markdown');
    const ws = { shelf: shelfDoc.shelf!.shelf, source: 'file:///lab/shelf.md', rangeOf: (a: number, b: number) => shelfDoc.lines.range(a, b) };
    const note = '```batch\nvolume: 1 L\nAcid A 10 mL\n```\n';
    const d2 = ls.analyse(note, 'markdown', undefined, { workspaceShelf: ws });
    expect(ls.definition(d2, { line: 2, character: 1 }, [], 'file:///lab/tuesday.md')).toEqual([
      { uri: 'file:///lab/shelf.md', range: { start: { line: 3, character: 0 }, end: { line: 3, character: 6 } } },
    ]);
  });
});

describe('cards name the trade’s names', () => {
  it('beside the systematic name, in JSON commonNames', () => {
    // Blue vitriol for copper(II) sulfate pentahydrate (Merck Index; from memory).
    const j = cardJson(analyseFormula('CuSO4·5H2O'));
    expect(j.name).toBe('copper(II) sulfate pentahydrate');
    expect(j.commonNames).toContain('blue vitriol');
    expect(cardJson(analyseFormula('CsBr')).commonNames).toEqual([]);
    const md = createLanguageService().cardMarkdown('CuSO4·5H2O');
    expect(md).toContain('blue vitriol');
  });
});
