/**
 * The catalogue of diagnostic codes: every finding Ionwright makes, with its default severity, a one-line
 * description and the part of the code that raises it. `DiagnosticCode` is derived from it, so raising a
 * code that is not here is a type error; the SARIF writer's rules and the README's table of codes come
 * from it (a test checks the README against it).
 *
 * An entry marked `reserved` names a code the outside contract already promises for a stage not written
 * yet: it is documented, but it is not a `DiagnosticCode` until the stage that raises it exists (then
 * drop the mark). Codes are kebab-case and never renamed: outside checks (CI filters, SARIF baselines)
 * rely on them.
 */
import type { Severity } from './diagnostic';

/** Where a finding is raised: a folder or module of the chemistry core, a layer above it. */
export type RaisedBy =
  | 'chem/formula'
  | 'chem/analyse'
  | 'chem/charge'
  | 'chem/equation'
  | 'chem/batch'
  | 'chem/solution'
  | 'chem/safety'
  | 'chem/reagents'
  | 'chem/upkeep'
  | 'service/document'
  | 'service/diagnostics'
  | 'cli';

export interface CatalogueEntry {
  /** The severity the code is raised with (SARIF: its rule's default level). */
  severity: Severity;
  /** One line: what the finding says is wrong. */
  description: string;
  raisedBy: readonly RaisedBy[];
  /** A code the contract names for a later stage, not raised yet. */
  reserved?: true;
}

const CATALOGUE = {
  // ── formulas ──
  'unknown-element': {
    severity: 'error',
    raisedBy: ['chem/formula'],
    description: 'A symbol in a formula that is no element (nor a known ligand abbreviation).',
  },
  'malformed-formula': {
    severity: 'error',
    raisedBy: ['chem/formula', 'chem/equation', 'chem/batch'],
    description: 'A formula that cannot be read: unbalanced brackets, stray characters, impossible counts.',
  },
  'charge-imbalance': {
    severity: 'warning',
    raisedBy: ['chem/charge'],
    description: 'A neutral formula whose ions or oxidation states cannot sum to zero, or an ion whose written charge disagrees with its composition.',
  },
  'variable-count': {
    severity: 'warning',
    raisedBy: ['chem/analyse'],
    description: "A count in a formula that is a letter (such as 'x'): the ions are read, but no molar mass.",
  },
  'no-standard-weight': {
    severity: 'information',
    raisedBy: ['chem/analyse'],
    description: 'An element without a standard atomic weight; the molar mass uses the mass number of a long-lived isotope.',
  },
  // ── reactions ──
  'unbalanced-equation': { severity: 'warning', raisedBy: ['chem/equation'], description: 'A reaction whose atoms or charges differ between the sides.' },
  'ambiguous-equation': { severity: 'information', raisedBy: ['chem/equation'], description: 'A reaction that balances in more than one independent way.' },
  'impossible-equation': {
    severity: 'information',
    raisedBy: ['chem/equation'],
    description: 'A reaction that cannot be balanced with positive coefficients.',
  },
  'equation-too-large': { severity: 'information', raisedBy: ['chem/equation'], description: 'A reaction too large to be balanced exactly.' },
  'missing-arrow': { severity: 'error', raisedBy: ['chem/equation'], description: 'A reaction without an arrow between reactants and products.' },
  'multiple-arrows': { severity: 'error', raisedBy: ['chem/equation'], description: 'A reaction with more than one arrow.' },
  'empty-side': { severity: 'error', raisedBy: ['chem/equation'], description: 'A reaction with nothing before or after its arrow.' },
  'empty-species': { severity: 'error', raisedBy: ['chem/equation'], description: "A reaction with an empty place between '+' signs." },
  'bad-coefficient': { severity: 'error', raisedBy: ['chem/equation'], description: 'A coefficient in a reaction that is not a positive number.' },
  'missing-formula': { severity: 'error', raisedBy: ['chem/equation'], description: 'A coefficient in a reaction with no formula after it.' },
  // ── batches ──
  'batch-header': {
    severity: 'warning',
    raisedBy: ['chem/batch'],
    description: "A batch header line (such as 'volume:') given twice, or a name given again after the opening line; the first one counts.",
  },
  'batch-amount': {
    severity: 'error',
    raisedBy: ['chem/batch'],
    description: 'An amount, header value or assay in a batch that is missing, not a positive number, or beyond what the batch can hold.',
  },
  'batch-unit': { severity: 'error', raisedBy: ['chem/batch'], description: 'A unit in a batch that is missing or unknown.' },
  'batch-syntax': { severity: 'error', raisedBy: ['chem/batch'], description: 'Unexpected text after an amount or a header value in a batch line.' },
  'batch-no-volume': { severity: 'error', raisedBy: ['chem/batch'], description: "A target concentration in a batch without the batch's final volume." },
  'batch-no-total': { severity: 'error', raisedBy: ['chem/batch'], description: "A wt% target in a batch without the batch's total mass." },
  'batch-total': { severity: 'warning', raisedBy: ['chem/batch'], description: "Ingredients of a batch that weigh more than its 'total:'." },
  'batch-charge': { severity: 'warning', raisedBy: ['chem/batch'], description: 'Ions listed on their own in a batch that leave it with a net charge.' },
  'batch-solubility': { severity: 'warning', raisedBy: ['chem/batch'], description: 'An ingredient above its solubility in the estimated water of the batch.' },
  'batch-precipitation': {
    severity: 'warning',
    raisedBy: ['chem/solution'],
    description: 'A sparingly soluble solid oversaturated in the batch at equilibrium.',
  },
  'batch-ph': {
    severity: 'warning',
    raisedBy: ['chem/solution'],
    description: "A batch whose computed pH differs from its 'pH:' header by more than the setting (or that has no final volume to compute it).",
  },
  'batch-ph-target': {
    severity: 'error',
    raisedBy: ['chem/solution'],
    description: "A 'to pH' line whose ingredient cannot bring the batch to that pH (not an acid or base, the wrong one, or not enough of it).",
  },
  'batch-buffer': {
    severity: 'error',
    raisedBy: ['chem/batch', 'chem/solution'],
    description: 'A buffer line that cannot be read or made: an unknown system, a missing total or pH, a pH the system cannot reach.',
  },
  'batch-buffer-range': {
    severity: 'warning',
    raisedBy: ['chem/solution'],
    description: "A buffer made more than one pH unit from its system's pKa, where it has little capacity.",
  },
  'batch-equilibrium': {
    severity: 'warning',
    raisedBy: ['chem/solution'],
    description: 'A batch whose equilibrium the solver did not converge on: no pH or species are given.',
  },
  'batch-name': {
    severity: 'error',
    raisedBy: ['chem/batch'],
    description: 'An ingredient named in words that the tool cannot read as one substance, or reads only as a near name, which is never taken.',
  },
  'batch-stock': {
    severity: 'error',
    raisedBy: ['chem/batch'],
    description: 'A dilution from a stock that cannot be made: a stock batch not found, without the substance or its concentration, or weaker than the target.',
  },
  'reagent-assay': {
    severity: 'warning',
    raisedBy: ['chem/batch'],
    description: 'A reagent sold as a solution (hydrochloric acid, ammonia, bleach) given without its assay, or an assay the density table does not cover.',
  },
  'reagent-no-assay': {
    severity: 'error',
    raisedBy: ['chem/batch'],
    description: 'A reagent sold as a solution, measured by volume without its assay: how much substance it holds cannot be known.',
  },
  'reagent-density': {
    severity: 'error',
    raisedBy: ['chem/batch'],
    description: 'A liquid measured by volume whose density the tool does not know and the line or shelf does not give.',
  },
  'reagent-basis': {
    severity: 'warning',
    raisedBy: ['chem/batch'],
    description: 'An amount whose meaning rests on a basis the line does not state (ppm as mg/L or mg/kg where they differ).',
  },
  'batch-incompatible': {
    severity: 'warning',
    raisedBy: ['chem/batch', 'chem/safety'],
    description: 'Ingredients of a batch that react dangerously together.',
  },
  'batch-heat': {
    severity: 'warning',
    raisedBy: ['chem/batch', 'chem/safety'],
    description: 'An estimated temperature change on making up the batch above the setting (batch.heatThresholdK).',
  },
  'batch-unclosed': { severity: 'warning', raisedBy: ['service/document'], description: 'A batch or shelf block that is never closed.' },
  // ── the shelf ──
  'shelf-syntax': {
    severity: 'error',
    raisedBy: ['chem/reagents'],
    description: "A shelf line that cannot be read: no ':' after the label, a field that is not a shelf field, or a value that is not one.",
  },
  'shelf-substance': {
    severity: 'error',
    raisedBy: ['chem/reagents'],
    description: 'A shelf substance that is not read exactly (an unknown, near or ambiguous name), or a solution reagent without its assay.',
  },
  'shelf-assay-needed': {
    severity: 'warning',
    raisedBy: ['chem/reagents'],
    description: 'A shelf reagent sold as a solution (hydrochloric acid, ammonia, the hydroxides) whose assay is not given.',
  },
  'shelf-duplicate': {
    severity: 'warning',
    raisedBy: ['chem/reagents', 'service/document'],
    description: 'A label that is on the shelf twice; batch lines take the first.',
  },
  // ── bath upkeep (titrations and additions) ──
  'titre-syntax': {
    severity: 'error',
    raisedBy: ['chem/upkeep'],
    description: "A titre line that cannot be read: no ':' after the analyte, a part that is no sample, titre, blank, ratio or reaction, or one missing.",
  },
  'titre-amount': {
    severity: 'error',
    raisedBy: ['chem/upkeep'],
    description:
      'A volume or concentration of a titre line that is missing, not a positive number, in an unknown unit, or impossible (an aliquot larger than its dilution).',
  },
  'titre-analyte': {
    severity: 'error',
    raisedBy: ['chem/upkeep'],
    description:
      "An analyte or titrant of a titre line that cannot be read, an 'as' species that is not part of the analyte, or a 'less' substance with no titre of its own.",
  },
  'titre-ratio': {
    severity: 'error',
    raisedBy: ['chem/upkeep'],
    description:
      'A titre line whose mole ratio is not written and does not follow from the titrant, or whose reaction does not join the analyte and the titrant.',
  },
  'titre-implausible': {
    severity: 'warning',
    raisedBy: ['chem/upkeep'],
    description: "A titrated concentration above the salt's solubility, or beyond three times or below a third of the batch's target.",
  },
  'upkeep-tank': {
    severity: 'error',
    raisedBy: ['chem/upkeep'],
    description: "A 'tank:' header that cannot be read, or additions asked for without a tank volume.",
  },
  'upkeep-reagent': {
    severity: 'error',
    raisedBy: ['chem/upkeep'],
    description:
      "A target or reagent of an addition that cannot be used: no target concentration or molar mass, an assay outside 0–100 %, or a reagent that is not a form of the batch's substance.",
  },
  'upkeep-target': {
    severity: 'information',
    raisedBy: ['chem/upkeep'],
    description: 'A titrated substance with no target in the batch, or a target with no titre (taken as at target).',
  },
  // ── notes and files ──
  'long-paragraph': {
    severity: 'information',
    raisedBy: ['service/document'],
    description: 'A paragraph so long that it is read in pieces; a code span across two pieces is not read as one.',
  },
  'findings-limit': {
    severity: 'information',
    raisedBy: ['service/diagnostics'],
    description: 'More findings in a note than the editor is sent; the last one says how many more there are.',
  },
  'not-text': { severity: 'warning', raisedBy: ['cli'], description: 'A notes file with NUL bytes, which does not look like text.' },
} as const satisfies Record<string, CatalogueEntry>;

type Catalogue = typeof CATALOGUE;

/** Every code of the catalogue, reserved ones included. */
export type CatalogueCode = keyof Catalogue;

/** A code reserved for a later stage (documented, not raised yet). */
export type ReservedCode = { [K in CatalogueCode]: Catalogue[K] extends { reserved: true } ? K : never }[CatalogueCode];

/** A code a finding can be raised with. */
export type DiagnosticCode = Exclude<CatalogueCode, ReservedCode>;

/** The catalogue, in its order (formulas, reactions, batches, notes and files). */
export const DIAGNOSTIC_CATALOGUE: Readonly<Record<CatalogueCode, CatalogueEntry>> = CATALOGUE;

/** The codes that are raised (reserved ones left out), in the catalogue's order. */
export const DIAGNOSTIC_CODES: readonly DiagnosticCode[] = (Object.keys(CATALOGUE) as CatalogueCode[]).filter(
  (c): c is DiagnosticCode => !(DIAGNOSTIC_CATALOGUE[c].reserved ?? false),
);

/** Whether a string is a code findings are raised with (for data that comes in untyped, such as a worker's message). */
export function isDiagnosticCode(code: string): code is DiagnosticCode {
  return Object.prototype.hasOwnProperty.call(CATALOGUE, code) && !DIAGNOSTIC_CATALOGUE[code as CatalogueCode].reserved;
}
