/**
 * Bath upkeep: a plating or process bath analysed by titration, and the additions that bring the tank
 * back to its targets. Pure functions, plain data in and out; nothing here reads a batch block itself.
 *
 *   titration.ts  `readTitre(text, offset)` a titre line → a reading (every token's span) or findings;
 *                 `computeTitre(reading, { targetM })` → mol/L, g/L of the salt as written, g/L of the
 *                 ion or element that carries the analysis, the arithmetic (`basis`) and the checks
 *   additions.ts  `readTank(text, offset)` the `tank:` header; `planAdditions({ tankL, capacityL,
 *                 targets, measured })` → water, draw-off and the mass of each reagent, with `basis`
 *   index.ts      `analyseUpkeep(...)` both together for one batch; `upkeepJson(...)` its JSON
 *
 * INTEGRATION NOTE for the batch reader (chem/batch/read.ts, amounts.ts, index.ts; not edited here):
 *
 * 1. Recognise the lines, in read.ts, before the header and ingredient tests:
 *      - a titre line: its first word is `titre` or `titration` (case-insensitive, then a blank or the
 *        end): `isTitreLine(text)`. Hand the line as written (comment included) with its absolute start
 *        to `readTitre(text, start)`; do not cut the `#` comment first (the reader does, and gives the
 *        comment a token). A titre line is neither an ingredient nor a header: it never enters
 *        amounts.ts, the mix or the checks.
 *      - a tank header: `tank:` (case-insensitive; `isTankHeader(text)`) → `readTank(text, start)`.
 *        Add `tank` to the header keys (a second `tank:` is `batch-header`, as for `volume:`); it is the
 *        litres of bath in the tank now (`tank: 200 L`, `tank: 180 L of 220 L` with the capacity), not
 *        the batch's `volume:` (the recipe's make-up volume), which the targets are computed from.
 * 2. After amounts.ts (the targets need the batch's concentrations): call
 *      analyseUpkeep({ titreLines, tankLine, targets, at })
 *    with `targets` from the counted ingredients: `{ formula: line.formula.text, targetM:
 *    concentrationM, assay, start: lineStart, end: lineEnd }` (an ingredient without a concentration
 *    has no target; leave it out), and `at` the block's opening line. It returns
 *    `{ titres, tank, additions, diagnostics, notes }`; push `diagnostics` (absolute offsets) with the
 *    batch's. A batch with no titre line gets no `upkeep` at all.
 * 3. Show:
 *      - batch JSON (`batch --json`, the contract's batch object): `upkeep: upkeepJson(result)`, i.e.
 *        `{ tank: { litres, capacityL } | null, titres: [{ line, analyte, as, concentrationM,
 *        saltGPerL, carrier, carrierGPerL, ofTarget, basis }], water: { drawOffL, waterL, finalL,
 *        dilutionFactor, governing, basis, notes } | null, additions: [{ formula, reagent, assay,
 *        measuredM, targetM, assumed, addMol, massG, volumeML?, cautions?, afterM, basis }], notes }`.
 *        A new key: nothing existing moves. `water.notes` (ADDITIONS_NOTE: an estimate; the SDS and the
 *        shop's procedure) and an addition's `cautions` belong wherever the additions are shown.
 *      - hover on a titre line: the analyte's mol/L, g/L of the salt and of the carrier, then `basis`
 *        one line each (they are the hand calculation), then the line's findings; on an ingredient
 *        line with an addition: the addition's `massG` (and `volumeML`), then its `basis`; on `tank:`
 *        the plan's `basis`.
 *      - the batch table (service/columns.ts): a section "Upkeep" after the ingredients, one row per
 *        addition: substance, analysed (mol/L, "not analysed" where assumed), target, to add (g, and
 *        mL for a liquid), and one row for the water (and the draw-off where there is one). An inlay
 *        hint `+ 1.23 kg` after an ingredient line fits the HINT_MAKERS pattern.
 *      - semantic tokens: each reading's `tokens` (kinds: keyword, analyte, species, number, unit,
 *        titrant, ratio, reaction, comment) map to the standard types already used for batch lines.
 * 4. Codes (chem/codes.ts): titre-syntax, titre-amount, titre-analyte, titre-ratio (errors),
 *    titre-implausible (warning: above solubility or 3× off target, common practice), upkeep-tank,
 *    upkeep-reagent (errors), upkeep-target (information: an analysis without a target, a target
 *    without an analysis). Formula findings inside a titre line keep their own codes.
 */
import type { ChemDiagnostic } from '../diagnostic';
import { analyseFormula } from '../analyse';
import { planAdditions, readTank, substanceKey, type AdditionsPlan, type TankVolume, type UpkeepTarget } from './additions';
import { computeTitre, readTitre, type TitreFailure, type TitreOptions, type TitreReading, type TitreResult } from './titration';

export {
  computeTitre,
  fmt,
  MAX_TITRE_LINE,
  readTitre,
  TARGET_FACTOR,
  type Carrier,
  type TitreFailure,
  type TitreOptions,
  type TitreRatio,
  type TitreRead,
  type TitreReading,
  type TitreResult,
  type TitreToken,
  type TitreTokenKind,
  type WrittenVolume,
} from './titration';
export {
  ADDITIONS_NOTE,
  isTankHeader,
  planAdditions,
  readTank,
  type Addition,
  type AdditionsInput,
  type AdditionsPlan,
  type TankVolume,
  type UpkeepMeasurement,
  type UpkeepTarget,
} from './additions';

/** Whether a batch line is a titre line: its first word is `titre` or `titration`. */
export const isTitreLine = (line: string): boolean => /^(titre|titration)(?=\s|$)/i.test(line.trimStart());

export interface UpkeepInput {
  /** The titre lines as written, each with the absolute offset of its first character. */
  titreLines: ReadonlyArray<{ text: string; start: number }>;
  /** The `tank:` header line, where there is one. */
  tankLine?: { text: string; start: number } | null;
  /** The batch's targets (its ingredients with a concentration). */
  targets: readonly UpkeepTarget[];
  /** Where findings about the whole batch go (its opening line). */
  at?: { start: number; end: number };
}

export interface Upkeep {
  /** One per titre line, in order: a result, or the failure with its findings. */
  titres: Array<TitreResult | TitreFailure>;
  tank: TankVolume | null;
  /** Null without a tank or without a readable titre. */
  additions: AdditionsPlan | null;
  /** Every finding of the titres, the tank and the plan, absolute offsets, in text order. */
  diagnostics: ChemDiagnostic[];
  /** What was not computed, and why. */
  notes: string[];
}

const substance = (formula: string) => substanceKey(analyseFormula(formula));

/** Read every titre line and the tank, compute each titre against its target, and plan the additions. */
export function analyseUpkeep(input: UpkeepInput): Upkeep {
  const diagnostics: ChemDiagnostic[] = [];
  const notes: string[] = [];
  const targetOf = new Map<string, UpkeepTarget>();
  for (const t of input.targets) {
    const k = substance(t.formula);
    if (k && !targetOf.has(k)) targetOf.set(k, t);
  }
  // Two passes: a titre with `less <substance>` takes off what that substance's own titre found (a titre
  // that itself takes something off is not used for another: no chains).
  const read = input.titreLines.map((line) => readTitre(line.text, line.start));
  const optionsOf = (r: TitreReading) => {
    const key = substance(r.analyte.formula);
    const t = key ? targetOf.get(key) : undefined;
    return t ? { targetM: t.targetM, targetText: `${t.formula} in the batch` } : {};
  };
  const first = new Map<string, number[]>();
  for (const r of read) {
    if (!r.ok || r.less) continue;
    const key = substance(r.analyte.formula);
    if (key) first.set(key, [...(first.get(key) ?? []), computeTitre(r, optionsOf(r)).concentrationM]);
  }
  const mean = (xs: number[] | undefined) => (xs && xs.length ? xs.reduce((x, y) => x + y, 0) / xs.length : undefined);
  const titres = read.map((r): TitreResult | TitreFailure => {
    if (!r.ok) {
      diagnostics.push(...r.diagnostics);
      return r;
    }
    const options: TitreOptions = optionsOf(r);
    if (r.less) options.lessM = r.less.map((l) => mean(first.get(substance(l.formula) ?? '')) ?? NaN);
    const result = computeTitre(r, options);
    diagnostics.push(...result.diagnostics);
    return result;
  });
  let tank: TankVolume | null = null;
  if (input.tankLine) {
    const r = readTank(input.tankLine.text, input.tankLine.start);
    if (r.ok) tank = r.tank;
    else diagnostics.push(...r.diagnostics);
  }
  // A titre with an error (a `less` substance without its titre) is shown but makes no addition.
  const done = titres.filter((t): t is TitreResult => 'reading' in t && !t.diagnostics.some((d) => d.severity === 'error'));
  let additions: AdditionsPlan | null = null;
  if (!done.length) {
    if (titres.length) notes.push('No titre counts (each has an error): no additions are computed.');
  } else if (!tank)
    notes.push(
      input.tankLine
        ? "The 'tank:' header cannot be read: no additions are computed."
        : "No 'tank:' header: write the litres of bath in the tank (`tank: 200 L`) for the additions.",
    );
  else {
    additions = planAdditions({
      tankL: tank.litres,
      capacityL: tank.capacityL,
      targets: input.targets,
      measured: done.map((t) => ({ formula: t.reading.analyte.formula, concentrationM: t.concentrationM, start: t.reading.start, end: t.reading.end })),
      at: { start: tank.start, end: tank.end },
    });
    diagnostics.push(...additions.diagnostics);
  }
  diagnostics.sort((x, y) => x.start - y.start);
  return { titres, tank, additions, diagnostics, notes };
}

/** The `upkeep` object of a batch's JSON: plain numbers and texts, no analyses. */
export function upkeepJson(u: Upkeep) {
  return {
    tank: u.tank ? { litres: u.tank.litres, capacityL: u.tank.capacityL } : null,
    titres: u.titres.map((t) =>
      'reading' in t
        ? {
            line: t.reading.text,
            analyte: t.reading.analyte.analysis.display,
            as: t.reading.carrier?.display ?? null,
            concentrationM: t.concentrationM,
            saltGPerL: t.saltGPerL,
            carrier: t.reading.carrier ? { species: t.reading.carrier.display, perAnalyte: t.reading.carrier.perAnalyte, why: t.reading.carrier.why } : null,
            carrierGPerL: t.carrierGPerL,
            ofTarget: t.ofTarget ?? null,
            basis: t.basis,
          }
        : { line: t.text, error: t.diagnostics.find((d) => d.severity === 'error')?.message ?? 'not read' },
    ),
    water: u.additions
      ? {
          drawOffL: u.additions.drawOffL,
          waterL: u.additions.waterL,
          finalL: u.additions.finalL,
          dilutionFactor: u.additions.dilutionFactor,
          governing: u.additions.governing,
          basis: u.additions.basis,
          notes: u.additions.notes,
        }
      : null,
    additions: (u.additions?.additions ?? []).map((a) => ({
      formula: a.display,
      reagent: a.reagent.display,
      assay: a.reagent.assay,
      measuredM: a.measuredM,
      targetM: a.targetM,
      assumed: a.assumed,
      addMol: a.addMol,
      massG: a.massG,
      ...(a.volumeML !== undefined ? { volumeML: a.volumeML } : {}),
      ...(a.cautions ? { cautions: a.cautions } : {}),
      afterM: a.afterM,
      basis: a.basis,
    })),
    notes: u.notes,
  };
}
