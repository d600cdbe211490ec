/**
 * Bench of the names and reagent functions against formula reading: a 10,000-line batch sheet whose
 * ingredients are written as names and liquids by volume, against the same sheet written as formulas.
 * The figure is the ratio of the two (target ≤ 1.5), cold (caches emptied) and warm, with the cost per
 * call of each function. Run alone:
 *   npx esbuild bench/names-reagents.ts --bundle --platform=node --outfile=dist/bench-names.js && node dist/bench-names.js
 * or call `namesReagentsCase()` from bench/run.ts.
 */
import { analyseFormula, clearFormulaCache } from '../server/src/chem/analyse';
import { analyseBatch } from '../server/src/chem/batch';
import { clearNameCache, nameAtStart, nameOf, namesByPrefix, readName } from '../server/src/chem/names';
import { pour, reagentDensity } from '../server/src/chem/reagents';

const now = () => Number(process.hrtime.bigint()) / 1e6;

/** Substances of an invented plating and cleaning lab, by formula. */
const SOLIDS = [
  'NaCl',
  'KCl',
  'NiSO4·6H2O',
  'NiCl2·6H2O',
  'CuSO4·5H2O',
  'ZnSO4·7H2O',
  'MgSO4·7H2O',
  'Na2SO4',
  'Na2CO3',
  'NaHCO3',
  'Na3PO4',
  'Na2HPO4·12H2O',
  'KH2PO4',
  'Na2B4O7·10H2O',
  'H3BO3',
  'Na2S2O3·5H2O',
  'FeSO4·7H2O',
  'FeCl3',
  'CoSO4·7H2O',
  'KNO3',
  'NH4Cl',
  '(NH4)2SO4',
  'CaCl2·2H2O',
  'Al2(SO4)3·18H2O',
  'K3[Fe(CN)6]',
  'KMnO4',
  'K2Cr2O7',
  'NaOH',
  'KOH',
  'Ca(OH)2',
  'NaClO',
  'Na2S2O5',
  'SnCl2·2H2O',
  'AgNO3',
  'Pb(NO3)2',
];
const LIQUIDS: Array<[string, number | undefined]> = [
  ['H2SO4', 96],
  ['HCl', 37],
  ['HNO3', 70],
  ['H3PO4', 85],
  ['CH3COOH', undefined],
  ['NH3', 28],
  ['H2O2', 30],
  ['NaOH', 50],
  ['C2H5OH', undefined],
  ['C3H5(OH)3', undefined],
];

function sheets(n: number) {
  const formulaLines: string[] = [];
  const nameLines: string[] = [];
  for (let i = 0; i < n; i++) {
    const mass = (1 + ((i * 37) % 500) / 10).toFixed(1);
    if (i % 4 === 3) {
      const [f, assay] = LIQUIDS[i % LIQUIDS.length];
      const line = `${f} ${mass} mL${assay ? ` @ ${assay}%` : ''}`;
      formulaLines.push(`${f} ${mass} g`);
      nameLines.push(line);
    } else {
      const f = SOLIDS[i % SOLIDS.length];
      formulaLines.push(`${f} ${mass} g`);
      const name = nameOf(analyseFormula(f)) ?? f;
      nameLines.push(`${name} ${mass} g`);
    }
  }
  return { formulaLines, nameLines };
}

/** The formula sheet: the first token of each line analysed. */
function readFormulas(lines: string[]) {
  let k = 0;
  for (const l of lines) k += analyseFormula(l.slice(0, l.indexOf(' '))).atoms ? 1 : 0;
  return k;
}

/** The name sheet: a name or a formula, then the liquid's density and amount for a volume line. */
function readNamesAndLiquids(lines: string[]) {
  let k = 0;
  for (const l of lines) {
    const first = l.slice(0, l.indexOf(' '));
    const m = / (\d+(?:\.\d+)?) mL(?: @ (\d+)%)?$/.exec(l);
    if (m) {
      const p = pour(analyseFormula(first), Number(m[1]), m[2] ? Number(m[2]) : undefined);
      k += 'moles' in p ? 1 : 0;
      continue;
    }
    const r = nameAtStart(l);
    if (r.status === 'exact') k += analyseFormula(r.formula as string).atoms ? 1 : 0;
    else k += analyseFormula(first).atoms ? 1 : 0;
  }
  return k;
}

function best(fn: () => void, reps: number, before?: () => void) {
  let min = Infinity;
  for (let i = 0; i < reps; i++) {
    before?.();
    const t = now();
    fn();
    min = Math.min(min, now() - t);
  }
  return min;
}

export function namesReagentsCase(quick = false) {
  const n = quick ? 2000 : 10_000;
  const reps = quick ? 3 : 7;
  const { formulaLines, nameLines } = sheets(n);
  const cold = () => {
    clearFormulaCache();
    clearNameCache();
  };
  const formulasCold = best(() => readFormulas(formulaLines), reps, cold);
  const namesCold = best(() => readNamesAndLiquids(nameLines), reps, cold);
  readFormulas(formulaLines);
  readNamesAndLiquids(nameLines);
  const formulasWarm = best(() => readFormulas(formulaLines), reps);
  const namesWarm = best(() => readNamesAndLiquids(nameLines), reps);
  // The whole batch reading of the formula sheet (read, amounts, mix, checks), the baseline the names
  // and liquids add to once the reader calls them.
  const batchLines = ['volume: 1000 L', ...formulaLines].map((text, i) => ({ text, start: i * 40 }));
  const batchCold = best(() => analyseBatch(batchLines), reps, cold);
  analyseBatch(batchLines);
  const batchWarm = best(() => analyseBatch(batchLines), reps);
  // Through the batch reader as wired: the sheet as 10-line batches (a final volume each), read by names
  // and liquids against the same batches read by formulas, cold and warm.
  const asBatches = (lines: string[]) => {
    const out: Array<Array<{ text: string; start: number }>> = [];
    for (let i = 0; i < lines.length; i += 10) out.push(['volume: 20 L', ...lines.slice(i, i + 10)].map((text, k) => ({ text, start: k * 60 })));
    return out;
  };
  const formulaBatches = asBatches(formulaLines);
  const nameBatches = asBatches(nameLines);
  // The equilibrium is read lazily and is the same for both: only the reading and the amounts are timed.
  const readAll = (bs: typeof formulaBatches) => {
    let k = 0;
    for (const b of bs) k += analyseBatch(b).ingredients.length;
    return k;
  };
  const sheetFormulasCold = best(() => readAll(formulaBatches), reps, cold);
  const sheetNamesCold = best(() => readAll(nameBatches), reps, cold);
  readAll(formulaBatches);
  readAll(nameBatches);
  const sheetFormulasWarm = best(() => readAll(formulaBatches), reps);
  const sheetNamesWarm = best(() => readAll(nameBatches), reps);
  const counted = { formulas: readAll(formulaBatches), names: readAll(nameBatches) };
  // Per call, warm and cold.
  const calls = 20_000;
  const names = SOLIDS.map((f) => nameOf(analyseFormula(f)) as string);
  const perCall = (fn: (i: number) => void) => {
    const t = now();
    for (let i = 0; i < calls; i++) fn(i);
    return ((now() - t) / calls) * 1000;
  };
  const readNameWarm = perCall((i) => readName(names[i % names.length]));
  const coldNames = Array.from({ length: 2000 }, (_, i) => `${names[i % names.length]}`.replace(/ /, ' '.repeat(1 + (i % 7))));
  clearNameCache();
  const t0 = now();
  for (const nm of coldNames) readName(nm);
  const readNameCold = ((now() - t0) / coldNames.length) * 1000;
  // First readings of distinct names (nothing cached): the systematic names of the usual salts.
  const distinct = namesByPrefix('', 100_000)
    .filter((e) => e.kind === 'systematic')
    .slice(0, 2000)
    .map((e) => e.name);
  clearNameCache();
  const t1 = now();
  for (const nm of distinct) readName(nm);
  const readNameFirst = ((now() - t1) / distinct.length) * 1000;
  const h2so4 = analyseFormula('H2SO4');
  const densityCall = perCall((i) => reagentDensity(h2so4, 50 + (i % 48)));
  const prefixCall = perCall((i) => namesByPrefix(names[i % names.length].slice(0, 5), 10));
  const nearCall = ((): number => {
    const t = now();
    for (let i = 0; i < 200; i++) readName(`sodium chlor${'abcdefghij'[i % 10]}de ${i}`);
    return ((now() - t) / 200) * 1000;
  })();
  return {
    lines: n,
    formulasColdMs: formulasCold,
    namesColdMs: namesCold,
    ratioCold: namesCold / formulasCold,
    formulasWarmMs: formulasWarm,
    namesWarmMs: namesWarm,
    ratioWarm: namesWarm / formulasWarm,
    batchColdMs: batchCold,
    batchWarmMs: batchWarm,
    /** The batch reading with the names and liquids read on top, over the batch reading alone. */
    ratioBatchCold: (batchCold + namesCold - formulasCold) / batchCold,
    ratioBatchWarm: (batchWarm + namesWarm - formulasWarm) / batchWarm,
    /** The sheet through the batch reader: by names and liquids over by formulas (target ≤ 1.5). */
    sheet: {
      batches: formulaBatches.length,
      counted,
      formulasColdMs: sheetFormulasCold,
      namesColdMs: sheetNamesCold,
      ratioCold: sheetNamesCold / sheetFormulasCold,
      formulasWarmMs: sheetFormulasWarm,
      namesWarmMs: sheetNamesWarm,
      ratioWarm: sheetNamesWarm / sheetFormulasWarm,
    },
    perCallMicroseconds: {
      readNameWarm,
      readNameRespaced: readNameCold,
      readNameFirst,
      reagentDensity: densityCall,
      namesByPrefix: prefixCall,
      nearName: nearCall,
    },
  };
}

if (process.argv[1]?.endsWith('bench-names.js')) console.log(JSON.stringify(namesReagentsCase(process.argv.includes('--quick')), null, 2));
