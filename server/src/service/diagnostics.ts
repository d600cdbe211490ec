/** Diagnostics in LSP shape (plain objects; the server hands them over as they are). */
import { SEVERITY_NUMBER, type ChemDiagnostic, type DiagnosticCode } from '../chem/diagnostic';
import type { AnalysedDocument } from './document';
import type { LineIndex, Range } from './positions';

export interface LspDiagnostic {
  range: Range;
  severity: 1 | 2 | 3 | 4;
  code: DiagnosticCode;
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

/**
 * Most findings an editor is sent for one note. A note with more (a pasted data dump can hold hundreds of
 * thousands) would cost the editor more to draw than it helps; the rest are named in a last finding.
 */
export const EDITOR_FINDINGS_LIMIT = 10_000;

/** The findings for the editor: errors and warnings first where the limit cuts, then a finding that says how many more there are. */
export function editorDiagnostics(doc: AnalysedDocument, limit = EDITOR_FINDINGS_LIMIT): LspDiagnostic[] {
  const all = doc.diagnostics;
  if (all.length <= limit) return all.map((d) => toLsp(doc.lines, d));
  // Keep the most severe, in document order: count by severity, then take each finding whose severity
  // still has room.
  const room = [0, 0, 0, 0, 0];
  let left = limit;
  const bySeverity = [0, 0, 0, 0, 0];
  for (const d of all) bySeverity[SEVERITY_NUMBER[d.severity]]++;
  for (let s = 1; s <= 4; s++) {
    room[s] = Math.min(bySeverity[s], left);
    left -= room[s];
  }
  const out: LspDiagnostic[] = [];
  let firstOmitted: ChemDiagnostic | undefined;
  for (const d of all) {
    const s = SEVERITY_NUMBER[d.severity];
    if (room[s] > 0) {
      room[s]--;
      out.push(toLsp(doc.lines, d));
    } else firstOmitted ??= d;
  }
  const at = firstOmitted ?? all[all.length - 1];
  out.push({
    range: doc.lines.range(at.start, at.start),
    severity: 3,
    code: 'findings-limit',
    message: `This note has ${all.length.toLocaleString('en-US')} findings; the editor shows ${limit.toLocaleString('en-US')} of them (errors and warnings first). \`ionwright check\` lists them all.`,
    source: 'ionwright',
  });
  return out;
}
