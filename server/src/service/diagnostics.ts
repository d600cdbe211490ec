/** Diagnostics in LSP shape (plain objects; the server hands them over as they are). */
import { SEVERITY_NUMBER, type ChemDiagnostic } from '../chem/diagnostic';
import type { AnalysedDocument } from './document';
import type { LineIndex, Range } from './positions';

export interface LspDiagnostic {
  range: Range;
  severity: 1 | 2 | 3 | 4;
  code: string;
  message: string;
  source: 'ionwright';
  data?: Record<string, unknown>;
}

/** A finding in LSP shape, its offsets turned into positions with `lines`. */
export function toLsp(lines: LineIndex, d: ChemDiagnostic): LspDiagnostic {
  return {
    range: lines.range(d.start, d.end),
    severity: SEVERITY_NUMBER[d.severity],
    code: d.code,
    message: d.message,
    source: 'ionwright',
    ...(d.data ? { data: d.data } : {}),
  };
}

export function documentDiagnostics(doc: AnalysedDocument): LspDiagnostic[] {
  return doc.diagnostics.map((d) => toLsp(doc.lines, d));
}
