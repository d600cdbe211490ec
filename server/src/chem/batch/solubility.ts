/**
 * Solubility (an estimate), a check of stage 4: where a final volume is given, the water is taken as the
 * final volume at 1 g/mL less the dissolved mass (anhydrous: a hydrate's water counts as solvent), and
 * each ingredient of the solubility table (data/solubility.ts) is compared with its solubility in water
 * at 20 or 25 °C. Above it, a `batch-solubility` warning on the amount.
 */
import type { FormulaAnalysis } from '../analyse';
import { PRACTICALLY_INSOLUBLE_BELOW, SOLUBILITY, type SolubilityRow } from '../data/solubility';
import type { ChemDiagnostic } from '../diagnostic';
import { formulaAtoms, hillFormula, molarMass, partAtoms, subscriptDigits, type AtomCounts } from '../formula/compute';
import { parseFormula } from '../formula/parse';
import type { CountedLine } from './amounts';
import type { SolubilityCheck } from './types';

const WATER_MOLAR_MASS = molarMass({ H: 2, O: 1 }).value;

/** The solubility table by the Hill formula of each anhydrous substance (a fixed table: built on first use, never evicted). */
let solubilityIndex: Map<string, SolubilityRow> | null = null;

/** The row of the solubility table for a substance by its (anhydrous) Hill formula. */
export function solubilityRow(hill: string): SolubilityRow | undefined {
  if (!solubilityIndex) {
    solubilityIndex = new Map();
    for (const row of SOLUBILITY) {
      const parsed = parseFormula(row.formula);
      if (parsed.ok && parsed.formula) solubilityIndex.set(hillFormula(formulaAtoms(parsed.formula)), row);
    }
  }
  return solubilityIndex.get(hill);
}

type Anhydrous = { atoms: AtomCounts; hill: string; molarMass: number; water: number } | null;
/** Per analysis (analyses are shared and read-only, so the answer never changes). */
const anhydrousMemo = new WeakMap<FormulaAnalysis, Anhydrous>();

/** The anhydrous part of a formula: its atoms less the water of crystallisation, and that water per formula unit. */
export function anhydrousOf(a: FormulaAnalysis): Anhydrous {
  let hit = anhydrousMemo.get(a);
  if (hit === undefined) anhydrousMemo.set(a, (hit = anhydrousUncached(a)));
  return hit;
}

function anhydrousUncached(a: FormulaAnalysis): Anhydrous {
  if (!a.ok || !a.formula || a.charge !== 0) return null;
  let water = 0;
  a.formula.parts.forEach((part, k) => {
    if (k === 0) return;
    const at = partAtoms(part);
    const keys = Object.keys(at);
    if (keys.length === 2 && at.O > 0 && at.H === 2 * at.O) water += at.O;
  });
  const atoms: AtomCounts = { ...a.atoms };
  if (water) {
    atoms.H -= 2 * water;
    atoms.O -= water;
    for (const el of Object.keys(atoms)) if (Math.abs(atoms[el]) < 1e-9) delete atoms[el];
  }
  if (Object.keys(atoms).length === 0) return null;
  return { atoms, hill: hillFormula(atoms), molarMass: molarMass(atoms).value, water };
}

/** A number for a message: whole above 100, else three significant digits. */
export const fmt = (x: number) => (x >= 100 ? String(Math.round(x)) : String(Number(x.toPrecision(3))));
const ESTIMATE = 'Estimate: water ≈ final volume × 1 g/mL less the dissolved mass';

export interface SolubilityChecks {
  /** The check of each counted line, in the same order (undefined where the substance is not in the table). */
  checks: Array<SolubilityCheck | undefined>;
  /** Estimated grams of water; null without a volume. */
  waterG: number | null;
  diagnostics: ChemDiagnostic[];
}

/** The water of the batch as estimated, and what each line puts into it. */
function waterOf(counted: readonly CountedLine[], volumeL: number) {
  const solutionG = volumeL * 1000;
  const parts = counted.map((c) => {
    const water = c.line.analysis.hill === 'H2O';
    const an = water ? null : anhydrousOf(c.line.analysis);
    // Everything weighed dissolves into the solution except the hydrate water, which joins the solvent.
    const dissolved = water ? 0 : Math.max(0, c.massG - (an ? c.moles * an.water * WATER_MOLAR_MASS : 0));
    return { c, an, dissolved };
  });
  const dissolvedG = parts.reduce((s, x) => s + x.dissolved, 0);
  return { solutionG, parts, dissolvedG, waterG: solutionG - dissolvedG };
}

/** Compare each counted line of the solubility table with its solubility in the batch's estimated water. */
export function checkSolubility(counted: readonly CountedLine[], volumeL: number | null): SolubilityChecks {
  const out: SolubilityChecks = { checks: counted.map(() => undefined), waterG: null, diagnostics: [] };
  if (volumeL === null) return out;
  const w = waterOf(counted, volumeL);
  out.waterG = w.waterG;
  w.parts.forEach(({ c, an }, k) => {
    const row = an ? solubilityRow(an.hill) : undefined;
    if (!an || !row) return;
    const anhydrousG = c.moles * an.molarMass;
    const per100 = w.waterG > 0 ? (anhydrousG / w.waterG) * 100 : null;
    const check: SolubilityCheck = {
      salt: subscriptDigits(row.formula),
      row,
      anhydrousG,
      per100gWater: per100,
      exceeds: per100 === null || per100 > row.gPer100gWater,
    };
    out.checks[k] = check;
    if (!check.exceeds) return;
    out.diagnostics.push({
      code: 'batch-solubility',
      severity: 'warning',
      start: c.amount.start,
      end: c.amount.end,
      message: exceededMessage(check, an.water > 0, w),
      data: { salt: row.formula, solubility: row.gPer100gWater, temperatureC: row.temperatureC, per100gWater: per100 },
    });
  });
  if (w.waterG <= 0 && out.diagnostics.length === 0 && w.parts.length) {
    const big = w.parts.reduce((a, b) => (b.dissolved > a.dissolved ? b : a));
    out.diagnostics.push({
      code: 'batch-solubility',
      severity: 'warning',
      start: big.c.amount.start,
      end: big.c.amount.end,
      message: `The dissolved mass (${fmt(w.dissolvedG)} g) is more than the ${fmt(w.solutionG)} mL final volume can hold at about 1 g/mL: no water is left to dissolve it. ${ESTIMATE}.`,
    });
  }
  return out;
}

/** What a warning of an exceeded solubility says: how much would not dissolve, on what estimate. */
function exceededMessage(
  { salt, row, anhydrousG, per100gWater: per100 }: SolubilityCheck,
  hydrate: boolean,
  w: { solutionG: number; dissolvedG: number; waterG: number },
): string {
  const sol = `${fmt(row.gPer100gWater)} g per 100 g water at ${row.temperatureC} °C`;
  if (per100 === null) {
    return `${salt}: the dissolved mass (${fmt(w.dissolvedG)} g) is more than the ${fmt(w.solutionG)} mL final volume can hold at about 1 g/mL, so no water is left to dissolve it; ${salt} dissolves to ${sol}. ${ESTIMATE}.`;
  }
  const basis = hydrate ? ' (anhydrous; the hydrate water is counted as solvent)' : '';
  const rescue = row.gPer100gWater < 1 ? ' unless another ingredient dissolves it (an acid or a complexing agent)' : '';
  const undissolved = anhydrousG - (row.gPer100gWater * w.waterG) / 100;
  const head =
    row.gPer100gWater < PRACTICALLY_INSOLUBLE_BELOW
      ? `${salt} is practically insoluble in water (${sol}): about ${fmt(undissolved)} g of the ${fmt(anhydrousG)} g${basis} would stay undissolved${rescue}.`
      : `${salt}: about ${fmt(per100)} g per 100 g water${basis}, above its solubility of ${sol}: about ${fmt(undissolved)} g would not dissolve${rescue}.`;
  const estimate = `${ESTIMATE} (${fmt(Math.max(w.waterG, 0))} g of water in ${fmt(w.solutionG)} mL, with ${fmt(w.dissolvedG)} g dissolved).`;
  // Where even all of the final volume as water would hold it, the estimate of the water decides.
  const near =
    (anhydrousG / w.solutionG) * 100 <= row.gPer100gWater
      ? ' Near saturation: a denser solution holds more water than this estimate, so it may still dissolve.'
      : '';
  return `${head} ${estimate}${near}`;
}
