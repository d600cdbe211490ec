/**
 * Liquids as supplied: which density table a formula's reagent uses, its density at an assay
 * (interpolated linearly in mass fraction between the table's rows), the amount in a volume poured, the
 * volume to pour for an amount, and the handling cautions of concentrated acids and bases.
 *
 * A liquid with no assay is taken as the pure substance where the pure substance is a liquid one pours
 * (sulfuric, nitric, acetic, formic acid, the solvents); a solution reagent (hydrochloric acid, ammonia,
 * the hydroxides, hydrogen peroxide) needs its assay. The label's density, where given, is used instead
 * of the table's, and a difference of more than 1.5 % is reported.
 */
import { analyseFormula, type FormulaAnalysis } from '../analyse';
import { itemsText, waterOf } from '../names/systematic';
import { AQUEOUS, AQUEOUS_SOLVENTS, PURE_LIQUIDS, WATER_20C, type DensityTable, type PureLiquid } from './densities';
import { finding, type ReagentFinding } from './findings';

export type LiquidMatch = { kind: 'aqueous'; table: DensityTable } | { kind: 'pure'; liquid: PureLiquid };

const BY_FORM = new Map<string, LiquidMatch>();
for (const table of [...AQUEOUS, ...AQUEOUS_SOLVENTS]) for (const f of table.forms) BY_FORM.set(f, { kind: 'aqueous', table });
for (const liquid of PURE_LIQUIDS) for (const f of liquid.forms) if (!BY_FORM.has(f)) BY_FORM.set(f, { kind: 'pure', liquid });

/** The written form of a formula that the tables are keyed by (one part, no water, no charge). */
function bareForm(a: FormulaAnalysis): string | undefined {
  const f = a.formula;
  if (!a.ok || !f || a.charge !== 0 || waterOf(f.parts) !== 0 || f.parts.length !== 1 || f.parts[0].multiplier !== 1) return undefined;
  return itemsText(f.parts[0].items);
}

/** The liquid reagent a formula names, if the tables have it (`H2SO4` → sulfuric acid; `C2H5OH` → ethanol). */
export function liquidOf(a: FormulaAnalysis): LiquidMatch | undefined {
  const bare = bareForm(a);
  return bare === undefined ? undefined : BY_FORM.get(bare);
}

export const liquidName = (m: LiquidMatch) => (m.kind === 'aqueous' ? m.table.name : m.liquid.name);

export interface DensityReading {
  /** g/mL at 20 °C (or the label's). */
  gPerML: number;
  /** The assay the density is for (% by mass; 100 for a pure liquid). */
  assayPercent: number;
  /** `table` (a row), `interpolated` (between two rows), `pure` (a pure liquid), `label` (given). */
  basis: 'table' | 'interpolated' | 'pure' | 'label';
  /** The rows interpolated between. */
  between?: [readonly [number, number, string?], readonly [number, number, string?]];
  /** Where the density comes from, as a card says it. */
  source: string;
  /** What was used, in one line: `1.8355 g/mL (96 %, 20 °C; CRC Handbook … from memory)`. */
  text: string;
}

/** Density of a table's reagent at an assay, interpolated; undefined outside the table. */
export function densityAt(table: DensityTable, assayPercent: number): DensityReading | undefined {
  const rows = table.rows;
  if (!(assayPercent >= rows[0][0]) || assayPercent > rows[rows.length - 1][0]) return undefined;
  // Binary search for the first row at or above the assay.
  let lo = 0;
  let hi = rows.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (rows[mid][0] < assayPercent) lo = mid + 1;
    else hi = mid;
  }
  const upper = rows[lo];
  const source = `${table.src === 'CRC-CPAS (from memory)' ? 'CRC Handbook, concentrative properties of aqueous solutions, from memory' : table.src}`;
  if (upper[0] === assayPercent) return reading(upper[1], assayPercent, 'table', upper[2] ?? source, undefined);
  const lower = rows[lo - 1];
  const t = (assayPercent - lower[0]) / (upper[0] - lower[0]);
  return reading(lower[1] + t * (upper[1] - lower[1]), assayPercent, 'interpolated', source, [lower, upper]);
}

function reading(gPerML: number, assayPercent: number, basis: DensityReading['basis'], source: string, between: DensityReading['between']): DensityReading {
  const r: DensityReading = { gPerML, assayPercent, basis, source, text: `${gPerML.toFixed(4)} g/mL (${assayPercent} %, 20 °C; ${source})` };
  if (between) r.between = between;
  return r;
}

export interface DensityLookup {
  density?: DensityReading;
  findings: ReagentFinding[];
}

/**
 * The density to use for a reagent at an assay (undefined: the pure substance where that is a liquid),
 * the label's where given. Findings say what was assumed or what is missing.
 */
export function reagentDensity(a: FormulaAnalysis, assayPercent?: number, labelDensity?: number): DensityLookup {
  const findings: ReagentFinding[] = [];
  const match = liquidOf(a);
  const label = a.display;
  if (assayPercent !== undefined && !(assayPercent > 0 && assayPercent <= 100)) {
    return { findings: [finding('assay-range', 'error', `An assay of ${assayPercent} % is outside 0–100 %.`)] };
  }
  let table: DensityReading | undefined;
  if (match && a.atoms.C && bareForm(a) === a.hill)
    findings.push(
      finding('approximation', 'information', `${a.display} is read as ${liquidName(match)}: a molecular formula alone does not tell isomers apart.`),
    );
  if (match?.kind === 'pure') {
    if (assayPercent !== undefined && assayPercent < 100 && match.liquid.id !== 'water')
      findings.push(
        finding(
          'approximation',
          'information',
          `${match.liquid.name} at ${assayPercent} %: the density of the pure liquid is used (the table has no mixtures).`,
        ),
      );
    table = reading(match.liquid.density, assayPercent ?? 100, 'pure', match.liquid.src.replace('CRC-ORG', 'CRC Handbook, organic compounds'), undefined);
  } else if (match?.kind === 'aqueous') {
    const t = match.table;
    const w = assayPercent ?? (t.pureLiquid ? 100 : undefined);
    if (w === undefined) {
      if (labelDensity === undefined)
        return {
          findings: [
            finding(
              'assay-needed',
              'error',
              `${t.name} is a solution: give its assay from the label (commercial ${t.commercial}, e.g. \`@ ${t.commercial.match(/\d+(?:\.\d+)?/)?.[0] ?? '37'}%\`); a liquid without one is taken as the pure substance, which ${label} is not as supplied.`,
            ),
          ],
        };
    } else {
      table = densityAt(t, w);
      if (!table) {
        const max = t.rows[t.rows.length - 1][0];
        if (labelDensity === undefined)
          return {
            findings: [
              finding(
                'assay-range',
                'error',
                `The density table of ${t.name} goes to ${max} %; ${w} % is beyond it: give the density from the label (\`d 1.23 g/mL\`).`,
              ),
            ],
          };
      } else if (assayPercent === undefined)
        findings.push(finding('approximation', 'information', `No assay given: ${t.name} taken as the pure substance (100 %).`));
    }
  }
  if (labelDensity !== undefined) {
    if (!(labelDensity > 0.3 && labelDensity < 5))
      return { findings: [...findings, finding('assay-range', 'error', `A density of ${labelDensity} g/mL is not that of a liquid reagent.`)] };
    if (table && Math.abs(labelDensity - table.gPerML) / table.gPerML > 0.015)
      findings.push(
        finding(
          'density-label',
          'information',
          `The label's density ${labelDensity} g/mL differs from the table's ${table.gPerML.toFixed(4)} g/mL at ${table.assayPercent} %: the label's is used.`,
        ),
      );
    return { density: reading(labelDensity, assayPercent ?? table?.assayPercent ?? 100, 'label', 'the label', undefined), findings };
  }
  if (!table)
    return {
      findings: [
        finding(
          'unknown-liquid',
          'error',
          `No density is known for ${label} as a liquid: give it from the label after the amount (\`@ 12.5% d 1.21 g/mL\`) or weigh it.`,
        ),
      ],
    };
  return { density: table, findings };
}

/** Molarity of a reagent as supplied: c = 1000 ρ w / M (mol/L), ρ in g/mL, w the mass fraction. */
export const reagentMolarity = (gPerML: number, assayPercent: number, molarMass: number) => (1000 * gPerML * (assayPercent / 100)) / molarMass;

export interface Poured {
  volumeML: number;
  /** Mass of the solution poured, g. */
  solutionMassG: number;
  /** Mass of the substance in it (the assay's share), g. */
  massG: number;
  moles: number;
  density: DensityReading;
  /** The reagent's own concentration, mol/L. */
  reagentMolarity: number;
  cautions: string[];
  findings: ReagentFinding[];
}

/**
 * The molar mass the assay is counted in: the written formula's, except where the trade gives the assay
 * as another formula (ammonia solution written NH4OH: the assay is % NH3).
 */
function assayBasis(a: FormulaAnalysis): { mm: number; note?: ReagentFinding } | undefined {
  const mm = a.molarMass?.value;
  if (!mm) return undefined;
  const m = liquidOf(a);
  if (m?.kind !== 'aqueous' || m.table.formula === bareForm(a)) return { mm };
  const basis = analyseFormula(m.table.formula);
  if (!basis.molarMass || basis.hill === a.hill) return { mm };
  return {
    mm: basis.molarMass.value,
    note: finding(
      'approximation',
      'information',
      `The assay of ${m.table.name} is given as ${basis.display}: the amount is counted as ${basis.display} (one ${a.display} per ${basis.display}).`,
    ),
  };
}

const noMolarMass = (a: FormulaAnalysis) => ({
  findings: [finding('unknown-liquid', 'error', `${a.display} has no molar mass: its amount cannot be computed.`)],
});

/** The amount in `volumeML` of a liquid reagent as supplied (`H2SO4 10 mL @ 96%`). */
export function pour(a: FormulaAnalysis, volumeML: number, assayPercent?: number, labelDensity?: number): Poured | { findings: ReagentFinding[] } {
  const basis = assayBasis(a);
  if (!basis) return noMolarMass(a);
  if (!(volumeML > 0)) return { findings: [finding('assay-range', 'error', `A volume must be more than zero.`)] };
  const d = reagentDensity(a, assayPercent, labelDensity);
  if (!d.density) return { findings: d.findings };
  const solutionMassG = volumeML * d.density.gPerML;
  const moles = (solutionMassG * d.density.assayPercent) / 100 / basis.mm;
  return poured(a, basis, d, volumeML, solutionMassG, moles);
}

/** The volume of a liquid reagent to pour for `moles` of the substance (`HCl 0.5 M @ 37%` in a batch). */
export function volumeFor(a: FormulaAnalysis, moles: number, assayPercent?: number, labelDensity?: number): Poured | { findings: ReagentFinding[] } {
  const basis = assayBasis(a);
  if (!basis) return noMolarMass(a);
  if (!(moles >= 0)) return { findings: [finding('assay-range', 'error', `An amount must be zero or more.`)] };
  const d = reagentDensity(a, assayPercent, labelDensity);
  if (!d.density) return { findings: d.findings };
  const solutionMassG = (moles * basis.mm) / (d.density.assayPercent / 100);
  return poured(a, basis, d, solutionMassG / d.density.gPerML, solutionMassG, moles);
}

function poured(
  a: FormulaAnalysis,
  basis: { mm: number; note?: ReagentFinding },
  d: DensityLookup,
  volumeML: number,
  solutionMassG: number,
  moles: number,
): Poured {
  const density = d.density as DensityReading;
  const cautions = handlingCautions(a, density.assayPercent);
  const findings = [...d.findings];
  if (basis.note) findings.push(basis.note);
  if (cautions.length) findings.push(finding('handling', 'information', cautions.join(' ')));
  return {
    volumeML,
    solutionMassG,
    massG: moles * (a.molarMass?.value as number),
    moles,
    density,
    reagentMolarity: reagentMolarity(density.gPerML, density.assayPercent, basis.mm),
    cautions,
    findings,
  };
}

/**
 * Handling cautions for a concentrated acid or base poured by volume, and for a flammable solvent
 * (common practice, as the SDSs of these reagents give them; the SDS and local rules decide). Concentrated: 10 % or more (3 % and more
 * for hydrofluoric acid, 8 % and more for hydrogen peroxide, the GHS thresholds' order of magnitude).
 */
export function handlingCautions(a: FormulaAnalysis, assayPercent: number): string[] {
  const m = liquidOf(a);
  if (!m) return [];
  const id = m.kind === 'pure' ? m.liquid.id : m.table.id;
  if (FLAMMABLE.has(id)) return assayPercent >= 50 ? [FLAMMABLE_LINE] : [];
  if (m.kind !== 'aqueous') return [];
  const threshold = m.table.id === 'hydrofluoric' ? 3 : m.table.id === 'hydrogen-peroxide' ? 8 : 10;
  if (assayPercent < threshold) return [];
  let lines = CAUTIONS.get(m.table.id);
  if (!lines) CAUTIONS.set(m.table.id, (lines = cautionLines(m.table)));
  return [...lines];
}

const CAUTIONS = new Map<string, string[]>();
/** Flammable solvents (GHS Flam. Liq. 2; common practice: their mixtures with water from about 50 %). */
const FLAMMABLE = new Set(['ethanol', 'methanol', 'isopropanol', 'acetone']);
const FLAMMABLE_LINE = 'Flammable liquid: no open flames or sparks near it; keep the container closed. The SDS and local rules decide.';

function cautionLines(table: DensityTable): string[] {
  const id = table.id;
  const out: string[] = [];
  const acid = ['sulfuric', 'hydrochloric', 'nitric', 'phosphoric', 'acetic', 'formic', 'hydrofluoric'].includes(id);
  const base = id === 'sodium-hydroxide' || id === 'potassium-hydroxide' || id === 'ammonia';
  const volatile = ['hydrochloric', 'nitric', 'acetic', 'formic', 'hydrofluoric', 'ammonia'].includes(id);
  if (acid)
    out.push(
      `Concentrated ${table.name}: add the acid slowly to the water, never water to the acid${id === 'sulfuric' ? ' (it heats strongly on dilution)' : ''}.`,
    );
  if (base && id !== 'ammonia') out.push(`Concentrated ${table.name}: corrosive; add it slowly to the water, stirring (it heats on dilution).`);
  if (id === 'hydrogen-peroxide') out.push('Concentrated hydrogen peroxide: an oxidiser; keep it from organic matter and metals, and vent its container.');
  out.push('Wear eye protection and resistant gloves.');
  if (volatile) out.push('Work in a fume hood: its vapour is corrosive.');
  if (id === 'hydrofluoric')
    out.push('Hydrofluoric acid burns may not hurt at first: have calcium gluconate gel at hand and get medical help after any contact.');
  out.push('The SDS and local rules decide.');
  return out;
}

export { WATER_20C };
