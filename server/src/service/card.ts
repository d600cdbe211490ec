/**
 * The card of a formula: the contract's JSON object, and the same facts as text (CLI) and Markdown (hover,
 * "copy card").
 */
import type { FormulaAnalysis } from '../chem/analyse';
import { nameOf, namesOf } from '../chem/names';
import { toLsp, type LspDiagnostic } from './diagnostics';
import { LineIndex } from './positions';
import { energy, fixed, formulaText, percent, signed } from './format';
import type { GhsReading, SolutionEnthalpy } from '../chem/safety';
import { ghsFoot, ghsHead, ghsOf, ghsStatements, solutionEnthalpyOf, solutionEnthalpyText } from './safety';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';

export interface CardJson {
  input: string;
  /** The IUPAC 2005 name where the reading makes it plain (`copper(II) sulfate pentahydrate`); null otherwise. */
  name: string | null;
  /** The trade's names beside the systematic one, the usual first (`blue vitriol`); empty where there is none. */
  commonNames: string[];
  formula: string;
  formulaAscii: string;
  hill: string;
  charge: number;
  atoms: Record<string, number>;
  molarMass: number | null;
  molarMassUncertainty: number | null;
  composition: Array<{ element: string; count: number; massFraction: number }>;
  oxidationStates: Record<string, number> | null;
  /** Second round: states per site where the formula shows the sites (NH4NO3: N −3 in NH₄⁺, +5 in NO₃⁻). */
  oxidationStatesBySite: Array<{ element: string; state: number; count: number; site: string }>;
  /** Elements whose state the formula cannot determine (absent from both lists above), and why. */
  oxidationStatesUndetermined: Array<{ element: string; reason: string }>;
  /** Where the text is an alloy designation (`AlSi10Mg`): its nominal composition in mass percent. */
  alloyDesignation: { base: string; baseMassPercent: number; components: Array<{ element: string; massPercent: number | null; note?: string }> } | null;
  chargeBalance: { balanced: boolean; message: string; suggestions: string[] };
  bond: {
    pair: [string, string];
    deltaEN: number;
    type: string;
    percentIonic: number;
    note?: string;
    betweenIons?: { cation: string; anion: string; type: 'ionic' };
    pairWithin?: string;
    within?: Array<{ ion: string; pair: [string, string]; deltaEN: number; type: string; percentIonic: number }>;
  } | null;
  latticeEnergy: {
    kJPerMol: number;
    method: string;
    inputs: Record<string, unknown>;
    alternatives: Array<{ method: string; kJPerMol: number }>;
    estimate: boolean;
    typicalError: string;
    salt: string;
    meltingPointC: number | null;
    meltingPointSource: string | null;
  } | null;
  /** Why `latticeEnergy` is null, where the substance is molecular: `{reason, text, stateAt25C, …}`; null otherwise. */
  latticeEnergyNote: { reason: string; text: string; stateAt25C: string | null; meltingPointC: number | null; boilingPointC: number | null } | null;
  /**
   * The GHS classification where Ionwright's table has one (from memory: check the supplier's SDS):
   * `{substance, signalWord, statements: [{code, text}], pictograms: [{code, name}], basis, notes, fromMemory, sds}`; null otherwise.
   */
  ghs: GhsReading | null;
  /** The enthalpy of solution at infinite dilution where known: `{kJPerMol, basis, method, source, typicalErrorKJ?, why?}`; null otherwise. */
  enthalpyOfSolution: SolutionEnthalpy | null;
  diagnostics: LspDiagnostic[];
}

/** Round for output: enough digits for any check, none of the binary noise. */
export const round = (x: number, places = 6) => {
  const r = Number(x.toFixed(places));
  return Object.is(r, -0) ? 0 : r;
};

export function cardJson(a: FormulaAnalysis): CardJson {
  return {
    input: a.input,
    formula: a.display,
    formulaAscii: a.ascii,
    hill: a.hill,
    charge: a.charge,
    // A count written `x` has no number: that element is left out here, and a diagnostic says why.
    atoms: Object.fromEntries(Object.entries(a.atoms).filter(([, n]) => Number.isFinite(n))),
    molarMass: a.molarMass ? round(a.molarMass.value) : null,
    molarMassUncertainty: a.molarMass?.uncertainty == null ? null : round(a.molarMass.uncertainty, 6),
    composition: a.composition.map((c) => ({ element: c.element, count: c.count, massFraction: round(c.massFraction, 6) })),
    name: nameOf(a) ?? null,
    commonNames: namesOf(a).common,
    oxidationStates: a.charges?.oxidationStates ?? null,
    oxidationStatesBySite: (a.charges?.sites ?? []).map((x) => ({ element: x.element, state: round(x.state, 4), count: x.count, site: x.site })),
    oxidationStatesUndetermined: a.charges?.undetermined ?? [],
    alloyDesignation: a.charges?.designation ?? null,
    chargeBalance: a.charges
      ? { balanced: a.charges.balanced, message: a.charges.message, suggestions: a.charges.suggestions }
      : { balanced: false, message: 'The formula could not be read.', suggestions: [] },
    bond: a.bond
      ? {
          ...a.bond,
          deltaEN: round(a.bond.deltaEN, 3),
          percentIonic: round(a.bond.percentIonic, 1),
          ...(a.bond.within ? { within: a.bond.within.map((w) => ({ ...w, deltaEN: round(w.deltaEN, 3), percentIonic: round(w.percentIonic, 1) })) } : {}),
        }
      : null,
    latticeEnergy: a.lattice
      ? {
          kJPerMol: round(a.lattice.kJPerMol, 0),
          method: a.lattice.method,
          inputs: a.lattice.inputs,
          alternatives: a.lattice.alternatives.map((x) => ({ method: x.method, kJPerMol: round(x.kJPerMol, 0) })),
          estimate: a.lattice.estimate,
          typicalError: a.lattice.typicalError,
          salt: a.lattice.salt,
          meltingPointC: a.lattice.meltingPointC ?? null,
          meltingPointSource: a.lattice.meltingPointSource ?? null,
        }
      : null,
    latticeEnergyNote:
      !a.lattice && a.latticeWithheld
        ? {
            reason: a.latticeWithheld.reason,
            text: a.latticeWithheld.text,
            stateAt25C: a.latticeWithheld.stateAt25C ?? null,
            meltingPointC: a.latticeWithheld.meltingPointC ?? null,
            boilingPointC: a.latticeWithheld.boilingPointC ?? null,
          }
        : null,
    ghs: ghsJson(a),
    enthalpyOfSolution: solutionEnthalpyJson(a),
    diagnostics: (() => {
      const lines = new LineIndex(a.input);
      return a.diagnostics.map((d) => toLsp(lines, d));
    })(),
  };
}

function ghsJson(a: FormulaAnalysis): GhsReading | null {
  const g = ghsOf(a);
  if (!g) return null;
  const { substance, signalWord, statements, pictograms, basis, notes, fromMemory, sds } = g;
  return {
    substance,
    signalWord,
    statements: statements.map((x) => ({ ...x })),
    pictograms: pictograms.map((x) => ({ ...x })),
    basis,
    notes: [...notes],
    fromMemory,
    sds,
  };
}

function solutionEnthalpyJson(a: FormulaAnalysis): SolutionEnthalpy | null {
  const e = solutionEnthalpyOf(a);
  if (!e) return null;
  return {
    kJPerMol: round(e.kJPerMol, 3),
    basis: e.basis,
    method: e.method,
    source: e.source,
    ...(e.typicalErrorKJ !== undefined ? { typicalErrorKJ: round(e.typicalErrorKJ, 2) } : {}),
    ...(e.why ? { why: e.why } : {}),
  };
}

/**
 * The oxidation states in one line: each element at its state, and an element at two or more states
 * (NH₄NO₃'s N, Fe₃O₄'s Fe) by site instead of by its average: "H +1, N −3 in NH₄⁺ and +5 in NO₃⁻, O −2".
 */
export function statesText(a: FormulaAnalysis): string | undefined {
  const states = a.charges?.oxidationStates;
  if (!states || Object.keys(states).length === 0) return undefined;
  const sites = a.charges?.sites ?? [];
  return Object.entries(states)
    .map(([el, v]) => {
      const own = sites.filter((x) => x.element === el);
      const distinct = new Set(own.map((x) => Math.round(x.state * 1e4)));
      if (distinct.size < 2) return `${el} ${signed(v)}`;
      return `${el} ${own.map((x) => `${signed(x.state)} in ${x.count === 1 ? '' : `${x.count} `}${x.site}`).join(' and ')}`;
    })
    .join(', ');
}

/** Why an element has no state, in one line each. */
export function undeterminedText(a: FormulaAnalysis): string[] {
  return (a.charges?.undetermined ?? []).map((u) => u.reason);
}

/** An alloy designation's nominal composition: "Si 10 %, Mg minor, Al balance (≈ 90 %)". */
export function designationText(a: FormulaAnalysis): string | undefined {
  const d = a.charges?.designation;
  if (!d) return undefined;
  const minor = d.components.some((c) => c.massPercent === null);
  return `${d.components.map((c) => `${c.element} ${c.massPercent === null ? 'minor (< 1 %)' : `${c.massPercent} %`}`).join(', ')}, ${d.base} balance (${minor ? '≈ ' : ''}${d.baseMassPercent} %) — mass percent, nominal`;
}

/** The card as plain text, for the terminal. */
export function cardText(a: FormulaAnalysis, settings: ServiceSettings = DEFAULT_SETTINGS): string {
  const out: string[] = [];
  if (a.ok && !a.molarMass) {
    out.push(`${a.display}   (Hill: ${a.hill})`);
    out.push('  molar mass      not computed: a count is not a number');
    if (a.charges) out.push(`  charge balance  ${a.charges.message}`);
    for (const r of undeterminedText(a)) out.push(`  oxidation       ${r}`);
    for (const d of a.diagnostics) out.push(`  ${d.severity} [${d.code}]: ${d.message}`);
    return out.join('\n');
  }
  if (!a.ok || !a.molarMass) {
    out.push(`${a.input}: not a readable formula`);
    for (const d of a.diagnostics) out.push(`  ${d.severity} [${d.code}] col ${d.start + 1}-${d.end}: ${d.message}`);
    return out.join('\n');
  }
  const designation = designationText(a);
  if (designation) {
    // A designation names a composition in mass percent, not a formula: no molar mass, Hill formula or states.
    out.push(`${a.input}   (alloy designation)`);
    out.push(`  alloy           ${designation}`);
    if (a.charges) out.push(`  charge balance  ${a.charges.message}`);
    return out.join('\n');
  }
  const mm = a.molarMass;
  out.push(`${a.display}   (Hill: ${a.hill}${a.charge ? `, charge ${signed(a.charge)}` : ''})`);
  out.push(
    `  molar mass      ${fixed(mm.value, settings.decimals + 1)}${mm.uncertainty !== null ? ` ± ${mm.uncertainty.toPrecision(1)}` : ' (nominal)'} g/mol`,
  );
  out.push(`  composition     ${a.composition.map((c) => `${c.element} ${percent(c.massFraction, 2)}`).join(', ')}`);
  if (a.charges) {
    out.push(`  oxidation       ${statesText(a) ?? 'not assigned'}`);
    for (const r of undeterminedText(a)) out.push(`                  ${r}`);
    out.push(
      `  charge balance  ${a.charges.balanced ? '' : 'NOT BALANCED: '}${a.charges.message}${a.charges.suggestions.length ? ` Try: ${a.charges.suggestions.map((x) => `${formulaText(x)}${formulaText(x) === x ? '' : ` (${x})`}`).join(', ')}` : ''}`,
    );
  }
  if (a.bond) {
    const between = a.bond.betweenIons && a.bond.pairWithin ? `ionic between ${a.bond.betweenIons.cation} and ${a.bond.betweenIons.anion}; ` : '';
    out.push(
      `  bonding         ${between}${a.bond.type} (ΔEN ${a.bond.pair.join('–')} = ${a.bond.deltaEN.toFixed(2)}, ${a.bond.percentIonic.toFixed(0)} % ionic)`,
    );
  }
  if (a.lattice) {
    const L = a.lattice;
    out.push(
      `  lattice energy  ${L.estimate ? '≈ ' : ''}${energy(L.kJPerMol, settings)} — ${L.method}${a.formula && a.formula.parts.length > 1 ? ` (for ${formulaText(L.salt)})` : ''}; ${L.typicalError}`,
    );
    for (const alt of L.alternatives) out.push(`                  ${alt.method}: ${energy(alt.kJPerMol, settings)}`);
    if (L.meltingPointC !== undefined) out.push(`  melting point   ${L.meltingPointC} °C (${L.meltingPointSource})`);
  } else if (a.latticeWithheld)
    out.push(`  lattice energy  none — ${a.latticeWithheld.text.replace(/^No lattice energy(?: \(([^)]*)\))?: /, (_, x) => (x ? `${x}: ` : ''))}`);
  const g = ghsOf(a);
  if (g) {
    out.push(`  GHS             ${ghsHead(g)}`);
    for (const x of ghsStatements(g)) out.push(`                  ${x}`);
    out.push(`                  ${ghsFoot(g)}`);
  }
  const e = solutionEnthalpyOf(a);
  if (e) {
    out.push(`  ΔsolH           ${solutionEnthalpyText(e)}`);
    if (e.why) out.push(`                  ${e.why}`);
  }
  for (const d of a.diagnostics) out.push(`  ${d.severity} [${d.code}]: ${d.message}`);
  return out.join('\n');
}
