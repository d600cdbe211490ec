import type { ChemDiagnostic } from '../diagnostic';
import type { Formula } from '../formula/ast';
import type { AtomCounts } from '../formula/compute';

export interface ChargeAssessment {
  balanced: boolean;
  message: string;
  suggestions: string[];
  oxidationStates: Record<string, number> | null;
  diagnostics: ChemDiagnostic[];
}

export function assessCharge(_f: Formula, _atoms: AtomCounts): ChargeAssessment {
  return { balanced: true, message: 'Charge balance is not assessed yet.', suggestions: [], oxidationStates: null, diagnostics: [] };
}
