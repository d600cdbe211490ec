/**
 * The reagent units beyond mass, amount and molarity, and the amount each means in a batch:
 *   g/L, mg/L, µg/L, mg/mL        mass per final volume
 *   %w/v                           grams per 100 mL of final volume
 *   %v/v                           millilitres of the pure liquid per 100 mL of final volume (its density)
 *   ppm, ppb                       mg/L (µg/L) for a batch with a final volume, mg/kg (µg/kg) for one by
 *                                  total mass; `ppm w/v` and `ppm w/w` say which outright
 *   mol/kg, mmol/kg                molality: per kilogram of solvent
 *   N, mN, eq/L, meq/L             normality: equivalents per litre (./equivalents.ts says which role)
 *   mL, L, µL                      a liquid reagent by volume as supplied (./liquids.ts)
 * Spellings are read case-sensitively where case means something (`mM` is not `MM`), with ASCII `u` for µ.
 */
import type { FormulaAnalysis } from '../analyse';
import { equivalentsOf, type EquivalentRole } from './equivalents';
import { finding, type ReagentFinding } from './findings';
import { liquidOf, pour, reagentDensity, WATER_20C, type DensityReading } from './liquids';

export type ReagentUnitKind = 'massPerVolume' | 'weightPerVolumePercent' | 'volumePercent' | 'ppm' | 'molality' | 'normality' | 'volume';

export interface ReagentUnit {
  unit: string;
  kind: ReagentUnitKind;
  /** To the kind's base: g/L, % w/v, % v/v, ppm, mol/kg, eq/L, mL. */
  factor: number;
  aliases: readonly string[];
  /** For ppm: the basis the spelling states (`ppm w/w`), else undefined (from the batch). */
  basis?: 'w/v' | 'w/w';
}

export const REAGENT_UNITS: readonly ReagentUnit[] = [
  { unit: 'g/L', kind: 'massPerVolume', factor: 1, aliases: ['g/l', 'mg/mL', 'mg/ml'] },
  { unit: 'mg/L', kind: 'massPerVolume', factor: 1e-3, aliases: ['mg/l', 'µg/mL', 'ug/mL', 'ug/ml'] },
  { unit: 'µg/L', kind: 'massPerVolume', factor: 1e-6, aliases: ['ug/L', 'ug/l', 'µg/l'] },
  { unit: 'kg/L', kind: 'massPerVolume', factor: 1e3, aliases: ['kg/l'] },
  { unit: '%w/v', kind: 'weightPerVolumePercent', factor: 1, aliases: ['% w/v', 'w/v%', '%(w/v)', '% (w/v)'] },
  { unit: '%v/v', kind: 'volumePercent', factor: 1, aliases: ['% v/v', 'v/v%', '%(v/v)', '% (v/v)', 'vol%'] },
  { unit: 'ppm', kind: 'ppm', factor: 1, aliases: [] },
  { unit: 'ppb', kind: 'ppm', factor: 1e-3, aliases: [] },
  { unit: 'ppm w/v', kind: 'ppm', factor: 1, aliases: ['ppm(w/v)'], basis: 'w/v' },
  { unit: 'ppm w/w', kind: 'ppm', factor: 1, aliases: ['ppm(w/w)', 'ppmw'], basis: 'w/w' },
  { unit: 'mol/kg', kind: 'molality', factor: 1, aliases: ['molal'] },
  { unit: 'mmol/kg', kind: 'molality', factor: 1e-3, aliases: [] },
  { unit: 'N', kind: 'normality', factor: 1, aliases: ['eq/L', 'eq/l'] },
  { unit: 'mN', kind: 'normality', factor: 1e-3, aliases: ['meq/L', 'meq/l'] },
  { unit: 'L', kind: 'volume', factor: 1e3, aliases: ['l'] },
  { unit: 'mL', kind: 'volume', factor: 1, aliases: ['ml'] },
  { unit: 'µL', kind: 'volume', factor: 1e-3, aliases: ['uL', 'ul', 'µl'] },
];

const BY_SPELLING = new Map<string, ReagentUnit>();
for (const u of REAGENT_UNITS) for (const s of [u.unit, ...u.aliases]) BY_SPELLING.set(s, u);

/** The reagent unit written `text` (any of its spellings), or undefined. */
export function reagentUnit(text: string): ReagentUnit | undefined {
  return BY_SPELLING.get(text);
}

/** What a batch gives an amount per volume to work with. */
export interface BatchBasis {
  /** Final volume, L. */
  volumeL?: number | null;
  /** Total mass of the batch, g. */
  totalMassG?: number | null;
  /** Mass of solvent, g (molality); estimated from the final volume where absent. */
  solventMassG?: number | null;
  /** The batch is aqueous (ppm as mg/L needs it). Default true. */
  aqueous?: boolean;
}

export interface ReagentAmount {
  /** Amount of the substance, mol. */
  moles: number;
  /** Mass of the substance, g (what is weighed where it is weighed as is). */
  massG: number;
  /** Volume of the liquid to pour, mL, for `%v/v` and volume units. */
  volumeML?: number;
  density?: DensityReading;
  /** The reading in one line: `25 g/L × 0.5 L = 12.5 g`. */
  basis: string;
  findings: ReagentFinding[];
}

export interface AmountRequest {
  value: number;
  /** A unit of REAGENT_UNITS (any spelling). */
  unit: string;
  analysis: FormulaAnalysis;
  batch: BatchBasis;
  /** Normality: the role to count equivalents by. */
  role?: EquivalentRole;
  /** A liquid by volume: its assay (% by mass) and the label's density (g/mL). */
  assayPercent?: number;
  densityGPerML?: number;
}

const fmt = (x: number) => (Math.abs(x) >= 1000 || Math.abs(x) < 0.01 ? x.toPrecision(4) : String(Number(x.toPrecision(4))));

/** The amount a line in a reagent unit means in the batch; findings say what it rests on or lacks. */
export function amountIn(req: AmountRequest): ReagentAmount | { findings: ReagentFinding[] } {
  const u = reagentUnit(req.unit);
  const a = req.analysis;
  const fail = (kind: ReagentFinding['kind'], message: string) => ({ findings: [finding(kind, 'error', message)] });
  if (!u) return fail('basis-missing', `'${req.unit}' is not a reagent unit.`);
  if (!(req.value >= 0) || !Number.isFinite(req.value)) return fail('assay-range', `An amount must be a number of zero or more.`);
  const mm = a.molarMass?.value;
  if (!mm) return fail('basis-missing', `${a.display} has no molar mass: its amount cannot be computed.`);
  const V = req.batch.volumeL ?? undefined;
  const needVolume = () => fail('basis-missing', `${u.unit} needs the batch's final volume (\`volume: 1 L\` or \`water to 1 L\`).`);
  const byMass = (massG: number, basis: string, findings: ReagentFinding[] = []): ReagentAmount => ({ moles: massG / mm, massG, basis, findings });
  switch (u.kind) {
    case 'massPerVolume': {
      if (!V) return needVolume();
      const g = req.value * u.factor * V;
      return byMass(g, `${fmt(req.value)} ${u.unit} × ${fmt(V)} L = ${fmt(g)} g`);
    }
    case 'weightPerVolumePercent': {
      if (!V) return needVolume();
      const g = req.value * 10 * V;
      return byMass(g, `${fmt(req.value)} % w/v (g per 100 mL) × ${fmt(V * 1000)} mL = ${fmt(g)} g`);
    }
    case 'volumePercent': {
      if (!V) return needVolume();
      const match = liquidOf(a);
      const d = reagentDensity(a, match?.kind === 'aqueous' && !match.table.pureLiquid ? req.assayPercent : (req.assayPercent ?? 100), req.densityGPerML);
      if (!d.density) return { findings: d.findings };
      const mL = (req.value / 100) * V * 1000;
      const solution = mL * d.density.gPerML;
      const g = (solution * d.density.assayPercent) / 100;
      const findings = [
        ...d.findings,
        finding(
          'approximation',
          'information',
          `% v/v is the volume of the liquid before mixing per final volume; volumes do not add up on mixing (ethanol and water contract), so make up to the mark.`,
        ),
      ];
      return {
        moles: g / mm,
        massG: g,
        volumeML: mL,
        density: d.density,
        basis: `${fmt(req.value)} % v/v × ${fmt(V * 1000)} mL = ${fmt(mL)} mL × ${d.density.gPerML.toFixed(4)} g/mL`,
        findings,
      };
    }
    case 'ppm': {
      const T = req.batch.totalMassG ?? undefined;
      const basis = u.basis ?? (V ? 'w/v' : T ? 'w/w' : undefined);
      if (!basis) return fail('basis-missing', `${u.unit} needs the batch's final volume (read as mg/L) or its total mass (read as mg/kg).`);
      const findings: ReagentFinding[] = [];
      let g: number;
      if (basis === 'w/v') {
        if (!V) return needVolume();
        g = req.value * u.factor * 1e-3 * V;
        if (!u.basis)
          findings.push(
            finding(
              'ppm-basis',
              'information',
              `${u.unit} read as ${u.factor === 1 ? 'mg/L' : 'µg/L'} (by the final volume); write ppm w/w for ${u.factor === 1 ? 'mg/kg' : 'µg/kg'}.`,
            ),
          );
      } else {
        if (!T) return fail('basis-missing', `${u.basis ? u.unit : `${u.unit} w/w`} needs the batch's total mass (\`total: 1 kg\`).`);
        g = req.value * u.factor * 1e-6 * T;
      }
      // Where it matters: the two readings differ by the solution's density.
      const rho = V && T ? T / (V * 1000) : req.batch.aqueous === false ? undefined : 1;
      if (rho === undefined || Math.abs(rho - 1) > 0.01) {
        const other = basis === 'w/v' ? 'mg/kg' : 'mg/L';
        findings.push(
          finding(
            'ppm-basis',
            'warning',
            rho === undefined
              ? `${u.unit} in a batch that is not aqueous: mg/L and mg/kg differ by its density; say which (ppm w/v or ppm w/w).`
              : `The batch's density is ${rho.toFixed(3)} g/mL: as ${other} the amount would differ by ${Math.abs(rho - 1) * 100 >= 10 ? Math.round(Math.abs(rho - 1) * 100) : (Math.abs(rho - 1) * 100).toFixed(1)} %; say which (ppm w/v or ppm w/w).`,
          ),
        );
      }
      return byMass(
        g,
        basis === 'w/v'
          ? `${fmt(req.value)} ${u.unit} as mg/L × ${fmt(V as number)} L = ${fmt(g)} g`
          : `${fmt(req.value)} ${u.unit} as mg/kg × ${fmt((T as number) / 1000)} kg = ${fmt(g)} g`,
        findings,
      );
    }
    case 'molality': {
      const findings: ReagentFinding[] = [];
      let solventKg = req.batch.solventMassG ? req.batch.solventMassG / 1000 : undefined;
      if (solventKg === undefined) {
        if (!V) return fail('basis-missing', `${u.unit} needs the solvent's mass (\`solvent: 1 kg\`) or a final volume to estimate it from.`);
        solventKg = V * WATER_20C;
        findings.push(
          finding(
            'approximation',
            'information',
            `Molality per kilogram of solvent: the solvent is taken as the final volume of water (${WATER_20C} kg/L at 20 °C), which holds for a dilute batch; give the solvent's mass for the exact figure.`,
          ),
        );
      }
      const mol = req.value * u.factor * solventKg;
      return { moles: mol, massG: mol * mm, basis: `${fmt(req.value)} ${u.unit} × ${fmt(solventKg)} kg of solvent = ${fmt(mol)} mol`, findings };
    }
    case 'normality': {
      if (!V) return needVolume();
      const eq = equivalentsOf(a, req.role);
      if ('error' in eq) return fail('normality-role', eq.error);
      const mol = (req.value * u.factor * V) / eq.perMole;
      return {
        moles: mol,
        massG: mol * mm,
        basis: `${fmt(req.value)} ${u.unit} × ${fmt(V)} L ÷ ${eq.perMole} eq/mol = ${fmt(mol)} mol`,
        findings: [
          finding(
            'normality-role',
            'information',
            `Normality read with ${eq.basis}${req.role ? '' : '; write the role (acid, base, redox, ion) after N to count otherwise'}.`,
          ),
        ],
      };
    }
    case 'volume': {
      const mL = req.value * u.factor;
      const p = pour(a, mL, req.assayPercent, req.densityGPerML);
      if (!('moles' in p)) return p;
      return {
        moles: p.moles,
        massG: p.massG,
        volumeML: mL,
        density: p.density,
        basis: `${fmt(mL)} mL × ${p.density.gPerML.toFixed(4)} g/mL × ${p.density.assayPercent} %`,
        findings: p.findings,
      };
    }
  }
}
