/** A finding of the chemistry core, with offsets into the text it was given (UTF-16 code units). */
import type { DiagnosticCode } from './codes';

export type { DiagnosticCode } from './codes';

export type Severity = 'error' | 'warning' | 'information' | 'hint';

export interface ChemDiagnostic {
  /** One of the catalogue's codes (./codes.ts). */
  code: DiagnosticCode;
  severity: Severity;
  message: string;
  /** Offset of the first character the finding is about. */
  start: number;
  /** Offset just past the last character. */
  end: number;
  /** Machine-readable extras (suggestions, balanced form, …). */
  data?: Record<string, unknown>;
}

export const SEVERITY_NUMBER: Record<Severity, 1 | 2 | 3 | 4> = { error: 1, warning: 2, information: 3, hint: 4 };

/** The same finding moved by `by` characters (one object shape, no spread: this runs in hot loops). */
export function shiftDiagnostic(d: ChemDiagnostic, by: number): ChemDiagnostic {
  if (by === 0) return d;
  const out: ChemDiagnostic = { code: d.code, severity: d.severity, message: d.message, start: d.start + by, end: d.end + by };
  if (d.data) out.data = d.data;
  return out;
}
