/**
 * Where an inserted table goes: after the block the analysis knows (a paragraph, a fence, a heading, a
 * `.fnote` line or batch), never inside a fence or a paragraph, with a blank line on each side, in the
 * document's own line ending. Checked by applying the edit and reading the result back: the note's
 * blocks are all still there, in order, and the table is one block of its own.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sectionTableEdit, tableEditAt, tableEditForSelection, type EditOutcome } from '../../server/src/service/actions';
import { analyseDocument } from '../../server/src/service/document';
import { markdownBlocks } from '../../server/src/notes/scan';
import type { NotesLanguage } from '../../server/src/notes/types';

function apply(text: string, o: EditOutcome, language: NotesLanguage = 'markdown'): string {
  if (!('edit' in o)) throw new Error(`no edit: ${o.reason}`);
  const doc = analyseDocument(text, language);
  const s = doc.lines.offsetAt(o.edit.range.start);
  const e = doc.lines.offsetAt(o.edit.range.end);
  return text.slice(0, s) + o.edit.newText + text.slice(e);
}

const NOTE = [
  '# Strike bath, line 3',
  '',
  'We made up the strike with `NiCl2·6H2O` and `HCl` as usual,',
  'then topped up with `H3BO3` before the second panel.',
  '```batch',
  'name: Strike S-3',
  'volume: 2 L',
  'NiCl2·6H2O 480 g',
  '```',
  'Panels after: no bloom.',
  '',
].join('\n');

describe('inserted tables', () => {
  it('a selection ending mid-paragraph: after the paragraph, not inside it', () => {
    const doc = analyseDocument(NOTE, 'markdown');
    const start = NOTE.indexOf('`NiCl2');
    const out = apply(NOTE, tableEditForSelection(doc, start, start + 14));
    expect(out).toContain('then topped up with `H3BO3` before the second panel.\n\n| Formula |');
    // The paragraph's two lines are still together.
    expect(out).toContain('as usual,\nthen topped up');
  });

  it('a paragraph that touches a fence: the table goes after the paragraph and before the fence, the fence untouched', () => {
    const doc = analyseDocument(NOTE, 'markdown');
    const out = apply(NOTE, tableEditAt(doc, NOTE.indexOf('H3BO3')));
    const fence = NOTE.slice(NOTE.indexOf('```batch'), NOTE.indexOf('```\nPanels') + 3);
    expect(out).toContain(fence);
    expect(out.indexOf('| Formula |')).toBeLessThan(out.indexOf('```batch'));
    expect(out).toMatch(/\| H₃BO₃ .*\n\n```batch/);
  });

  it('a selection ending inside a fence: after the fence', () => {
    const doc = analyseDocument(NOTE, 'markdown');
    const out = apply(NOTE, tableEditForSelection(doc, NOTE.indexOf('`NiCl2'), NOTE.indexOf('480 g')));
    const fenceEnd = out.indexOf('```\n', out.indexOf('```batch') + 3);
    expect(out.indexOf('| Formula |')).toBeGreaterThan(fenceEnd);
    expect(out.indexOf('| Formula |')).toBeLessThan(out.indexOf('Panels after'));
    expect(out.slice(out.indexOf('```batch'), fenceEnd + 3)).not.toContain('| Formula |');
  });

  it('the batch table after its fence, with a blank line before the next paragraph', () => {
    const doc = analyseDocument(NOTE, 'markdown');
    const out = apply(NOTE, tableEditAt(doc, NOTE.indexOf('480 g')));
    expect(out).toMatch(/```\n\n\*\*Strike S-3[^]*\n\nPanels after/);
  });

  it('never inside a fence that is never closed: no edit, and a reason', () => {
    const text = 'Use `NaCl`.\n\n```batch\nvolume: 1 L\nNaCl 5 g\n';
    const doc = analyseDocument(text, 'markdown');
    const o = tableEditAt(doc, text.indexOf('NaCl 5'));
    expect('reason' in o && o.reason).toMatch(/never closed/);
  });

  for (const [name, eol] of [
    ['CRLF', '\r\n'],
    ['lone CR', '\r'],
    ['LF', '\n'],
  ] as const) {
    it(`uses the document's own line ending (${name})`, () => {
      const text = NOTE.replace(/\n/g, eol);
      const doc = analyseDocument(text, 'markdown');
      for (const o of [tableEditAt(doc, text.indexOf('480 g')), tableEditAt(doc, text.indexOf('H3BO3')), sectionTableEdit(doc, 0)]) {
        const out = apply(text, o);
        const breaks = out.match(/\r\n|\r|\n/g)!;
        expect(new Set(breaks)).toEqual(new Set([eol]));
      }
    });
  }

  it('in a .fnote note: after the line or the batch block', () => {
    const text = 'section: Rinse\nformula: NaCl, KCl\nbatch Rinse R-1\n  volume: 1 L\n  NaCl 2 g\nend\nreaction: 2 H2 + O2 -> 2 H2O\n';
    const doc = analyseDocument(text, 'fnote');
    const out = apply(text, tableEditAt(doc, text.indexOf('NaCl 2')), 'fnote');
    expect(out).toMatch(/\nend\n\n\*\*Rinse R-1[^]*\n\nreaction: 2 H2/);
  });

  it('property: every block of the note is still a block, unchanged, after the insertion', () => {
    const pieces = [
      'Prose with `NaCl` and `KBr`.',
      'A second line with `CuSO4·5H2O`.',
      '```batch\nvolume: 1 L\nKCl 3 g\n```',
      '```python\nx = 1\n```',
      '# Heading `LiF`',
      '',
      '    indented code',
    ];
    fc.assert(
      fc.property(
        fc.array(fc.constantFrom(...pieces), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (parts, a, b) => {
          const text = parts.join('\n') + '\n';
          const doc = analyseDocument(text, 'markdown');
          let [s, e] = [Math.floor(a * text.length), Math.floor(b * text.length)];
          if (e < s) [s, e] = [e, s];
          for (const o of [tableEditForSelection(doc, s, e), tableEditAt(doc, s)]) {
            if (!('edit' in o)) continue;
            const at = doc.lines.offsetAt(o.edit.range.start);
            const out = apply(text, o);
            const shift = o.edit.newText.length;
            const after = new Set(markdownBlocks(out).map((x) => `${x.start}:${x.end}`));
            for (const x of markdownBlocks(text)) {
              const moved = x.start >= at ? `${x.start + shift}:${x.end + shift}` : `${x.start}:${x.end}`;
              expect(after.has(moved), `block ${JSON.stringify(text.slice(x.start, x.end))} split or moved in ${JSON.stringify(out)}`).toBe(true);
            }
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
