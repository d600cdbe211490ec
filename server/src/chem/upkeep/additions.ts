/**
 * The additions that bring a tank back to target: from the analysed concentrations, the batch's targets
 * (its ingredient concentrations), the bath's volume in the tank (`tank: 200 L`) and the reagents as
 * supplied (the salt as weighed, with its hydrate water and assay).
 *
 * The problem, for components i with target cᵢ* and analysed cᵢ in V litres of bath:
 *   draw off D litres (only where the tank cannot hold the diluted bath), add W litres of water and aᵢ mol
 *   of each reagent, so that every component ends at target in the final volume F = V − D + W:
 *       cᵢ (V − D) + aᵢ = cᵢ* F,   aᵢ ≥ 0,   F ≤ capacity
 *   The least water that keeps every aᵢ ≥ 0 is F = (V − D) · R with R = max(1, maxᵢ cᵢ / cᵢ*): the bath
 *   is diluted to the most over-strength component (which then needs nothing), and each other component
 *   is added up to its target in F. Where F would exceed the tank's capacity, D = V − capacity / R is
 *   drawn off first. With every component at or below target, R = 1: no water, only additions.
 *
 * Assumptions, said in every basis: the volume the dissolved salts add is neglected (the tank is brought
 * back to its level with water after the additions dissolve); a component of the batch that was not
 * analysed is taken as at target (it is then topped up only for the water a dilution adds:
 * `upkeep-target`, information); a liquid reagent with a density table (chem/reagents) is also given as
 * a volume to pour (sodium and potassium hydroxide only below 90 %: above, they are pellets).
 * Two analyses of the same substance (duplicate titrations) are averaged.
 */
import { analyseFormula, type FormulaAnalysis } from '../analyse';
import type { ChemDiagnostic } from '../diagnostic';
import { liquidOf, volumeFor } from '../reagents';
import { anhydrousOf } from '../batch/solubility';
import { fmt, short } from './titration';

/** A mass for a basis: kilograms from 1000 g up. */
const grams = (g: number) => (g >= 1000 ? `${fmt(g / 1000)} kg` : `${fmt(g)} g`);

// ---------------------------------------------------------------------------------------------------
// The tank header.

export interface TankVolume {
  /** Litres of bath in the tank now. */
  litres: number;
  /** Litres the tank holds at its working level, where written (`tank: 180 L of 220 L`); null otherwise. */
  capacityL: number | null;
  text: string;
  start: number;
  end: number;
  /** The value and unit pieces with their offsets (for tokens). */
  tokens: Array<{ kind: 'keyword' | 'number' | 'unit' | 'word'; text: string; start: number; end: number }>;
}

const TANK_UNITS: Record<string, { unit: string; factor: number }> = {
  L: { unit: 'L', factor: 1 },
  l: { unit: 'L', factor: 1 },
  mL: { unit: 'mL', factor: 1e-3 },
  ml: { unit: 'mL', factor: 1e-3 },
  m3: { unit: 'm³', factor: 1000 },
  'm³': { unit: 'm³', factor: 1000 },
  // The US gallon: 231 cubic inches, 3.785411784 L exactly (NIST Handbook 44, Appendix C).
  gal: { unit: 'gal', factor: 3.785411784 },
};
const NUMBER = /^(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const TANK_HEADER = /^tank\s*:/i;
/** A tank larger than this (litres) is no plating tank: a slip of units. */
const MAX_TANK_L = 1e7;

/** Whether a batch line is a `tank:` header (the reader's test; `readTank` reads it). */
export const isTankHeader = (line: string): boolean => TANK_HEADER.test(line.trimStart());

/**
 * Read `tank: <V> <L|mL|m³|gal> [of <capacity> <unit>]` (a `#` comment allowed). `text` is the line, its
 * first character at absolute offset `offset`. Never throws.
 */
export function readTank(text: string, offset: number): { ok: true; tank: TankVolume } | { ok: false; diagnostics: ChemDiagnostic[] } {
  const hash = text.indexOf('#');
  const body = hash >= 0 ? text.slice(0, hash) : text;
  const lead = body.length - body.trimStart().length;
  const trimmed = body.trim();
  const start = offset + lead;
  const end = start + trimmed.length;
  const bad = (s: number, e: number, message: string) => ({
    ok: false as const,
    diagnostics: [{ code: 'upkeep-tank' as const, severity: 'error' as const, start: s, end: Math.max(e, s), message }],
  });
  const m = TANK_HEADER.exec(trimmed);
  if (!m) return bad(start, end, 'A tank header reads `tank: <volume>` (`tank: 200 L`).');
  const tokens: TankVolume['tokens'] = [{ kind: 'keyword', text: trimmed.slice(0, 4), start, end: start + 4 }];
  const re = /\S+/g;
  re.lastIndex = m[0].length;
  const ps: Array<{ text: string; start: number; end: number }> = [];
  let w: RegExpExecArray | null;
  while ((w = re.exec(trimmed))) {
    // A glued `200L`: split into number and unit.
    const g = /^((?:\d+(?:\.\d*)?|\.\d+))([A-Za-z³]+)$/.exec(w[0]);
    const s = start + w.index;
    if (g && TANK_UNITS[g[2]]) {
      ps.push({ text: g[1], start: s, end: s + g[1].length }, { text: g[2], start: s + g[1].length, end: s + w[0].length });
    } else ps.push({ text: w[0], start: s, end: s + w[0].length });
  }
  const volume = (k: number, what: string): { litres: number; next: number } | { error: ReturnType<typeof bad> } => {
    const n = ps[k];
    const u = ps[k + 1];
    if (!n) return { error: bad(start, end, `The ${what} is missing: write it as a number and a unit (L, mL, m³ or gal).`) };
    if (!NUMBER.test(n.text))
      return { error: bad(n.start, n.end, `'${short(n.text)}' is not a volume: the ${what} is a number and a unit (L, mL, m³ or gal).`) };
    const unit = u ? TANK_UNITS[u.text] : undefined;
    if (!u || !unit)
      return { error: bad(u?.start ?? n.start, u?.end ?? n.end, `The ${what} needs a unit (L, mL, m³ or gal)${u ? `, not '${short(u.text)}'` : ''}.`) };
    const litres = Number(n.text) * unit.factor;
    if (!(litres > 0) || litres > MAX_TANK_L) return { error: bad(n.start, u.end, `The ${what} must be a positive volume a tank can hold.`) };
    tokens.push({ kind: 'number', text: n.text, start: n.start, end: n.end }, { kind: 'unit', text: u.text, start: u.start, end: u.end });
    return { litres, next: k + 2 };
  };
  const v = volume(0, 'tank volume');
  if ('error' in v) return v.error;
  let capacityL: number | null = null;
  let k = v.next;
  if (ps[k] && /^(of|in)$/i.test(ps[k].text)) {
    tokens.push({ kind: 'word', text: ps[k].text, start: ps[k].start, end: ps[k].end });
    const c = volume(k + 1, "tank's capacity");
    if ('error' in c) return c.error;
    if (c.litres < v.litres) return bad(ps[k].start, ps[c.next - 1].end, `The tank holds ${fmt(v.litres)} L, more than its capacity of ${fmt(c.litres)} L.`);
    capacityL = c.litres;
    k = c.next;
  }
  if (k < ps.length) return bad(ps[k].start, end, 'Unexpected text after the tank volume: write `tank: 200 L` or `tank: 180 L of 220 L`.');
  return { ok: true, tank: { litres: v.litres, capacityL, text: trimmed, start, end, tokens } };
}

// ---------------------------------------------------------------------------------------------------
// The additions.

/** A component of the bath as the batch sets it. */
export interface UpkeepTarget {
  /** The ingredient's formula as the batch writes it (`NiSO4·6H2O`). */
  formula: string;
  /** Its target, mol/L of that formula. */
  targetM: number;
  /** Fraction 0–1 of what is weighed that is the substance (the batch line's assay; 1 where none). */
  assay?: number;
  /** The reagent as supplied where it is another form than the batch's: another hydrate of the same salt, with its assay. */
  reagent?: { formula: string; assay?: number };
  /** Where the target is written (the batch line), for findings. */
  start?: number;
  end?: number;
}

/** An analysed concentration (a titre's result, or any other analysis). */
export interface UpkeepMeasurement {
  /** The substance as analysed (`NiSO4·6H2O`); matched to a target by its anhydrous formula. */
  formula: string;
  concentrationM: number;
  /** Where it is written (the titre line), for findings. */
  start?: number;
  end?: number;
}

export interface AdditionsInput {
  /** Litres of bath in the tank. */
  tankL: number;
  /** Litres the tank holds; absent or null: any dilution fits. */
  capacityL?: number | null;
  targets: readonly UpkeepTarget[];
  measured: readonly UpkeepMeasurement[];
  /** Where findings about the whole plan go (the batch's opening line, or its `tank:` header). */
  at?: { start: number; end: number };
}

export interface Addition {
  /** The target's formula as written, and typeset. */
  formula: string;
  display: string;
  targetM: number;
  /** The analysed concentration (mean of duplicates); null where not analysed (taken as at target). */
  measuredM: number | null;
  /** How many analyses were averaged. */
  analyses: number;
  /** Not analysed: taken as at target. */
  assumed: boolean;
  /** mol of the substance to add. */
  addMol: number;
  /** The reagent weighed: its formula, typeset, molar mass and assay (0–1). */
  reagent: { formula: string; display: string; molarMass: number; assay: number };
  /** Grams of the reagent to weigh (assay included). */
  massG: number;
  /** For a liquid reagent with a density table: millilitres to pour, and the density used. */
  volumeML?: number;
  density?: string;
  /** The handling cautions of a concentrated liquid reagent (chem/reagents), where it has any. */
  cautions?: string[];
  /** Concentration after the additions, recomputed from the amounts (mol/L). */
  afterM: number;
  /** The arithmetic, for the hover. */
  basis: string;
  start?: number;
  end?: number;
}

export interface AdditionsPlan {
  tankL: number;
  capacityL: number | null;
  /** Litres of bath drawn off before diluting (0 unless the tank cannot hold the diluted bath). */
  drawOffL: number;
  /** Litres of water to add (the volume the salts add neglected). */
  waterL: number;
  /** Litres of bath after everything. */
  finalL: number;
  /** R: the final volume ÷ the bath kept (1 where nothing is over target). */
  dilutionFactor: number;
  /** The most over-strength component, which the dilution brings to target (null where none is over). */
  governing: string | null;
  additions: Addition[];
  /** Analyses of substances the batch sets no target for: no addition. */
  unmatched: Array<{ formula: string; concentrationM: number; reason: string }>;
  /** The arithmetic of the whole plan, line by line, for the hover. */
  basis: string[];
  /** What the plan is and is not: an estimate from the analysis, to be checked against the SDS and practice. */
  notes: string[];
  diagnostics: ChemDiagnostic[];
}

/** The plan's standing note (shown with it, in the hover and the table). */
export const ADDITIONS_NOTE =
  'Estimates from the analysis: re-titrate after the additions have dissolved and mixed. Follow the SDS of each reagent, the shop’s own procedure and local rules; wear the protection they name, and add concentrated acids slowly to the bath, never water to the acid.';

/** The key two forms of one substance share: the anhydrous Hill formula (hydrates of a salt are one substance). */
export function substanceKey(a: FormulaAnalysis): string | null {
  if (!a.ok || !a.molarMass) return null;
  const an = a.charge === 0 ? anhydrousOf(a) : null;
  return an ? an.hill : `${a.hill}${a.charge}`;
}

const info = (start: number | undefined, end: number | undefined, message: string, fallback: { start: number; end: number }): ChemDiagnostic => ({
  code: 'upkeep-target',
  severity: 'information',
  start: start ?? fallback.start,
  end: end ?? fallback.end,
  message,
});

/** What to add (and the water, where the bath is over target) to bring the tank back to its targets. */
export function planAdditions(input: AdditionsInput): AdditionsPlan {
  const diagnostics: ChemDiagnostic[] = [];
  const V = input.tankL;
  const capacity = input.capacityL ?? null;
  const where = input.at ?? { start: 0, end: 0 };
  const plan: AdditionsPlan = {
    tankL: V,
    capacityL: capacity,
    drawOffL: 0,
    waterL: 0,
    finalL: V,
    dilutionFactor: 1,
    governing: null,
    additions: [],
    unmatched: [],
    basis: [],
    notes: [ADDITIONS_NOTE],
    diagnostics,
  };
  if (!(V > 0) || !Number.isFinite(V)) {
    diagnostics.push({
      code: 'upkeep-tank',
      severity: 'error',
      ...where,
      message: 'No tank volume: the additions need the litres of bath in the tank (`tank: 200 L`).',
    });
    return plan;
  }

  // The targets, each with its reagent, by substance.
  interface Row {
    t: UpkeepTarget;
    a: FormulaAnalysis;
    reagent: FormulaAnalysis;
    assay: number;
    sum: number;
    n: number;
  }
  const rows = new Map<string, Row>();
  for (const t of input.targets) {
    const a = analyseFormula(t.formula);
    const key = substanceKey(a);
    const at = { start: t.start ?? where.start, end: t.end ?? where.end };
    if (!key || !(t.targetM > 0) || !Number.isFinite(t.targetM)) {
      diagnostics.push({
        code: 'upkeep-reagent',
        severity: 'error',
        ...at,
        message: `${a.display || t.formula}: no target concentration or molar mass to make an addition from.`,
      });
      continue;
    }
    const reagent = t.reagent ? analyseFormula(t.reagent.formula) : a;
    if (t.reagent && substanceKey(reagent) !== key) {
      diagnostics.push({
        code: 'upkeep-reagent',
        severity: 'error',
        ...at,
        message: `The reagent ${reagent.display || t.reagent.formula} is not a form of ${a.display} (another hydrate of the same salt): no addition is computed for it.`,
      });
      continue;
    }
    const assay = t.reagent ? (t.reagent.assay ?? 1) : (t.assay ?? 1);
    if (!(assay > 0 && assay <= 1)) {
      diagnostics.push({ code: 'upkeep-reagent', severity: 'error', ...at, message: `The assay of ${reagent.display} must be more than 0 and at most 100 %.` });
      continue;
    }
    if (rows.has(key)) {
      diagnostics.push(info(t.start, t.end, `${a.display} is set twice in the batch: the first target counts.`, at));
      continue;
    }
    rows.set(key, { t, a, reagent, assay, sum: 0, n: 0 });
  }

  // The analyses, matched to targets by substance; duplicates averaged.
  for (const m of input.measured) {
    const a = analyseFormula(m.formula);
    const key = substanceKey(a);
    const row = key ? rows.get(key) : undefined;
    if (!row || !(m.concentrationM >= 0) || !Number.isFinite(m.concentrationM)) {
      const reason = !row ? `the batch sets no target for ${a.display || m.formula}` : 'the analysed concentration is not a number';
      plan.unmatched.push({ formula: m.formula, concentrationM: m.concentrationM, reason });
      diagnostics.push(info(m.start, m.end, `${a.display || m.formula}: ${reason}, so no addition is made from this analysis.`, where));
      continue;
    }
    // The measurement is per mol of its own formula: the same mol of the target's (one anhydrous unit each).
    row.sum += m.concentrationM;
    row.n += 1;
  }

  // R: the dilution that brings the most over-strength component to target.
  const list = [...rows.values()];
  let R = 1;
  let governing: Row | null = null;
  for (const r of list) {
    if (!r.n) continue;
    const ratio = r.sum / r.n / r.t.targetM;
    if (ratio > R) {
      R = ratio;
      governing = r;
    }
  }
  let kept = V;
  let finalL = V * R;
  if (capacity !== null && finalL > capacity) {
    kept = capacity / R;
    finalL = capacity;
  }
  plan.drawOffL = V - kept;
  plan.waterL = finalL - kept;
  plan.finalL = finalL;
  plan.dilutionFactor = R;
  plan.governing = governing ? governing.a.display : null;

  const b = plan.basis;
  b.push(`tank: ${fmt(V)} L of bath${capacity !== null ? ` (holds ${fmt(capacity)} L)` : ''}`);
  if (governing) {
    const c = governing.sum / governing.n;
    b.push(
      `most over target: ${governing.a.display} at ${fmt(c)} mol/L against ${fmt(governing.t.targetM)} mol/L, R = ${fmt(c)} ÷ ${fmt(governing.t.targetM)} = ${fmt(R)}`,
    );
    if (plan.drawOffL > 0)
      b.push(
        `${fmt(V)} L × ${fmt(R)} = ${fmt(V * R)} L is more than the tank holds: draw off ${fmt(V)} − ${fmt(capacity as number)} ÷ ${fmt(R)} = ${fmt(plan.drawOffL)} L first, keeping ${fmt(kept)} L`,
      );
    b.push(`water: ${fmt(kept)} L × ${fmt(R)} = ${fmt(finalL)} L, so add ${fmt(plan.waterL)} L of water`);
  } else b.push('nothing is over target: no water, additions only');

  for (const r of list) {
    const measured = r.n ? r.sum / r.n : null;
    const c = measured ?? r.t.targetM;
    const addMol = Math.max(0, r.t.targetM * finalL - c * kept);
    const mm = r.reagent.molarMass?.value ?? NaN;
    const massG = (addMol * mm) / r.assay;
    const afterM = (c * kept + (massG * r.assay) / mm) / finalL;
    const assayText = r.assay < 1 ? ` ÷ ${fmt(r.assay * 100)} % assay` : '';
    const had = measured === null ? `not analysed, taken as at target ${fmt(c)} mol/L` : `analysed ${fmt(c)} mol/L${r.n > 1 ? ` (mean of ${r.n})` : ''}`;
    const need = `${fmt(r.t.targetM)} mol/L × ${fmt(finalL)} L − ${fmt(c)} mol/L × ${fmt(kept)} L = ${fmt(addMol)} mol`;
    let basis = `${r.a.display}: ${had}; target ${fmt(r.t.targetM)} mol/L. Add ${need}; × ${fmt(mm)} g/mol (${r.reagent.display})${assayText} = ${grams(massG)}`;
    if (addMol === 0) basis += governing === r ? ' (brought to target by the dilution)' : '';
    const add: Addition = {
      formula: r.t.formula,
      display: r.a.display,
      targetM: r.t.targetM,
      measuredM: measured,
      analyses: r.n,
      assumed: measured === null,
      addMol,
      reagent: { formula: r.t.reagent?.formula ?? r.t.formula, display: r.reagent.display, molarMass: mm, assay: r.assay },
      massG,
      afterM,
      basis,
    };
    if (r.t.start !== undefined) add.start = r.t.start;
    if (r.t.end !== undefined) add.end = r.t.end;
    const liquid = liquidOf(r.reagent);
    const pellets = (r.reagent.hill === 'HNaO' || r.reagent.hill === 'HKO') && r.assay >= 0.9;
    if (liquid && !pellets && addMol > 0) {
      const p = volumeFor(r.reagent, addMol, r.assay * 100);
      if ('volumeML' in p) {
        add.volumeML = p.volumeML;
        add.density = p.density.text;
        if (p.cautions.length) add.cautions = p.cautions;
        add.basis += `; at ${p.density.text}: ${p.volumeML >= 1000 ? `${fmt(p.volumeML / 1000)} L` : `${fmt(p.volumeML)} mL`} to pour`;
      }
    }
    if (measured === null) {
      diagnostics.push(
        info(
          r.t.start,
          r.t.end,
          `${r.a.display} was not analysed: taken as at target${addMol > 0 ? `, so only what the ${fmt(plan.waterL)} L of water dilutes is added back (${grams(massG)})` : ''}. Analyse it to be sure.`,
          where,
        ),
      );
    }
    plan.additions.push(add);
  }
  b.push(`the volume the dissolved salts add is neglected: dissolve the additions, then make the tank up to ${fmt(finalL)} L with water`);
  return plan;
}
