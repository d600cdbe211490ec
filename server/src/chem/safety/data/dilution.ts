/**
 * Integral enthalpies of solution of the concentrated acids and bases, as a function of dilution: ΔH(n)
 * in kJ per mole of solute for dissolving one mole of the pure substance (liquid acid, solid hydroxide,
 * gaseous hydrogen chloride) in n moles of water at 25 °C. The heat of diluting a reagent from n₀ to n₁
 * moles of water per mole is ΔH(n₁) − ΔH(n₀); a 96 % sulfuric acid carries n₀ ≈ 0.23.
 *
 * Sources:
 * - H2SO4: NBS Circular 500 (F. D. Rossini et al., 1952), "Integral heat of solution of H2SO4 in n H2O",
 *   as reprinted in the handbooks (CRC; Perry's Chemical Engineers' Handbook, "Heats of solution").
 *   From memory; the points n ≥ 1 are the ones usually printed, the point at n = 0.5 is the least sure.
 * - NaOH(s): NBS tables (Wagman et al. 1982; V. B. Parker, NSRDS-NBS 2, 1965), NaOH in n H2O. From memory.
 *   Below n = 3 (more concentrated than 43 %) the solution is not liquid at 25 °C; the curve is drawn
 *   straight to zero at n = 0, an estimate.
 * - HCl(g): NBS tables, HCl in n H2O. From memory, good to about 1 kJ/mol.
 * - HNO3(l): NBS tables, HNO3 in n H2O. From memory, coarse (about ±2 kJ/mol).
 *
 * `infinite` is the value at infinite dilution (the solution table's row for the same substance).
 */

export interface DilutionCurve {
  /** The substance as chemists write it. */
  formula: string;
  /** What the pure substance is: the state the curve starts from. */
  pure: string;
  /** [n (mol H2O per mol solute), ΔH (kJ/mol)], increasing in n, starting at [0, 0]. */
  points: ReadonlyArray<readonly [number, number]>;
  /** ΔH at infinite dilution, kJ/mol. */
  infinite: number;
  source: string;
}

export const DILUTION_CURVES: readonly DilutionCurve[] = Object.freeze([
  {
    formula: 'H2SO4',
    pure: 'liquid (100 %)',
    points: [
      [0, 0],
      [0.5, -15.73],
      [1, -28.07],
      [2, -41.92],
      [3, -48.99],
      [4, -54.06],
      [5, -58.03],
      [6, -60.75],
      [8, -64.6],
      [10, -67.03],
      [20, -71.5],
      [50, -73.34],
      [100, -73.97],
      [200, -74.98],
      [500, -76.73],
      [1000, -78.58],
      [5000, -84.43],
      [10000, -87.07],
    ],
    infinite: -96.19,
    source: 'NBS Circular 500 (Rossini et al. 1952), integral heat of solution of H2SO4 in n H2O, as reprinted in the CRC and Perry handbooks, from memory',
  },
  {
    formula: 'NaOH',
    pure: 'solid',
    points: [
      [0, 0],
      [3, -28.87],
      [4, -34.43],
      [5, -37.74],
      [10, -42.51],
      [20, -42.84],
      [50, -42.68],
      [100, -42.59],
      [200, -42.63],
      [500, -42.84],
      [1000, -43.05],
    ],
    infinite: -44.51,
    source: 'NBS tables (Wagman et al. 1982; Parker 1965), NaOH in n H2O, from memory; below n = 3 drawn straight to zero (an estimate)',
  },
  {
    formula: 'HCl',
    pure: 'gas',
    points: [
      [0, 0],
      [2, -48.83],
      [3, -56.85],
      [4, -61.2],
      [5, -64.06],
      [10, -69.49],
      [20, -71.79],
      [50, -73.05],
      [100, -73.59],
      [200, -73.85],
      [500, -74.1],
      [1000, -74.3],
    ],
    infinite: -74.85,
    source: 'NBS tables (Wagman et al. 1982), HCl in n H2O, from memory (about ±1 kJ/mol)',
  },
  {
    formula: 'HNO3',
    pure: 'liquid (100 %)',
    points: [
      [0, 0],
      [1, -13.1],
      [2, -20.0],
      [3, -24.3],
      [5, -28.8],
      [10, -31.8],
      [20, -32.8],
      [50, -33.0],
      [100, -33.0],
      [1000, -33.1],
    ],
    infinite: -33.3,
    source: 'NBS tables (Wagman et al. 1982), HNO3 in n H2O, from memory (coarse, about ±2 kJ/mol)',
  },
]);

/**
 * ΔH(n) on a curve: straight lines between the points in ln(1 + n) (the curve is steep at small n and
 * flat at large n); beyond the last point the last value (the remaining step to infinite dilution is
 * reached only below about 0.005 M); n = ∞ gives the infinite-dilution value.
 */
export function integralEnthalpy(curve: DilutionCurve, n: number): number {
  if (!Number.isFinite(n)) return curve.infinite;
  const p = curve.points;
  if (n <= 0) return 0;
  const last = p[p.length - 1];
  if (n >= last[0]) return last[1];
  let k = 1;
  while (p[k][0] < n) k++;
  const [n0, h0] = p[k - 1];
  const [n1, h1] = p[k];
  const x0 = Math.log1p(n0);
  const x1 = Math.log1p(n1);
  return h0 + ((h1 - h0) * (Math.log1p(n) - x0)) / (x1 - x0);
}
