/** The pieces every batch stage shares: blank-separated tokens with their offsets, and a finding on characters. */
import type { ChemDiagnostic, DiagnosticCode, Severity } from '../diagnostic';

export interface Token {
  text: string;
  /** Absolute offsets of `text`. */
  start: number;
  end: number;
}

/** The blank-separated tokens of `line`, whose first character is at offset `base`. */
export function tokens(line: string, base: number): Token[] {
  const out: Token[] = [];
  const re = /\S+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(line))) out.push({ text: m[0], start: base + m.index, end: base + m.index + m[0].length });
  return out;
}

/** A finding on [start, end); an error unless said otherwise. */
export function finding(code: DiagnosticCode, start: number, end: number, message: string, severity: Severity = 'error'): ChemDiagnostic {
  return { code, severity, start, end, message };
}

export const hasError = (diagnostics: readonly ChemDiagnostic[]): boolean => diagnostics.some((d) => d.severity === 'error');
