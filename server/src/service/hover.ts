/**
 * Hover cards in Markdown: the headline numbers first, then the method, inputs and sources.
 */
import { analyseFormula, type FormulaAnalysis } from '../chem/analyse';
import type { ShelfEntry } from '../chem/reagents';
import type { BatchAnalysis, Ingredient, SkippedLine } from '../chem/batch';
import { CAUTION_FOOTNOTE, cautionsFor, type Caution } from '../chem/cautions';
import { element, isMetal } from '../chem/data/elements';
import type { ReactionAnalysis } from '../chem/equation';
import { nameOf, namesOf } from '../chem/names';
import type { Hazard } from '../chem/safety';
import { designationText, statesText, undeterminedText } from './card';
import { COMPACT_BATCH, batchColumns, countedRows, markdownTable, pick } from './columns';
import type { AnalysedDocument } from './document';
import { chargeWords, energy, formulaText, massText, mlText, molarMassText, oxidationText, percent, perLitreText, sig, signed, volumeText } from './format';
import { targetAt } from './lookup';
import { titreMarkdown, titreSpan, upkeepMarkdown } from './upkeep';
import type { Range } from './positions';
import type { ServiceSettings } from './settings';
import { ghsFoot, ghsHead, ghsOf, ghsStatements, solutionEnthalpyOf, solutionEnthalpyText } from './safety';
import {
  hasSafety,
  hazardIngredients,
  hazardKindText,
  hazardsOf,
  hazardText,
  heatAdvice,
  heatSummary,
  NO_HEAT,
  SAFETY_NOTICE,
  stepKindText,
  stepKJText,
} from './safety';
import { capacityText, concText, limitsLine, majorSpecies, nearSaturation, pHLine, precipitateText, siText, solvedText } from './solution';
import { amountText, batchWarnings, codeSpan, countsText, escapeMarkdown, fractionText, notCountedText, weighedMass } from './tables';

export interface HoverResult {
  markdown: string;
  range: Range;
}

/** Markdown escaping of text that may quote the notes (the tables' escaper). */
const esc = escapeMarkdown;

/**
 * The cautions of a hover, once, with the one disclaimer at the end (a hover never repeats it per substance).
 */
function cautionBlock(cautions: readonly Caution[]): string[] {
  const texts = [...new Set(cautions.map((c) => c.text))];
  if (texts.length === 0) return [];
  return [texts.length === 1 ? `⚠ ${esc(texts[0])}.` : texts.map((t) => `⚠ ${esc(t)}`).join('  \n'), '', `_${CAUTION_FOOTNOTE}_`, ''];
}

function latticeLine(a: FormulaAnalysis, s: ServiceSettings): string | undefined {
  const L = a.lattice;
  if (!L) return undefined;
  const forSalt = a.formula && a.formula.parts.length > 1 ? ` for ${formulaText(L.salt)}` : '';
  return `Lattice energy ${L.estimate ? '≈ ' : ''}**${energy(L.kJPerMol, s)}**${forSalt} — ${L.method}${L.estimate ? ' (estimate)' : ''}${L.meltingPointC !== undefined ? ` · mp ${L.meltingPointC} °C` : ''}`;
}

/** The inputs a lattice method records (each method records the ones it used). */
interface LatticeInputView {
  charges?: { cation: number; anion: number };
  radii?: { cation: number; anion: number };
  r0?: number;
  nu?: number;
  madelung?: number;
  structure?: string;
  bornExponent?: number;
  formationEnthalpy?: number;
  ionisationEnergies?: number[];
  electronAffinity?: number;
  radiusSources?: { cation: string; anion: string };
  source?: string;
}

function latticeInputs(a: FormulaAnalysis, s: ServiceSettings): string[] {
  const L = a.lattice;
  if (!L) return [];
  const i = L.inputs as LatticeInputView;
  const bits: string[] = [];
  if (i.charges) bits.push(`z₊ ${signed(i.charges.cation)}, z₋ ${signed(i.charges.anion)}`);
  if (i.radii) bits.push(`r₊ ${i.radii.cation} Å, r₋ ${i.radii.anion} Å`);
  if (i.r0) bits.push(`r₀ ${i.r0} Å`);
  if (i.nu) bits.push(`ν ${i.nu}`);
  if (i.madelung) bits.push(`M ${i.madelung} (${i.structure})`);
  if (i.bornExponent) bits.push(`n ${i.bornExponent}`);
  if (i.formationEnthalpy !== undefined)
    bits.push(`ΔfH° ${signed(i.formationEnthalpy)} kJ/mol, IE ${(i.ionisationEnergies ?? []).join(' + ')}, EA ${i.electronAffinity}`);
  const out = [`Inputs: ${bits.join(' · ')}`];
  if (i.radiusSources) out.push(`Radii: ${i.radiusSources.cation}; ${i.radiusSources.anion}`);
  if (i.source) out.push(`Data: ${i.source}`);
  if (L.alternatives.length) out.push(`Also: ${L.alternatives.map((x) => `${x.method.replace(' equation', '')} ${energy(x.kJPerMol, s)}`).join(' · ')}`);
  out.push(`Typical error: ${L.typicalError}`);
  if (L.meltingPointC !== undefined) out.push(`Melting point: ${L.meltingPointSource}`);
  return out;
}

/** The card's GHS classification (statements, pictograms, the note to check the SDS) and enthalpy of solution with why, where known. */
function cardSafety(a: FormulaAnalysis): string[] {
  const out: string[] = [];
  const g = ghsOf(a);
  if (g) {
    out.push(`GHS: **${esc(ghsHead(g))}**`, '', ghsStatements(g).map(esc).join('  \n'), '', `_${esc(ghsFoot(g))}_`, '');
  }
  const e = solutionEnthalpyOf(a);
  if (e) {
    out.push(`Enthalpy of solution ${esc(solutionEnthalpyText(e))}`, '');
    if (e.why) out.push(`_${esc(e.why)}_`, '');
  }
  return out;
}

/** Suggestions for a formula that does not balance, in Unicode: `Ca(NO₃)₂`. */
const tryText = (suggestions: readonly string[]) => (suggestions.length ? ` Try ${suggestions.map((x) => `**${esc(formulaText(x))}**`).join(', ')}.` : '');

/**
 * The card of a formula as Markdown (hover and "copy card"): who it is (formula, name where known, molar
 * mass) and whether its charges balance first, then its composition, bonding and lattice energy in one
 * line each, the cautions; the details (oxidation states by site, uncertainty, inputs) below the rule.
 */
export function formulaCardMarkdown(a: FormulaAnalysis, s: ServiceSettings): string {
  if (a.ok && !a.molarMass) {
    const lines = [`**${esc(a.display)}** · molar mass not computed: a count is not a number`, ''];
    if (a.charges) lines.push(esc(a.charges.message), '');
    for (const r of undeterminedText(a)) lines.push(esc(r), '');
    lines.push(...a.diagnostics.map((d) => `- ${esc(d.message)}`));
    return lines.join('\n');
  }
  if (!a.ok || !a.molarMass) {
    return [`**${esc(a.input)}** — not a readable formula`, '', ...a.diagnostics.map((d) => `- ${esc(d.message)}`)].join('\n');
  }
  const designation = designationText(a);
  if (designation) {
    return [
      `**${esc(a.input)}** · alloy designation`,
      '',
      `Nominal composition: **${esc(designation)}**`,
      '',
      '---',
      '',
      esc('The numbers of a designation are mass percent, the base metal the balance; it is not a chemical formula, so no charge balance applies.'),
    ].join('\n');
  }
  const mm = a.molarMass;
  const name = nameOf(a);
  const common = namesOf(a).common;
  const head = `**${esc(a.display)}**${name ? ` · ${esc(name)}` : ''}${common.length ? ` (${esc(common.join(', '))})` : ''} · **${molarMassText(mm.value, s)} g/mol**${a.charge ? ` · ${chargeWords(a.charge)}` : ''}`;
  const lines = [head, ''];
  const c = a.charges;
  if (c) {
    if (!c.balanced) lines.push(`⚠ **Not charge-balanced:** ${esc(c.message)}${tryText(c.suggestions)}`, '');
    else if (c.message) lines.push(`${c.basis === 'ionic' ? '✓ ' : ''}${esc(c.message)}`, '');
    if (c.oxidationStates && Object.keys(c.oxidationStates).length)
      lines.push(`Oxidation states: ${esc(statesText(a) ?? oxidationText(c.oxidationStates))}`, '');
  }
  lines.push(`Composition: ${a.composition.map((x) => `${x.element} ${percent(x.massFraction, 2)}`).join(', ')}`, '');
  if (a.bond) {
    const between = a.bond.betweenIons && a.bond.pairWithin ? `**ionic** between ${esc(a.bond.betweenIons.cation)} and ${esc(a.bond.betweenIons.anion)}; ` : '';
    lines.push(
      `Bonding: ${between}**${a.bond.type}** — ΔEN ${a.bond.pair.join('–')} ${a.bond.deltaEN.toFixed(2)}, ${a.bond.percentIonic.toFixed(0)} % ionic`,
      '',
    );
  }
  const lat = latticeLine(a, s);
  if (lat) lines.push(lat, '');
  else if (a.latticeWithheld) lines.push(esc(a.latticeWithheld.text), '');
  lines.push(...cardSafety(a));
  lines.push(...cautionBlock(cautionsFor(a)));
  lines.push('---', '');
  const detail: string[] = [];
  for (const r of undeterminedText(a)) detail.push(`No state given for ${r}`);
  detail.push(
    `Hill ${a.hill} · ± ${mm.uncertainty === null ? '— (no standard atomic weight for ' + mm.nominal.join(', ') + ')' : mm.uncertainty.toPrecision(1)} g/mol (CIAAW 2021 weights)`,
  );
  if (a.bond?.note) detail.push(a.bond.note);
  detail.push(...latticeInputs(a, s));
  lines.push(detail.map((d) => esc(d)).join('  \n'));
  return lines.join('\n');
}

/**
 * Grams per litre of the substance and of each metal in it, where the batch has a final volume: what a
 * plating or etching line is specified in. From the moles (assay taken out), so the figures are of the
 * pure substance. Undefined without a volume.
 */
export function perLitre(i: Ingredient, volumeL: number | null): { salt: number; metals: Array<{ element: string; gPerL: number }> } | undefined {
  if (volumeL === null || !(volumeL > 0) || i.moles === null) return undefined;
  const metals = Object.entries(i.analysis.atoms)
    .filter(([el, n]) => isMetal(el) && Number.isFinite(n) && n > 0)
    .map(([el, n]) => ({ element: el, gPerL: ((i.moles as number) * n * (element(el)?.mass ?? 0)) / volumeL }))
    // In the order the formula names them (KAl(SO4)2: K, then Al).
    .map((m) => ({ m, at: i.analysis.ascii.search(new RegExp(`${m.element}(?![a-z])`)) }))
    .sort((x, y) => x.at - y.at)
    .map((x) => x.m);
  return { salt: (i.moles * i.molarMass) / volumeL, metals };
}

/** A buffer line's hover: both forms to weigh, then the design. */
function bufferMarkdown(i: Ingredient, b: BatchAnalysis, s: ServiceSettings): string {
  const design = (i.buffer as NonNullable<Ingredient['buffer']>).design;
  const forms = b.ingredients.filter((x) => x.buffer?.design === design);
  const lines = [`**${esc(design.system)} buffer** · ${sig(design.totalM, 3)} M to pH ${design.pH.toFixed(2)}`, ''];
  for (const f of forms)
    lines.push(
      `${f.buffer?.role === 'acid' ? 'Acid form' : 'Base form'} **${esc(f.formula)}**: weigh **${massText(f.massG)}** · ${sig(f.moles)} mol · ${molarMassText(f.molarMass, s)} g/mol`,
      '',
    );
  const solved = solvedText(i);
  if (solved) lines.push(esc(solved), '');
  if (b.solution) lines.push(`_${esc(limitsLine(b.solution))}_`, '');
  const cautions = forms.flatMap((f) => f.cautions);
  if (cautions.length) lines.push(...cautionBlock(cautions));
  return lines.join('\n').trimEnd();
}

function ingredientMarkdown(i: Ingredient, b: BatchAnalysis, s: ServiceSettings): string {
  if (i.buffer) return bufferMarkdown(i, b, s);
  const name = i.name ?? nameOf(i.analysis);
  const common = namesOf(i.analysis).common.filter((c) => c !== name);
  const label = i.shelf ? `shelf: ${i.shelf.label} · ` : '';
  const lines = [
    `${esc(label)}**${esc(i.formula)}**${name ? ` · ${esc(name)}` : ''}${common.length ? ` (${esc(common.join(', '))})` : ''} · ${esc(amountText(i))}`,
    '',
  ];
  const bits =
    i.measure === 'pour' && i.volumeML !== null
      ? [`pour **${esc(mlText(i.volumeML))}**${i.assay < 1 ? ` of the ${sig(i.assay * 100)} % reagent` : ''} (${massText(i.massG)})`, `${sig(i.moles)} mol`]
      : i.measure === 'stock' && i.volumeML !== null
        ? [`take **${esc(mlText(i.volumeML))}** of the stock (${esc(i.stock ?? '')})`, `${sig(i.moles)} mol`]
        : [`weigh **${massText(i.massG)}**`, `${sig(i.moles)} mol`];
  if (i.concentrationM !== null) bits.push(`**${sig(i.concentrationM)} M** in ${volumeText(b.volumeL as number)}`);
  if (i.massFraction !== null) bits.push(`${fractionText(i.massFraction)} of the weighed mass`);
  if (i.fractionOfTotal !== null && b.totalMassG !== null) bits.push(`${fractionText(i.fractionOfTotal)} of the total ${sig(b.totalMassG)} g`);
  lines.push(bits.join(' · '), '');
  const solved = solvedText(i);
  if (solved) lines.push(esc(solved), '');
  if (i.basis) lines.push(`Worked out: ${esc(i.basis)}`, '');
  if (i.density) lines.push(`Density used: ${esc(i.density)}; the label's value wins where it differs.`, '');
  if (i.shelf)
    lines.push(
      `Shelf entry **${esc(i.shelf.label)}**: ${esc(i.shelf.substance)}${i.shelf.assayPercent !== undefined ? ` · assay ${sig(i.shelf.assayPercent)} %` : ''}${i.shelf.densityGPerML !== undefined ? ` · density ${sig(i.shelf.densityGPerML)} g/mL` : ''}${i.shelf.lot ? ` · lot ${esc(i.shelf.lot)}` : ''}${i.shelf.supplier ? ` · ${esc(i.shelf.supplier)}` : ''}`,
      '',
    );
  for (const note of i.notes) lines.push(`_${esc(note)}_`, '');
  const pl = perLitre(i, b.volumeL);
  if (pl) {
    // The metal only where it says something the salt does not (not for a metal weighed as the element).
    const metals = pl.metals.filter((m) => Object.keys(i.analysis.atoms).length > 1 && m.gPerL > 0);
    lines.push(`**${perLitreText(pl.salt)}** ${esc(i.formula)}${metals.map((m) => ` · **${perLitreText(m.gPerL)}** ${m.element}`).join('')}`, '');
  }
  lines.push(
    i.ions.length
      ? `Dissociates to ${i.ions.map((x) => `${x.count === 1 ? '' : x.count + ' '}${x.ion}`).join(' + ')}`
      : `Not split into ions (${i.undissociated ?? 'undissociated'})`,
    '',
  );
  const inModel = b.solution?.ingredients[b.ingredients.indexOf(i)];
  if (inModel) lines.push(inModel.leftOut ? `Not in the equilibrium: ${esc(inModel.leftOut)}` : `In the equilibrium as ${esc(inModel.as)}`, '');
  lines.push(
    `Molar mass ${molarMassText(i.molarMass, s)} g/mol${i.analysis.formula && i.analysis.formula.parts.length > 1 ? ' (hydrate water included)' : ''}`,
  );
  const sol = i.solubility;
  if (sol) {
    const here = sol.per100gWater === null ? 'no water left by the estimate' : `about ${sig(sol.per100gWater, 3)} g per 100 g water here (estimate)`;
    lines.push(
      '',
      `${sol.exceeds ? '⚠ ' : ''}Solubility of ${esc(sol.salt)} in water: ${sig(sol.row.gPer100gWater, 3)} g per 100 g water at ${sol.row.temperatureC} °C — ${esc(sol.row.source)}; ${here}.`,
    );
  }
  if (b.skipped.length)
    lines.push(
      '',
      `_The batch is incomplete: ${notCountedText(b)} (hover the batch's opening line for the list); shares and totals are of the counted lines._`,
    );
  if (i.handling.length) lines.push('', ...i.handling.map((h) => `⚠ ${esc(h)}`));
  lines.push(...ingredientSafety(i, b));
  if (i.cautions.length) lines.push('', ...cautionBlock(i.cautions));
  return lines.join('\n').trimEnd();
}

/** A line of a batch that is not counted: what it says, why, the pairs it is still in, and the cautions of its formula. */
function skippedMarkdown(l: SkippedLine, b: BatchAnalysis, s: ServiceSettings): string {
  const a = l.analysis;
  const lines = [`${codeSpan(l.text)} — **not counted**`, '', esc(l.reason), ''];
  if (a?.molarMass) lines.push(`${esc(a.display)}: molar mass ${molarMassText(a.molarMass.value, s)} g/mol`, '');
  lines.push("_Nothing on this line is in the batch's figures until it is fixed._", '');
  const hazards = b.hazards.filter((h) => h.lines.includes(l.lineStart));
  if (hazards.length) lines.push(hazards.map(hazardLine).join('  \n'), '', `_${esc(SAFETY_NOTICE)}_`, '');
  lines.push(...cautionBlock(l.cautions));
  return lines.join('\n').trimEnd();
}

/**
 * The equilibrium of a batch for its hover: the pH first, then the major species, the buffer capacity and
 * the ionic strength of the equilibrium, the solids near or over saturation, and the model's limits in one
 * line.
 */
function solutionMarkdown(b: BatchAnalysis): string[] {
  const s = b.solution;
  if (!s) return b.volumeL !== null && b.noSolution ? [`_No equilibrium: ${esc(b.noSolution)}._`, ''] : [];
  if (!s.converged) return [`⚠ The equilibrium did not converge (${s.iterations} iterations): no pH is given.`, ''];
  const out = [`**${esc(pHLine(b, s))}** · buffer capacity ${capacityText(s.bufferCapacity)} · I = ${sig(s.ionicStrengthM, 3)} M at equilibrium`, ''];
  const { major, more } = majorSpecies(s);
  if (major.length)
    out.push(`Species: ${major.map((x) => `${esc(x.display)} ${concText(x.concentrationM)}`).join(' · ')}${more ? ` · ${more} minor` : ''}`, '');
  const near = nearSaturation(s);
  if (near.length)
    out.push(
      `Saturation: ${near
        .map((x) => {
          const what =
            x.saturationIndex > 0
              ? `⚠ ${esc(x.display)} (${esc(x.name)}) SI ${siText(x.saturationIndex)}`
              : `${esc(x.display)} SI ${siText(x.saturationIndex)}`;
          const p = x.saturationIndex > 0 ? precipitateText(s, x) : undefined;
          return p ? `${what}, ${p}` : what;
        })
        .join(' · ')}`,
      '',
    );
  else if (s.saturation.length)
    out.push(`No solid of the table near saturation (highest: ${esc(s.saturation[0].display)} SI ${siText(s.saturation[0].saturationIndex)}).`, '');
  out.push(`_${esc(limitsLine(s))}_`, '');
  return out;
}

/** A hazard in a hover: what forms, from what, the harm, and what to know. */
const hazardLine = (h: Hazard) => `⚠ **${esc(hazardKindText(h))}** from ${esc(hazardIngredients(h))} (${esc(h.harm)}): ${esc(hazardText(h))}`;

/**
 * The batch hover's safety section: every dangerous pair, the heat of making up with its ΔT (an estimate,
 * with its method), the advice where it is over the setting, and the notice.
 */
function safetySection(b: BatchAnalysis): string[] {
  if (!hasSafety(b)) return [];
  const out = ['', '**Safety** — an aid, not a safety assessment', ''];
  if (b.hazards.length) out.push(b.hazards.map(hazardLine).join('  \n'), '');
  else out.push("No dangerous pair of ingredients in Ionwright's tables.", '');
  const h = b.heat;
  if (h) {
    out.push(`${h.exceeds ? '⚠ ' : ''}${esc(heatSummary(h))}.`, '');
    const advice = heatAdvice(h);
    if (advice.length) out.push(advice.map((a) => `- ${esc(a)}`).join('\n'), '');
    out.push(`_${esc(h.method)}._`, '');
  } else out.push(NO_HEAT, '');
  out.push(`_${esc(SAFETY_NOTICE)}_`);
  return out;
}

/** A batch line's part of the safety reading: the pairs it is in, and the heat of dissolving it. */
function ingredientSafety(i: Ingredient, b: BatchAnalysis): string[] {
  const hazards = hazardsOf(b, i);
  const k = b.ingredients.indexOf(i);
  const step = b.heat?.steps.find((st) => st.ingredientIndex === k && st.kind !== 'not-counted');
  if (!hazards.length && !step) return [];
  const out: string[] = [];
  if (hazards.length) out.push('', hazards.map(hazardLine).join('  \n'));
  if (step) {
    const per = step.kJPerMol !== undefined ? ` (${signed(Number(step.kJPerMol.toPrecision(3)))} kJ/mol)` : '';
    out.push('', `Heat of ${esc(stepKindText[step.kind])}: ΔH ≈ ${esc(stepKJText(step))} kJ${per} — estimate; ${esc(step.method)}.`);
  }
  if (hazards.length) out.push('', `_${esc(SAFETY_NOTICE)}_`);
  return out;
}

export function batchSummaryMarkdown(b: BatchAnalysis, s: ServiceSettings): string {
  const lines = [
    `**${esc(b.name ?? 'Batch')}** · ${esc(countsText(b))} · ${sig(weighedMass(b))} g to weigh${b.volumeL !== null ? ` · ${volumeText(b.volumeL)}` : ''}${b.totalMassG !== null ? ` · total ${sig(b.totalMassG)} g` : ''}`,
    '',
  ];
  lines.push(...solutionMarkdown(b));
  if (b.ionicStrengthM !== null)
    lines.push(`Nominal ionic strength ${sig(b.ionicStrengthM)} M (full dissociation) · net charge ${sig(b.netChargeEqPerL ?? 0, 2)} eq/L`, '');
  if (b.ions.length) lines.push(b.ions.map((x) => `${x.ion} ${sig(x.concentrationM)} M`).join(' · '), '');
  lines.push(markdownTable(pick(batchColumns(b, s), COMPACT_BATCH), countedRows(b), { short: true }));
  if (b.upkeep) lines.push('', ...upkeepMarkdown(b.upkeep, esc));
  if (b.skipped.length)
    lines.push('', `**Not counted** (left out of the figures above):`, '', ...b.skipped.map((l) => `- ${codeSpan(l.text)} — ${esc(l.reason)}`));
  const warnings = batchWarnings(b);
  if (warnings.length) lines.push('', ...warnings.map((d) => `⚠ ${esc(d.message)}`));
  lines.push(...safetySection(b));
  lines.push('', ...b.notes.map((n) => `_${n}_`));
  if (b.cautions.length) lines.push('', ...cautionBlock(b.cautions));
  return lines.join('\n').trimEnd();
}

const STATUS_WORDS: Record<string, string> = {
  balanced: 'balanced form found',
  ambiguous: 'more than one independent way to balance it',
  impossible: 'no way to balance it with these species',
  'too-large': 'too large to balance',
  invalid: 'not readable',
};

export function reactionMarkdown(r: ReactionAnalysis): string {
  const b = r.balance;
  const lines: string[] = [];
  if (!r.ok) {
    lines.push('**Equation** — not readable', '', ...r.parsed.diagnostics.map((d) => `- ${esc(d.message)}`));
    return lines.join('\n');
  }
  if (b.status === 'already-balanced') lines.push('**Balanced** ✓', '', esc(b.message));
  else {
    lines.push(`**Not balanced** — ${STATUS_WORDS[b.status] ?? b.status}`, '');
    const diff = b.differences.filter((d) => d.left !== d.right).map((d) => `${d.element} ${d.left} → ${d.right}`);
    if (diff.length) lines.push(`As written (left → right): ${diff.join(', ')}`, '');
    if (b.charge.left !== b.charge.right) lines.push(`Charge ${signed(b.charge.left)} → ${signed(b.charge.right)}`, '');
    if (b.balancedDisplay) {
      lines.push(`Balanced: **${esc(b.balancedDisplay)}**`);
      if (b.balancedText && b.balancedText !== b.balancedDisplay) lines.push('', `In the note's notation: ${codeSpan(b.balancedText)}`);
    } else lines.push(esc(b.message));
    if (b.note) lines.push('', esc(b.note));
  }
  return lines.join('\n');
}

/** A shelf line as read: the substance, its formula, assay, density, lot and the rest. */
function shelfEntryMarkdown(e: ShelfEntry, s: ServiceSettings): string {
  const a = analyseFormula(e.substance.formula, s.chem);
  const name = nameOf(a);
  const lines = [
    `**${esc(e.label)}** — shelf`,
    '',
    `Substance: **${esc(a.display)}**${name ? ` · ${esc(name)}` : ''}${e.substance.via === 'name' ? ` (read from the name '${esc(e.substance.text)}')` : ''}`,
  ];
  if (a.molarMass) lines.push('', `Molar mass: ${molarMassText(a.molarMass.value, s)} g/mol`);
  lines.push(
    '',
    `Assay: ${e.assayPercent !== undefined ? `${e.assayPercent} %` : e.substance.solution ? 'not given (a solution: give it)' : 'not given (taken as 100 %)'}`,
  );
  if (e.densityGPerML !== undefined) lines.push('', `Density: ${e.densityGPerML} g/mL (from the label)`);
  for (const [k, v] of [
    ['Lot', e.lot],
    ['Supplier', e.supplier],
    ['Grade', e.grade],
    ['Note', e.note],
  ] as const)
    if (v !== undefined) lines.push('', `${k}: ${esc(v)}`);
  return lines.join('\n');
}

export function hover(doc: AnalysedDocument, offset: number): HoverResult | null {
  for (const o of doc.shelves) {
    if (offset < o.ref.start || offset > o.ref.end) continue;
    const e = o.shelf.entries.find((x) => x.span.start <= offset && offset <= x.span.end);
    return e ? { markdown: shelfEntryMarkdown(e, doc.settings), range: doc.lines.range(e.span.start, e.span.end) } : null;
  }
  const t = targetAt(doc, offset);
  if (!t) return null;
  const s = doc.settings;
  let markdown: string;
  if (t.kind === 'formula') markdown = formulaCardMarkdown(t.occ.analysis, s);
  else if (t.kind === 'reaction') markdown = reactionMarkdown(t.occ.analysis);
  else if (t.kind === 'batch-line') markdown = ingredientMarkdown(t.ingredient, t.occ.analysis, s);
  else {
    const line = t.occ.analysis.skipped.find((l) => offset >= l.lineStart && offset <= l.lineEnd);
    if (line) return { markdown: skippedMarkdown(line, t.occ.analysis, s), range: doc.lines.range(line.lineStart, line.lineEnd) };
    const titre = t.occ.analysis.upkeep?.titres.find((x) => offset >= titreSpan(x).start && offset <= titreSpan(x).end);
    if (titre) return { markdown: titreMarkdown(titre, esc), range: doc.lines.range(titreSpan(titre).start, titreSpan(titre).end) };
    markdown = batchSummaryMarkdown(t.occ.analysis, s);
  }
  return { markdown, range: doc.lines.range(t.start, t.end) };
}
