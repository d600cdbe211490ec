/**
 * The language service façade, called as an editor would call it: a note with a `|` cursor marker, LSP
 * positions in, LSP-shaped results out. The features themselves are tested in their own files; here
 * each method is checked to reach its feature with the right position and settings.
 */
import { describe, expect, it } from 'vitest';
import { createLanguageService } from '../../server/src/service/languageService';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';
import { LineIndex } from '../../server/src/service/positions';

const ls = createLanguageService();

/** The note without its `|`, and the LSP position of the marker. */
function at(src: string) {
  const offset = src.indexOf('|');
  const text = src.slice(0, offset) + src.slice(offset + 1);
  return { text, position: new LineIndex(text).positionAt(offset), doc: ls.analyse(text, 'markdown') };
}

describe('createLanguageService', () => {
  it('is one service per settings object', () => {
    expect(createLanguageService(DEFAULT_SETTINGS)).toBe(ls);
    const kcal = { ...DEFAULT_SETTINGS, energyUnit: 'kcal/mol' as const };
    expect(createLanguageService(kcal)).not.toBe(ls);
    expect(createLanguageService(kcal).settings.energyUnit).toBe('kcal/mol');
  });

  it('hover at a position', () => {
    const { doc, position } = at('# Rinse\n\nWeighed `Na|Cl` today.\n');
    // NaCl 58.44 g/mol: CIAAW 2021 abridged weights, Na 22.990 + Cl 35.45.
    expect(ls.hover(doc, position)?.markdown).toContain('58.44 g/mol');
    expect(ls.hover(doc, { line: 0, character: 1 })).toBeNull();
  });

  it('code actions for a range, in either direction', () => {
    const { doc, position } = at('Label says `Ca|NO3`.\n');
    const forward = ls.codeActions(doc, { start: position, end: position }, ['quickfix']);
    expect(forward.map((a) => a.title)).toContain('Replace with Ca(NO₃)₂');
    const backward = ls.codeActions(doc, { start: { line: 0, character: 18 }, end: { line: 0, character: 12 } }, ['quickfix']);
    expect(backward.map((a) => a.title)).toContain('Replace with Ca(NO₃)₂');
  });

  it('analyse with the previous version re-reads only around the edit, and equals a fresh analysis', () => {
    const v1 = 'Weighed `NaCl`.\n\nThen `KBr`.\n';
    const doc1 = ls.analyse(v1, 'markdown');
    const v2 = v1.replace('KBr', 'KI');
    const doc2 = ls.analyse(v2, 'markdown', { doc: doc1 });
    expect(doc2.blocks[0].rel).toBe(doc1.blocks[0].rel);
    expect(ls.diagnostics(doc2)).toEqual(ls.diagnostics(ls.analyse(v2, 'markdown')));
  });

  it('tables, symbols, lenses, cards and batches', () => {
    const { doc, position } = at('# Bench\n\n```batch\nname: Rinse A\nvolume: 1 L\nNa|Cl 1 g\n```\n');
    expect(ls.documentSymbols(doc).map((s) => s.name)).toEqual(['Bench']);
    // Three lenses on the batch: its totals, inserting its table, copying it as a weighing list.
    expect(ls.codeLenses(doc).map((l) => [l.title.replace(/^1 ingredient · .*/, 'totals'), l.action])).toEqual([
      ['totals', 'none'],
      ['Insert table', 'insertTable'],
      ['Copy as weighing list', 'copyWeighingList'],
    ]);
    expect(ls.weighingListAt(doc, { line: 2, character: 0 })).toMatch(/^Rinse A, final volume 1 L\n/);
    expect(ls.batchesJson(doc)[0]).toMatchObject({ name: 'Rinse A', volumeL: 1 });
    expect(ls.tables(doc)).toContain('Rinse A');
    expect(ls.cardMarkdownAt(doc, position)).toContain('58.44');
    const edit = ls.tableEdit(doc, { at: position });
    expect('edit' in edit && edit.edit.newText).toContain('Rinse A');
    expect(ls.cardJson('CuSO4·5H2O').molarMass).toBeCloseTo(249.68, 1); // CRC: copper(II) sulfate pentahydrate 249.68 g/mol
  });
});
