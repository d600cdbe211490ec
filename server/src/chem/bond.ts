import type { Formula } from './formula/ast';
import type { AtomCounts } from './formula/compute';
import type { ChargeAssessment } from './charge/balance';
import type { ChemSettings } from './settings';

export interface BondAssessment {
  pair: [string, string];
  deltaEN: number;
  type: 'nonpolar covalent' | 'polar covalent' | 'ionic';
  percentIonic: number;
  note?: string;
}

export function assessBond(_f: Formula, _a: AtomCounts, _c: ChargeAssessment, _s: ChemSettings): BondAssessment | null {
  return null;
}
