/**
 * The two readings of a bare trailing `<digits><sign>` (see formula/parse.ts): keep the one that names a
 * known ion (`SO42-` → SO₄²⁻, `NH4+` → NH₄⁺), else the one that balances, else the parser's default.
 */
import { assessCharge } from '../charge/balance';
import type { Formula } from '../formula/ast';
import { matchIon } from './match';

function namesKnownIon(f: Formula): boolean {
  if (f.parts.length !== 1) return false;
  return matchIon(f.parts[0].items).some((m) => m.ion.charges.includes(f.charge));
}

export function chooseReading(f: Formula): Formula {
  const alt = f.alternative;
  if (!alt) return f;
  if (f.chargeNotation === 'bare-digit') return f; // one element: Fe3+ is Fe³⁺
  if (namesKnownIon(f)) return f;
  if (namesKnownIon(alt)) return alt;
  const a = assessCharge(f);
  if (a.balanced && a.basis !== 'molecular') return f;
  const b = assessCharge(alt);
  return b.balanced && !a.balanced ? alt : f;
}
