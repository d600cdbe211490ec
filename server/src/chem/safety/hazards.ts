/**
 * Dangerous pairs in a batch: every rule of rules.ts applied to the batch's ingredients (both present at
 * the same time), with its conditions — the batch's pH for the acid-sensitive pairs, dryness, the
 * concentrations. One hazard per rule and first substance, naming every partner it has in the batch; it
 * belongs on the later line of those it names.
 */
import { aqueousNameOf } from '../names';
import type { BatchState, IngredientState } from './context';
import type { GroupMember, ReactiveGroup } from './groups';
import { PAIR_RULES, WATER_PRODUCTS, type PairRule, type Side } from './rules';
import type { Hazard } from './types';

/** The caution every hazard message ends with. */
export const HAZARD_CAUTION = "An aid, not a safety assessment: follow the SDS, your lab's procedures and local codes.";

function memberMatches(m: GroupMember, side: Side): boolean {
  if (!side.groups.includes(m.group)) return false;
  const tags = m.tag ? m.tag.split(' ') : [];
  if (side.tags && !side.tags.some((t) => tags.includes(t))) return false;
  if (side.notTags && side.notTags.some((t) => tags.includes(t))) return false;
  if (side.elements && !(m.element && side.elements.includes(m.element))) return false;
  if (side.maxPKa !== undefined && !(m.pKa !== undefined && m.pKa < side.maxPKa)) return false;
  return true;
}

function matching(it: IngredientState, side: Side): GroupMember | undefined {
  for (const m of it.members) if (memberMatches(m, side)) return m;
  return undefined;
}

/** Mass fraction of an ingredient in the batch (unknown amounts count as concentrated: the safe side). */
function fraction(it: IngredientState, state: BatchState): number {
  if (it.pureG === null || !state.massG) return 1;
  return it.pureG / state.massG;
}

/** Supplied concentrated: an acid of 30 % or more; a base as a solid or a solution of 30 % or more. */
function suppliedConcentrated(it: IngredientState): boolean {
  const assay = it.ing.assay && it.ing.assay > 0 ? it.ing.assay : 1;
  return assay >= 0.3;
}

/**
 * Both reagents in amounts that matter for the batch: the lesser of the two at 0.25 mol/L or more of the
 * final volume (or no final volume, or amounts unknown). A small pH adjustment of a large tank with the
 * concentrated acid and base, each added to the water, is everyday practice, and the heat of what is
 * added is judged by the heat warning (common practice).
 */
function muchOfBoth(a: IngredientState, b: IngredientState, state: BatchState): boolean {
  if (state.volumeL === null || a.moles === null || b.moles === null) return true;
  return Math.min(a.moles, b.moles) / state.volumeL >= 0.25;
}

/** The name of an ingredient in a message: its name (as given, or the systematic one) and its formula. */
function label(it: IngredientState, m: GroupMember | undefined): string {
  const name = it.ing.name ?? aqueousNameOf(it.ing.analysis) ?? m?.what;
  return name && name !== it.display ? `${name} (${it.display})` : it.display;
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const list = (xs: string[]) => (xs.length <= 1 ? xs.join('') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`);
const fmtPH = (x: number) => x.toFixed(1);

/** One bit per reactive group, for a quick test of which rules a batch can meet. */
const GROUP_BIT = new Map<ReactiveGroup, number>();
const bitOf = (g: ReactiveGroup) => {
  let b = GROUP_BIT.get(g);
  if (b === undefined) GROUP_BIT.set(g, (b = 1 << GROUP_BIT.size));
  return b;
};
const sideMask = (groups: readonly ReactiveGroup[]) => groups.reduce((m, g) => m | bitOf(g), 0);
/** Per rule: the groups of side a, and of side b where b must be present (not where the pH alone can stand in for the acid). */
const RULE_MASKS = PAIR_RULES.map((r) => ({ a: sideMask(r.a.groups), b: r.b && r.when?.acidBelowPH === undefined ? sideMask(r.b.groups) : 0 }));
const memberMasks = new WeakMap<readonly GroupMember[], number>();
function maskOf(members: readonly GroupMember[]): number {
  let m = memberMasks.get(members);
  if (m === undefined) memberMasks.set(members, (m = members.reduce((x, g) => x | bitOf(g.group), 0)));
  return m;
}

/** The hazards of a batch, in the order of the lines they belong on. */
export function findHazards(state: BatchState): Hazard[] {
  const out: Hazard[] = [];
  let present = 0;
  for (const it of state.items) present |= maskOf(it.members);
  if (present === 0) return out;
  const items = state.items.filter((it) => it.members.length > 0);
  for (let k = 0; k < PAIR_RULES.length; k++) {
    // Most batches hold few reactive groups: skip the rules whose sides they cannot meet.
    const mask = RULE_MASKS[k];
    if (!(mask.a & present) || (mask.b && !(mask.b & present))) continue;
    const rule = PAIR_RULES[k];
    const as: Array<[IngredientState, GroupMember]> = [];
    for (const it of items) {
      const m = matching(it, rule.a);
      if (m) as.push([it, m]);
    }
    if (!as.length) continue;
    const when = rule.when ?? {};
    if (when.water) {
      if (!state.aqueous) continue;
      for (const [it, m] of as) out.push(waterHazard(rule, it, m, state));
      continue;
    }
    if (when.dry && state.aqueous) continue;
    const bs: Array<[IngredientState, GroupMember]> = [];
    if (rule.b)
      for (const it of items) {
        const m = matching(it, rule.b);
        if (m) bs.push([it, m]);
      }
    for (const [a, am] of as) {
      const partners = bs.filter(([b]) => {
        if (b.index === a.index) return false;
        if (when.concentrated) {
          const it = when.concentrated.side === 'a' ? a : b;
          if (fraction(it, state) < when.concentrated.minFraction) return false;
        }
        if (when.bothConcentrated && !(suppliedConcentrated(a) && suppliedConcentrated(b) && muchOfBoth(a, b, state))) return false;
        return true;
      });
      const selfPair = rule.self && rule.b ? !!matching(a, rule.b) : false;
      if (when.acidBelowPH !== undefined && state.pH) {
        // The batch's pH decides: above the threshold the acid-sensitive substance is safe in this batch.
        if (state.pH.value >= when.acidBelowPH) continue;
        // Where any acid will do, the pH alone decides; a rule for strong acids only needs one in the batch.
        if (!partners.length && rule.b?.groups.includes('acid')) {
          out.push(pairHazard(rule, a, am, pHPartners(a, items), state));
          continue;
        }
      }
      if (partners.length) out.push(pairHazard(rule, a, am, partners, state));
      else if (selfPair) out.push(pairHazard(rule, a, am, [], state));
    }
  }
  out.sort((x, y) => x.lines[x.lines.length - 1] - y.lines[y.lines.length - 1]);
  return out;
}

/** Where the pH alone makes the gas: the ingredients that bring the acid (the lowest pKa first), if any. */
function pHPartners(a: IngredientState, items: readonly IngredientState[]): Array<[IngredientState, GroupMember]> {
  let best: [IngredientState, GroupMember] | null = null;
  for (const it of items) {
    if (it.index === a.index) continue;
    for (const m of it.members) {
      if ((m.group === 'acid' || m.group === 'strong-acid') && m.pKa !== undefined && (!best || m.pKa < (best[1].pKa ?? Infinity))) best = [it, m];
    }
  }
  return best ? [best] : [];
}

function pairHazard(rule: PairRule, a: IngredientState, am: GroupMember, partners: Array<[IngredientState, GroupMember]>, state: BatchState): Hazard {
  const involved = [a, ...partners.map(([b]) => b)].sort((x, y) => x.ing.line - y.ing.line || x.index - y.index);
  const who = partners.length ? `${label(a, am)} with ${list([...new Set(partners.map(([b, bm]) => label(b, bm)))])}` : label(a, am);
  let pHNote = '';
  let pH: Hazard['pH'];
  if (rule.when?.acidBelowPH !== undefined && state.pH) {
    pH = state.pH;
    pHNote = ` The batch's pH is ${fmtPH(state.pH.value)} (${state.pH.from === 'solution' ? 'from the solution chemistry' : 'estimated, ideal solution'}).`;
  }
  const gives = partners.length ? 'gives' : rule.self ? 'is or deposits' : 'at this pH gives';
  const message = `${capital(who)} ${gives} ${rule.product}: ${rule.harm}. ${rule.advice}.${pHNote} ${HAZARD_CAUTION}`;
  return finish(rule, involved, message, pH);
}

function waterHazard(rule: PairRule, it: IngredientState, m: GroupMember, state: BatchState): Hazard {
  const water = state.items.filter((w) => w.isWater);
  const involved = [it, ...water].sort((x, y) => x.ing.line - y.ing.line || x.index - y.index);
  const product = (m.tag && WATER_PRODUCTS[m.tag]) ?? rule.product;
  const message = `${capital(label(it, m))} reacts violently with the batch's water, giving ${product}. ${rule.advice}. ${HAZARD_CAUTION}`;
  return finish(rule, involved, message, undefined);
}

function finish(rule: PairRule, involved: IngredientState[], message: string, pH: Hazard['pH']): Hazard {
  const at = involved[involved.length - 1].index;
  return {
    kind: rule.kind,
    harm: rule.harmClass,
    message,
    ingredients: involved.map((x) => x.display),
    lines: involved.map((x) => x.ing.line),
    at,
    indices: involved.map((x) => x.index),
    rule: rule.id,
    source: rule.source,
    ...(pH ? { pH } : {}),
  };
}
