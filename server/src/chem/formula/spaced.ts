/**
 * Hydrates written with spaces (`CuSO4 · 5H2O`, `CuSO4 · 5 H2O`) where a line is split at spaces, as a
 * batch line is: the pieces of one formula are joined again, so that the formula reader (which reads the
 * spaces around an adduct dot as if they were not there) sees the formula as written.
 */
const SPACED_DOTS = '·•∙⋅*';

export interface TextToken {
  text: string;
  /** Offsets as the caller counts them (the first character of `line` is at `base`). */
  start: number;
  end: number;
}

const endsWithDot = (t: string) => SPACED_DOTS.includes(t[t.length - 1]);
const startsWithDot = (t: string) => SPACED_DOTS.includes(t[0]);
const isMultiplier = (t: string) => /^(?:\d+(?:\.\d+)?|\d+\/\d+|[½⅓⅔¼¾])$/.test(t);
const startsFormula = (t: string | undefined) => t !== undefined && /^[A-Z([]/.test(t);

/** Join the leading tokens that spell one spaced hydrate into one token; other tokens are returned as they are. */
export function joinSpacedAdduct<T extends TextToken>(tokens: T[], line: string, base: number): T[] {
  if (tokens.length < 2 || !startsFormula(tokens[0].text)) return tokens;
  let last = 0;
  for (;;) {
    const cur = tokens[last].text;
    const next = tokens[last + 1];
    if (!next) break;
    if (endsWithDot(cur) || startsWithDot(next.text)) {
      // `CuSO4 ·`, `· 5H2O`, `·5H2O`: the piece after the dot belongs to the formula, with a spaced multiplier.
      last++;
      if (next.text.length === 1 && startsWithDot(next.text) && tokens[last + 1]) last++;
      const t = tokens[last].text;
      const m = endsWithDot(tokens[last - 1].text) || tokens[last].text.length > 1 ? t.replace(/^[·•∙⋅*]/, '') : t;
      if (isMultiplier(m) && startsFormula(tokens[last + 1]?.text)) last++;
      continue;
    }
    break;
  }
  if (last === 0) return tokens;
  const first = tokens[0];
  const end = tokens[last].end;
  const joined = { ...first, text: line.slice(first.start - base, end - base), end } as T;
  return [joined, ...tokens.slice(last + 1)];
}
