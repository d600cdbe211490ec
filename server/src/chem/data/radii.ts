/**
 * Shannon effective ionic radii (R. D. Shannon, Acta Cryst. A32 (1976) 751-767; via data/reference/,
 * generated into ./generated.ts). Lookup by element, charge and coordination, with the nearest available
 * coordination when the one asked for is not tabulated (the card shows which was used).
 */
import { SHANNON_ROWS } from './generated';

const ROMAN: Record<string, number> = { I: 1, II: 2, III: 3, IIIPY: 3, IV: 4, IVSQ: 4, IVPY: 4, V: 5, VI: 6, VII: 7, VIII: 8, IX: 9, X: 10, XI: 11, XII: 12, XIV: 14 };

export interface ShannonRadius {
  element: string;
  charge: number;
  coordination: number;
  coordinationLabel: string;
  spin: string;
  ionicRadius: number;
  crystalRadius: number;
}

const BY_ION = new Map<string, ShannonRadius[]>();
for (const [el, charge, cn, spin, crystal, ionic] of SHANNON_ROWS) {
  const k = `${el}${charge}`;
  const r: ShannonRadius = { element: el, charge, coordination: ROMAN[cn] ?? 0, coordinationLabel: cn, spin, ionicRadius: ionic, crystalRadius: crystal };
  const list = BY_ION.get(k);
  if (list) list.push(r);
  else BY_ION.set(k, [r]);
}

/** The radius of an ion at a coordination (nearest available; high spin where both are tabulated). */
export function shannonRadius(el: string, charge: number, coordination = 6): ShannonRadius | undefined {
  const list = BY_ION.get(`${el}${charge}`);
  if (!list) return undefined;
  const usable = list.filter((r) => r.coordinationLabel !== 'IVSQ' && !r.coordinationLabel.endsWith('PY') && r.spin !== 'LS');
  const pool = usable.length ? usable : list;
  return [...pool].sort((a, b) => Math.abs(a.coordination - coordination) - Math.abs(b.coordination - coordination) || b.coordination - a.coordination)[0];
}
