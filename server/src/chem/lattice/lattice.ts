import type { Formula } from '../formula/ast';
import type { AtomCounts } from '../formula/compute';
import type { ChargeAssessment } from '../charge/balance';
import type { ChemSettings } from '../settings';

export interface LatticeAssessment {
  kJPerMol: number;
  method: string;
  inputs: Record<string, unknown>;
  alternatives: Array<{ method: string; kJPerMol: number }>;
  /** Always true for the model-based methods; a Born–Haber value rests on measured enthalpies. */
  estimate: boolean;
  typicalError: string;
}

export function estimateLattice(_f: Formula, _a: AtomCounts, _c: ChargeAssessment, _s: ChemSettings): LatticeAssessment | null {
  return null;
}
