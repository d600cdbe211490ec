/** The arrows that join the sides of an equation, longest first at each position. */
export const ARROWS = ['<=>', '<->', '⇌', '⇄', '↔', '->', '→', '⟶', '=>', '='] as const;
export type Arrow = (typeof ARROWS)[number];

export interface ArrowMatch {
  arrow: Arrow;
  start: number;
  end: number;
}

/** The first arrow in `text`, or undefined. */
export function findArrow(text: string, from = 0): ArrowMatch | undefined {
  for (let i = from; i < text.length; i++) {
    const c = text[i];
    if (c !== '<' && c !== '-' && c !== '=' && c !== '⇌' && c !== '⇄' && c !== '↔' && c !== '→' && c !== '⟶') continue;
    for (const a of ARROWS) {
      if (text.startsWith(a, i)) return { arrow: a, start: i, end: i + a.length };
    }
  }
  return undefined;
}

/** Reversible arrows (equilibria). */
export function isReversible(a: Arrow): boolean {
  return a === '<=>' || a === '<->' || a === '⇌' || a === '⇄' || a === '↔';
}
