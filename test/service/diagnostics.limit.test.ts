/** What the editor is sent for a note with very many findings: the most severe first, and a word on the rest. */
import { describe, expect, it } from 'vitest';
import { documentDiagnostics, editorDiagnostics } from '../../server/src/service/diagnostics';
import { analyseDocument } from '../../server/src/service/document';

describe('findings sent to the editor', () => {
  const text = Array.from({ length: 300 }, (_, i) => (i % 3 === 0 ? 'Weighed `NaXx`.' : 'Label says `CaNO3`.')).join('\n\n') + '\n';
  const doc = analyseDocument(text, 'markdown');
  const all = documentDiagnostics(doc);

  it('all of them, as they are, under the limit', () => {
    expect(editorDiagnostics(doc, 10_000)).toEqual(all);
  });

  it('over the limit: errors before warnings, in document order, then one finding that counts the rest', () => {
    const shown = editorDiagnostics(doc, 150);
    expect(shown).toHaveLength(151);
    const last = shown[150];
    expect(last.code).toBe('findings-limit');
    expect(last.message).toContain(`${all.length} findings`);
    const errors = all.filter((d) => d.severity === 1);
    expect(errors.length).toBe(100);
    // All 100 errors are kept, and 50 of the warnings: the first 50 in document order.
    expect(shown.slice(0, 150).filter((d) => d.severity === 1)).toHaveLength(100);
    const warnings = all.filter((d) => d.severity === 2);
    expect(shown.filter((d) => d.severity === 2)).toEqual(warnings.slice(0, 50));
    const starts = shown.slice(0, 150).map((d) => d.range.start.line);
    expect([...starts].sort((a, b) => a - b)).toEqual(starts);
  });
});
