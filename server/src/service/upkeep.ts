/**
 * How bath upkeep is written (chem/upkeep): the titres of a batch (the analysed concentration, g/L of the
 * salt and of the ion or metal that carries the analysis, and the hand calculation), and the additions
 * that bring the tank back to its targets. One wording for the hover, the inserted tables and the CLI.
 */
import type { TitreFailure, TitreResult, Upkeep } from '../chem/upkeep';
import { ADDITIONS_NOTE } from '../chem/upkeep';
import { massText, mlText, sig } from './format';

const isResult = (t: TitreResult | TitreFailure): t is TitreResult => 'reading' in t;

/** Where a titre line stands (absolute offsets), read or not. */
export const titreSpan = (t: TitreResult | TitreFailure): { start: number; end: number } => (isResult(t) ? t.reading : t);

/** One line per titre: `NiSO₄·6H₂O 0.460 M = 120.9 g/L (27.00 g/L Ni), 92 % of target`. */
export function titreLine(t: TitreResult | TitreFailure): string {
  if (!isResult(t)) return `${t.text.trim()} — not read: ${t.diagnostics.find((d) => d.severity === 'error')?.message ?? 'see the problems'}`;
  const r = t.reading;
  const carrier = t.carrierGPerL !== null && r.carrier ? ` (${sig(t.carrierGPerL, 4)} g/L ${r.carrier.display})` : '';
  const target = t.ofTarget !== undefined ? `, ${sig(t.ofTarget * 100, 3)} % of target` : '';
  return `${r.analyte.analysis.display} ${sig(t.concentrationM, 4)} M = ${sig(t.saltGPerL, 4)} g/L${carrier}${target}`;
}

/** The additions in lines: water and draw-off first, then each reagent to weigh or pour. */
export function additionLines(u: Upkeep): string[] {
  const plan = u.additions;
  if (!plan) return u.notes;
  const out: string[] = [];
  if (plan.drawOffL > 0) out.push(`Draw off ${sig(plan.drawOffL, 4)} L first.`);
  if (plan.waterL > 0) out.push(`Add ${sig(plan.waterL, 4)} L of water (to ${sig(plan.finalL, 4)} L${plan.governing ? `, set by ${plan.governing}` : ''}).`);
  for (const a of plan.additions) {
    if (!(a.massG > 0)) continue;
    const pour = a.volumeML !== undefined ? ` (${mlText(a.volumeML)} to pour)` : '';
    out.push(
      `Add ${massText(a.massG)} ${a.reagent.display}${a.reagent.assay < 1 ? ` @ ${sig(a.reagent.assay * 100, 3)} %` : ''}${pour}${a.assumed ? ' — not analysed, taken as at target' : ''}.`,
    );
  }
  if (!out.length) out.push('The tank is at its targets: nothing to add.');
  return [...out, ...u.notes];
}

/** The upkeep section of a batch's hover (Markdown-safe text is escaped by the caller's `esc`). */
export function upkeepMarkdown(u: Upkeep, esc: (s: string) => string): string[] {
  const lines = ['**Upkeep** (estimate)', ''];
  if (u.tank) lines.push(`Tank: ${sig(u.tank.litres, 4)} L${u.tank.capacityL ? ` of ${sig(u.tank.capacityL, 4)} L` : ''}`, '');
  for (const t of u.titres) lines.push(`- ${esc(titreLine(t))}`);
  if (u.titres.length) lines.push('');
  for (const a of additionLines(u)) lines.push(`- ${esc(a)}`);
  const cautions = [...new Set((u.additions?.additions ?? []).flatMap((a) => a.cautions ?? []))];
  if (cautions.length) lines.push('', ...cautions.map((c) => `⚠ ${esc(c)}`));
  if (u.additions) lines.push('', `_${esc(ADDITIONS_NOTE)}_`);
  lines.push('');
  return lines;
}

/** The hover of a titre line: the result, then the hand calculation, one step a line. */
export function titreMarkdown(t: TitreResult | TitreFailure, esc: (s: string) => string): string {
  if (!isResult(t)) return [`**Titre** — not read`, '', ...t.diagnostics.map((d) => `- ${esc(d.message)}`)].join('\n');
  const lines = [`**Titre** · ${esc(titreLine(t))}`, ''];
  for (const b of t.basis) lines.push(`- ${esc(b)}`);
  if (t.solubility?.exceeds) lines.push('', '⚠ Above the salt’s solubility: check the sample volume and the dilution.');
  lines.push('', '_An analysis computed from the titre as written; the lab’s own method and its calibration decide._');
  return lines.join('\n');
}
