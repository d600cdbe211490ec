/**
 * The TextMate grammars in syntaxes/: tokenised with the same engine VS Code uses (vscode-textmate on
 * vscode-oniguruma), against the examples, against VS Code's own Markdown grammar (from tm-grammars) for the
 * injection, and against the formula parser for what counts as an element, a charge, a state or a hydrate dot.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { INITIAL, Registry, parseRawGrammar, type IGrammar, type StateStack } from 'vscode-textmate';
import { OnigScanner, OnigString, loadWASM } from 'vscode-oniguruma';
import { ELEMENTS } from '../../server/src/chem/data/elements';
import { parseFormula, startsWithAdductMolecule } from '../../server/src/chem/formula/parse';
import type { FormulaItem } from '../../server/src/chem/formula/ast';

const nodeRequire = createRequire(__filename);
const SYNTAXES = join(__dirname, '../..', 'syntaxes');
const EXAMPLES = join(__dirname, '../..', 'examples');

/** Our grammars by scope name. */
const OURS: Record<string, string> = {
  'source.fnote': join(SYNTAXES, 'fnote.tmLanguage.json'),
  'source.ionwright.formula': join(SYNTAXES, 'chem-formula.tmLanguage.json'),
  'markdown.ionwright.injection': join(SYNTAXES, 'markdown-formulas.tmLanguage.json'),
};
/** VS Code's Markdown grammar, which the injection goes into. */
const MARKDOWN_GRAMMAR = nodeRequire.resolve('tm-grammars/grammars/markdown.json');

let registry: Registry;

beforeAll(async () => {
  await loadWASM(readFileSync(nodeRequire.resolve('vscode-oniguruma/release/onig.wasm')));
  registry = new Registry({
    onigLib: Promise.resolve({ createOnigScanner: (p: string[]) => new OnigScanner(p), createOnigString: (s: string) => new OnigString(s) }),
    loadGrammar: async (scopeName) => {
      const file = scopeName === 'text.html.markdown' ? MARKDOWN_GRAMMAR : OURS[scopeName];
      // Other languages embedded by the Markdown grammar (```js and so on) are not needed here.
      return file ? parseRawGrammar(readFileSync(file, 'utf8'), file) : null;
    },
    getInjections: (scopeName) => (scopeName === 'text.html.markdown' ? ['markdown.ionwright.injection'] : undefined),
  });
});

interface Tok {
  text: string;
  start: number;
  scopes: string[];
}

async function tokenize(scopeName: string, text: string): Promise<Tok[][]> {
  const grammar = (await registry.loadGrammar(scopeName)) as IGrammar;
  expect(grammar).toBeTruthy();
  let stack: StateStack = INITIAL;
  return text.split(/\r\n|\r|\n/).map((line) => {
    const r = grammar.tokenizeLine(line, stack);
    stack = r.ruleStack;
    return r.tokens.map((t) => ({ text: line.slice(t.startIndex, t.endIndex), start: t.startIndex, scopes: t.scopes }));
  });
}

/** The line that starts with `prefix` (after indentation), so that the tests say which line they mean. */
function lineStarting(lines: Tok[][], prefix: string): Tok[] {
  const found = lines.find((toks) =>
    toks
      .map((t) => t.text)
      .join('')
      .trimStart()
      .startsWith(prefix),
  );
  if (!found) throw new Error(`no line starts with ${JSON.stringify(prefix)}`);
  return found;
}

/** The `nth` token whose text is exactly `text`. */
function tok(line: Tok[], text: string, nth = 0): Tok {
  const all = line.filter((t) => t.text === text);
  if (!all[nth]) throw new Error(`no token ${JSON.stringify(text)} (#${nth}) in ${JSON.stringify(line.map((t) => t.text).join(''))}`);
  return all[nth];
}

const has = (t: Tok, scope: string) => t.scopes.some((s) => s === scope || s.startsWith(scope + '.'));

/** Expect the token to carry every scope given (each a prefix of one of its scopes, TextMate style). */
function expectScopes(t: Tok, ...scopes: string[]) {
  for (const s of scopes) expect(has(t, s), `${JSON.stringify(t.text)} has ${s}: [${t.scopes.join(' ')}]`).toBe(true);
}

describe('grammar files', () => {
  const files = { ...OURS };
  const grammars = Object.fromEntries(Object.entries(files).map(([scope, file]) => [scope, JSON.parse(readFileSync(file, 'utf8'))]));

  it.each(Object.entries(files))('%s is valid JSON with its scopeName and patterns', (scope, file) => {
    const g = JSON.parse(readFileSync(file, 'utf8'));
    expect(g.scopeName).toBe(scope);
    expect(Array.isArray(g.patterns) && g.patterns.length > 0).toBe(true);
    expect(typeof g.repository).toBe('object');
  });

  it('the Markdown injection targets Markdown outside code and comments', () => {
    const g = grammars['markdown.ionwright.injection'];
    expect(g.injectionSelector).toMatch(/^L:text\.html\.markdown\b/);
    expect(g.injectionSelector).toContain('-markup.fenced_code');
  });

  /** Every rule object of a grammar (patterns, repository entries, captures with patterns). */
  function* rules(node: unknown): Generator<Record<string, unknown>> {
    if (Array.isArray(node)) for (const n of node) yield* rules(n);
    else if (node && typeof node === 'object') {
      yield node as Record<string, unknown>;
      for (const v of Object.values(node)) yield* rules(v);
    }
  }

  it('every include names a rule that exists, and every repository rule is used', () => {
    const used = new Set<string>();
    for (const [scope, g] of Object.entries(grammars)) {
      for (const r of rules(g)) {
        if (typeof r.include !== 'string') continue;
        const inc = r.include;
        if (inc === '$self' || inc === '$base') continue;
        const hash = inc.indexOf('#');
        const target = hash === 0 ? scope : hash > 0 ? inc.slice(0, hash) : inc;
        const name = hash >= 0 ? inc.slice(hash + 1) : undefined;
        expect(grammars[target], `${scope}: include ${inc} names a grammar of ours`).toBeTruthy();
        if (name !== undefined) {
          expect(Object.hasOwn(grammars[target].repository, name), `${scope}: include ${inc} names an existing rule`).toBe(true);
          used.add(`${target}#${name}`);
        }
      }
    }
    const unused = Object.entries(grammars).flatMap(([scope, g]) =>
      Object.keys(g.repository)
        .filter((k) => !used.has(`${scope}#${k}`))
        .map((k) => `${scope}#${k}`),
    );
    expect(unused).toEqual([]);
  });

  it('every regular expression compiles with Oniguruma', () => {
    for (const [scope, g] of Object.entries(grammars)) {
      for (const r of rules(g)) {
        for (const key of ['match', 'begin', 'end', 'while'] as const) {
          const re = r[key];
          if (typeof re !== 'string') continue;
          // End and while patterns may refer to captures of their begin (\3); those are filled in at run time.
          const source = key === 'end' || key === 'while' ? re.replace(/\\[1-9]/g, 'x') : re;
          expect(() => new OnigScanner([source]), `${scope} ${key}: ${re}`).not.toThrow();
        }
      }
    }
  });
});

describe('.fnote: examples/plating-bath.fnote', () => {
  let lines: Tok[][];
  beforeAll(async () => {
    lines = await tokenize('source.fnote', readFileSync(join(EXAMPLES, 'plating-bath.fnote'), 'utf8'));
  });

  it('comments', () => {
    const line = lineStarting(lines, '# Tarnlow');
    expectScopes(tok(line, '#'), 'comment.line.number-sign.fnote', 'punctuation.definition.comment.fnote');
    expect(line.every((t) => has(t, 'comment.line.number-sign.fnote'))).toBe(true);
  });

  it('section lines: keyword and title', () => {
    const line = lineStarting(lines, 'section: Nickel strike');
    expectScopes(tok(line, 'section'), 'keyword.control.section.fnote');
    expectScopes(tok(line, ':'), 'keyword.control.section.fnote', 'punctuation.separator.key-value.fnote');
    expectScopes(tok(line, 'Nickel strike bath, trial N-3'), 'entity.name.section.fnote', 'markup.heading.section.fnote');
  });

  it('formula lines: elements, counts, hydrate dot and multiplier', () => {
    const line = lineStarting(lines, 'formula: NiCl2·6H2O');
    expectScopes(tok(line, 'formula'), 'keyword.control.formula.fnote');
    expectScopes(tok(line, 'Ni'), 'meta.formula.ionwright', 'support.type.element.ionwright');
    expectScopes(tok(line, 'Cl'), 'support.type.element.ionwright');
    expectScopes(tok(line, '2'), 'constant.numeric.count.ionwright');
    expectScopes(tok(line, '·'), 'punctuation.separator.adduct.ionwright');
    expectScopes(tok(line, '6'), 'constant.numeric.multiplier.ionwright');
    expectScopes(tok(line, ','), 'punctuation.separator.list.fnote');
    expect(has(tok(line, ','), 'meta.formula')).toBe(false);
    expectScopes(tok(line, 'B'), 'support.type.element.ionwright');
  });

  it('prose: code spans hold formulas; bare prose is left alone', () => {
    const line = lineStarting(lines, 'The strike bath');
    expectScopes(tok(line, '`', 0), 'markup.inline.raw.fnote', 'punctuation.definition.raw.begin.fnote');
    expectScopes(tok(line, '`', 1), 'markup.inline.raw.fnote', 'punctuation.definition.raw.end.fnote');
    const inSpan = line.filter((t) => has(t, 'markup.inline.raw.fnote') && t.text === 'Ni');
    expect(inSpan).toHaveLength(1);
    expectScopes(inSpan[0], 'support.type.element.ionwright');
    expect(line.filter((t) => !has(t, 'markup.inline.raw.fnote')).some((t) => has(t, 'meta.formula'))).toBe(false);
  });

  it('batch blocks: keyword, name, volume, ingredients, units, comments, end', () => {
    const head = lineStarting(lines, 'batch Nickel strike');
    expectScopes(tok(head, 'batch'), 'meta.batch.fnote', 'keyword.control.batch.fnote');
    expectScopes(tok(head, 'Nickel strike N-3'), 'entity.name.type.batch.ionwright');

    const volume = lineStarting(lines, 'volume: 250 mL');
    expectScopes(tok(volume, 'volume'), 'meta.batch.fnote', 'support.type.property-name.ionwright');
    expectScopes(tok(volume, '250'), 'constant.numeric.quantity.ionwright');
    expectScopes(tok(volume, 'mL'), 'keyword.other.unit.ionwright');

    const salt = lineStarting(lines, 'NiSO4·6H2O 240 g');
    expectScopes(tok(salt, 'Ni'), 'meta.ingredient.ionwright', 'meta.formula.ionwright', 'support.type.element.ionwright');
    expectScopes(tok(salt, '4'), 'constant.numeric.count.ionwright');
    expectScopes(tok(salt, '240'), 'constant.numeric.amount.ionwright');
    expectScopes(tok(salt, 'g'), 'keyword.other.unit.ionwright');
    expect(has(tok(salt, '240'), 'meta.formula')).toBe(false);

    const molar = lineStarting(lines, 'H3PO4 0.5 M');
    expectScopes(tok(molar, '0.5'), 'constant.numeric.amount.ionwright');
    expectScopes(tok(molar, 'M'), 'keyword.other.unit.ionwright');

    const commented = lineStarting(lines, 'C6H8O7 5 g');
    expectScopes(tok(commented, '#'), 'comment.line.number-sign.ionwright', 'punctuation.definition.comment.ionwright');
    expectScopes(tok(commented, ' citric acid, treated as undissociated'), 'comment.line.number-sign.ionwright');

    const ends = lines.filter(
      (l) =>
        l
          .map((t) => t.text)
          .join('')
          .trim() === 'end',
    );
    expect(ends).toHaveLength(2);
    for (const e of ends) expectScopes(tok(e, 'end'), 'keyword.control.end.fnote');
    // After the block, lines are top level again.
    expect(has(tok(lineStarting(lines, 'reaction: Ni^2+'), 'reaction'), 'meta.batch')).toBe(false);
  });

  it('reaction lines: charges, plus, coefficient, electron, arrow', () => {
    const line = lineStarting(lines, 'reaction: Ni^2+ + 2 e^- -> Ni');
    expectScopes(tok(line, 'reaction'), 'meta.reaction.fnote', 'keyword.control.reaction.fnote');
    expectScopes(tok(line, 'Ni', 0), 'meta.formula.ionwright', 'support.type.element.ionwright');
    expectScopes(tok(line, '^', 0), 'constant.numeric.charge.ionwright', 'punctuation.definition.charge.ionwright');
    expectScopes(tok(line, '2+'), 'meta.formula.ionwright', 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, '+'), 'keyword.operator.plus.ionwright');
    expectScopes(tok(line, '2'), 'constant.numeric.coefficient.ionwright');
    expectScopes(tok(line, 'e'), 'support.constant.electron.ionwright');
    expectScopes(tok(line, '-'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, '->'), 'keyword.operator.arrow.ionwright');
    expectScopes(tok(line, 'Ni', 1), 'support.type.element.ionwright');
  });
});

describe('.fnote: notation details', () => {
  const one = async (text: string) => (await tokenize('source.fnote', text))[0];

  it('charges in every notation, state symbols, Stock notation', async () => {
    const line = await one('formula: SO4^{2-} SO₄²⁻ Cl- Ca+2 Fe3+ NH4+ NaCl(aq) Fe(III)');
    expectScopes(tok(line, '{'), 'constant.numeric.charge.ionwright', 'punctuation.definition.charge.begin.ionwright');
    expectScopes(tok(line, '2-'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, '₄'), 'constant.numeric.count.ionwright');
    expectScopes(tok(line, '²⁻'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, '-'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, '+2'), 'constant.numeric.charge.ionwright');
    // On a single element the trailing digit is the charge; on anything larger the sign alone is.
    expectScopes(tok(line, '3+'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, '4', 1), 'constant.numeric.count.ionwright');
    expectScopes(tok(line, '+'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(line, 'aq'), 'constant.language.state.ionwright');
    expectScopes(tok(line, 'III'), 'constant.numeric.oxidation-state.ionwright');
  });

  it('a dot between digits: decimal count, or hydrate dot before a water molecule', async () => {
    const line = await one('formula: Fe0.95O CuSO4.5H2O CaSO4·½H2O');
    expectScopes(tok(line, '0.95'), 'constant.numeric.count.ionwright');
    expectScopes(tok(line, '.'), 'punctuation.separator.adduct.ionwright');
    expectScopes(tok(line, '5'), 'constant.numeric.multiplier.ionwright');
    expectScopes(tok(line, '½'), 'constant.numeric.multiplier.ionwright');
  });

  it('equilibrium arrows, = and comments in reaction lines', async () => {
    const lines = await tokenize('source.fnote', 'reaction: N2 + 3 H2 <=> 2 NH3\nreaction: Fe + O2 = Fe2O3  # not balanced\nreaction: A ⇌ B');
    expectScopes(tok(lines[0], '<=>'), 'keyword.operator.arrow.equilibrium.ionwright');
    expectScopes(tok(lines[0], '3'), 'constant.numeric.coefficient.ionwright');
    expectScopes(tok(lines[1], '='), 'keyword.operator.arrow.ionwright');
    expectScopes(tok(lines[1], '#'), 'comment.line.number-sign.ionwright');
    expectScopes(tok(lines[2], '⇌'), 'keyword.operator.arrow.equilibrium.ionwright');
  });

  it('in equations a + is a separator where a species follows it, else a charge', async () => {
    const lines = await tokenize(
      'source.fnote',
      'reaction: H2+O2 -> H2O\nreaction: H2+ O2 -> H2O\nreaction: Na+ + Cl- -> NaCl\nreaction: Ca+2 + 1½ O2 -> x\nformula: Na+ Fe3+',
    );
    expectScopes(tok(lines[0], '+'), 'keyword.operator.plus.ionwright');
    expectScopes(tok(lines[1], '+'), 'keyword.operator.plus.ionwright');
    expectScopes(tok(lines[1], '2', 0), 'constant.numeric.count.ionwright');
    expectScopes(tok(lines[2], '+', 0), 'constant.numeric.charge.ionwright');
    expectScopes(tok(lines[2], '+', 1), 'keyword.operator.plus.ionwright');
    expectScopes(tok(lines[3], '+2'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(lines[3], '+'), 'keyword.operator.plus.ionwright');
    expectScopes(tok(lines[3], '1½'), 'constant.numeric.coefficient.ionwright');
    // In a formula list every formula stands alone: a trailing + is always a charge.
    expectScopes(tok(lines[4], '+'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(lines[4], '3+'), 'constant.numeric.charge.ionwright');
  });

  it('batch lines as the batch reader takes them: headers, glued units, assay, # anywhere', async () => {
    const text = [
      'batch',
      '  Name: Bath#3',
      '  VOLUME: 500mL',
      '  total: 2 kg',
      '  CuSO4 5g@98.5 %',
      '  NaCl 1 wt%',
      '  KCl 1e-3 mol/L',
      '  CaCl2 12.5 µmol',
      '  volume: 2 kg',
      '  section: not a section',
      'end',
    ];
    const lines = await tokenize('source.fnote', text.join('\n'));
    expectScopes(tok(lines[1], 'Name'), 'support.type.property-name.ionwright');
    expectScopes(tok(lines[1], 'Bath'), 'entity.name.type.batch.ionwright');
    expectScopes(tok(lines[1], '#'), 'comment.line.number-sign.ionwright');
    expectScopes(tok(lines[2], 'VOLUME'), 'meta.batch-header.volume.ionwright');
    expectScopes(tok(lines[2], '500'), 'constant.numeric.quantity.ionwright');
    expectScopes(tok(lines[2], 'mL'), 'keyword.other.unit.ionwright');
    expectScopes(tok(lines[3], 'kg'), 'meta.batch-header.total.ionwright', 'keyword.other.unit.ionwright');
    expectScopes(tok(lines[4], 'g'), 'keyword.other.unit.ionwright');
    expectScopes(tok(lines[4], '@'), 'keyword.operator.assay.ionwright');
    expectScopes(tok(lines[4], '98.5'), 'constant.numeric.assay.ionwright');
    expectScopes(tok(lines[4], '%'), 'keyword.other.unit.percent.ionwright');
    expectScopes(tok(lines[5], 'wt%'), 'keyword.other.unit.ionwright');
    expectScopes(tok(lines[6], '1e-3'), 'constant.numeric.amount.ionwright');
    expectScopes(tok(lines[6], 'mol/L'), 'keyword.other.unit.ionwright');
    expectScopes(tok(lines[7], 'µmol'), 'keyword.other.unit.ionwright');
    // A mass is no volume: the unit is left plain (the batch reader reports it).
    expect(lines[8].some((t) => has(t, 'keyword.other.unit'))).toBe(false);
    // A line inside a batch is never a keyword line.
    expect(lines[9].some((t) => has(t, 'keyword.control.section'))).toBe(false);
    expectScopes(tok(lines[10], 'end'), 'keyword.control.end.fnote');
  });

  it('knows exactly the element symbols the parser knows', async () => {
    const symbols = ELEMENTS.map((e) => e.symbol);
    const line = await one(`formula: ${symbols.join(', ')}`);
    expect(line.filter((t) => has(t, 'support.type.element')).map((t) => t.text)).toEqual(symbols);
    const bad = await one('formula: Xx, J, Q, Nacl, Ee');
    expect(bad.some((t) => has(t, 'support.type.element'))).toBe(false);
  });
});

describe('grammar and parser agree', () => {
  // What the parser reads, character by character, against what the grammar scopes.
  const CORPUS = [
    'NaCl',
    'CH3COOH',
    'Ca(OH)2',
    'K4[Fe(CN)6]',
    '{[Co(NH3)5]Cl}Cl2',
    'Fe0.95O',
    'La0.8Sr0.2MnO3',
    'Li0.5CoO2',
    'Fe₀.₉₅O',
    'CuSO4·5H2O',
    'CuSO4•5H2O',
    'CuSO4*5H2O',
    'CuSO4.5H2O',
    'Na2CO3.10H2O',
    'CaSO4.0.5H2O',
    'CaSO4·0.5H2O',
    'CaSO4·½H2O',
    'CaSO4·1/2H2O',
    'CaCl2.2NH3',
    '[Cu(H2O)6]SO4·H2O',
    'K4[Fe(CN)6]·3H2O',
    'H₂O',
    'H₂SO₄',
    'SO₄²⁻',
    'SO4^2-',
    'SO4^-2',
    'SO4^{2-}',
    'NH4^+',
    'Cl-',
    'Ca++',
    'Ca+2',
    'Fe3+',
    'O2-',
    'NH4+',
    'SO42-',
    'Fe3+(aq)',
    'NaCl(aq)',
    'H2O(l)',
    'CO2(g)',
    'Fe(s)',
    'Fe(III)',
    'Cu(I)',
    'Fe(III)Cl3',
    'Et2O',
    'PhCOOH',
    'Pb(OAc)2',
    '[Co(en)3]Cl3',
    'Cu(acac)2',
    'Me3N',
  ];
  type Label = '' | 'element' | 'abbrev' | 'charge' | 'state' | 'separator' | 'stock';

  function parserLabels(text: string): Label[] {
    const r = parseFormula(text);
    expect(r.diagnostics, text).toEqual([]);
    const f = r.formula!;
    const labels: Label[] = Array(text.length).fill('');
    const mark = (start: number, end: number, l: Label) => labels.fill(l, start, end);
    const walk = (items: FormulaItem[]) => {
      for (const it of items) {
        if (it.kind === 'element') {
          mark(it.start, it.symbolEnd, 'element');
          if (it.stock !== undefined) mark(it.symbolEnd, it.end, 'stock');
        } else if (it.kind === 'abbrev') mark(it.start, it.start + it.name.length, 'abbrev');
        else walk(it.items);
      }
    };
    f.parts.forEach((p, k) => {
      if (k > 0) mark(p.start - 1, p.start, 'separator');
      walk(p.items);
    });
    if (f.chargeSpan) mark(f.chargeSpan.start, f.chargeSpan.end, 'charge');
    if (f.stateSpan) mark(f.stateSpan.start, f.stateSpan.end, 'state');
    return labels;
  }

  const SCOPE_LABELS: Array<[string, Label]> = [
    ['support.type.element', 'element'],
    ['support.constant.abbreviation', 'abbrev'],
    ['support.constant.ligand', 'abbrev'],
    ['constant.numeric.charge', 'charge'],
    ['constant.language.state', 'state'],
    ['punctuation.separator.adduct', 'separator'],
    ['constant.numeric.oxidation-state', 'stock'],
  ];

  it('the hydrate-dot molecules of the grammar are the parser’s', () => {
    // Both rules that read a dot between digits (count, multiplier) carry the same list.
    const repo = JSON.parse(readFileSync(OURS['source.ionwright.formula'], 'utf8')).repository;
    const listIn = (re: string) => {
      const open = '(?:\\.[0-9]+)?(?:';
      const from = re.indexOf(open);
      const to = re.indexOf(')(?:$|', from);
      expect(from >= 0 && to > from, re).toBe(true);
      return re.slice(from + open.length, to);
    };
    const list = listIn(repo.count.match);
    expect(listIn(repo.multiplier.match)).toBe(list);
    const grammarList = list.split('|').map((m) => m.replace(/\\/g, ''));
    const source = readFileSync(join(__dirname, '../..', 'server', 'src', 'chem', 'formula', 'parse.ts'), 'utf8');
    const parserList = /const ADDUCT_MOLECULES = \[([^\]]*)\]/
      .exec(source)?.[1]
      .match(/'[^']*'/g)
      ?.map((q) => q.slice(1, -1));
    expect(parserList, 'ADDUCT_MOLECULES in parse.ts').toBeTruthy();
    expect(grammarList).toEqual(parserList);
    for (const m of grammarList) expect(startsWithAdductMolecule(m), m).toBe(true);
  });

  it.each(CORPUS)('%s', async (text) => {
    const prefix = 'formula: ';
    const [line] = await tokenize('source.fnote', prefix + text);
    const labels: Label[] = Array(text.length).fill('');
    for (const t of line) {
      if (t.start < prefix.length) continue;
      const found = SCOPE_LABELS.find(([s]) => has(t, s));
      if (found) labels.fill(found[1], t.start - prefix.length, t.start - prefix.length + t.text.length);
    }
    expect(labels).toEqual(parserLabels(text));
  });
});

describe('Markdown injection', () => {
  const DOC = [
    '# Bench', // 0
    '',
    'Uses `NaCl` and `2 H2 + O2 -> 2 H2O` daily.', // 2
    '',
    '```batch Rinse A', // 4
    'name: Rinse A',
    'volume: 500 mL',
    'CuSO4.5H2O 2.5 g @ 98%', // 7
    '```', // 8
    '',
    '~~~~ Reaction', // 10
    'Fe^3+ + e^- <=> Fe^2+',
    '~~~',
    'SO4^2- + Ba^2+ -> BaSO4(s)  # still inside: a ~~~ fence closes only a shorter one', // 13
    '~~~~', // 14
    '',
    '```python', // 16
    '```batch',
    'NaCl 1 g',
    '```', // 19
    '',
    'After NaCl 2 g.', // 21
    '    ```batch', // 22: indented code, not a fence
  ].join('\n');
  let lines: Tok[][];
  beforeAll(async () => {
    lines = await tokenize('text.html.markdown', DOC);
  });

  it('batch fences: fence, info, embedded batch lines', () => {
    expectScopes(tok(lines[4], '```'), 'markup.fenced_code.block.markdown', 'punctuation.definition.markdown');
    expectScopes(tok(lines[4], 'batch'), 'fenced_code.block.language.markdown');
    expectScopes(tok(lines[4], 'Rinse A'), 'entity.name.type.batch.ionwright');
    expectScopes(tok(lines[5], 'name'), 'meta.embedded.block.batch.ionwright', 'support.type.property-name.ionwright');
    expectScopes(tok(lines[6], 'mL'), 'keyword.other.unit.ionwright');
    const salt = lines[7];
    expectScopes(
      tok(salt, 'Cu'),
      'markup.fenced_code.block.markdown',
      'meta.embedded.block.batch.ionwright',
      'meta.formula.ionwright',
      'support.type.element.ionwright',
    );
    expectScopes(tok(salt, '.'), 'punctuation.separator.adduct.ionwright');
    expectScopes(tok(salt, '2.5'), 'constant.numeric.amount.ionwright');
    expectScopes(tok(salt, 'g'), 'keyword.other.unit.ionwright');
    expectScopes(tok(salt, '@'), 'keyword.operator.assay.ionwright');
    expectScopes(tok(salt, '98'), 'constant.numeric.assay.ionwright');
    expectScopes(tok(salt, '%'), 'keyword.other.unit.percent.ionwright');
    expectScopes(tok(lines[8], '```'), 'punctuation.definition.markdown');
    expect(has(tok(lines[8], '```'), 'meta.embedded')).toBe(false);
  });

  it('reaction fences (tilde, any case): closed only by a fence at least as long', () => {
    expectScopes(tok(lines[10], 'Reaction'), 'fenced_code.block.language.markdown');
    expectScopes(tok(lines[11], '<=>'), 'meta.embedded.block.reaction.ionwright', 'keyword.operator.arrow.equilibrium.ionwright');
    expectScopes(tok(lines[11], 'e'), 'support.constant.electron.ionwright');
    expectScopes(tok(lines[13], '->'), 'meta.embedded.block.reaction.ionwright', 'keyword.operator.arrow.ionwright');
    expectScopes(tok(lines[13], '2-'), 'constant.numeric.charge.ionwright');
    expectScopes(tok(lines[13], 's'), 'constant.language.state.ionwright');
    expectScopes(tok(lines[13], '#'), 'comment.line.number-sign.ionwright');
    expectScopes(tok(lines[14], '~~~~'), 'punctuation.definition.markdown');
  });

  it('leaves Markdown alone elsewhere: inline code, other fences, indented code, prose', () => {
    const inline = lines[2].filter((t) => has(t, 'markup.inline.raw.string.markdown'));
    expect(inline.map((t) => t.text).join('')).toBe('`NaCl``2 H2 + O2 -> 2 H2O`');
    for (const t of lines[2])
      expect(
        t.scopes.some((s) => s.endsWith('.ionwright')),
        t.text,
      ).toBe(false);
    for (const n of [16, 17, 18, 19, 21, 22]) {
      for (const t of lines[n])
        expect(
          t.scopes.some((s) => s.endsWith('.ionwright')),
          `line ${n}: ${t.text}`,
        ).toBe(false);
    }
    expectScopes(tok(lines[21], 'After NaCl 2 g.'), 'meta.paragraph.markdown');
  });

  it('examples/rinse-trials.md', async () => {
    const md = await tokenize('text.html.markdown', readFileSync(join(EXAMPLES, 'rinse-trials.md'), 'utf8'));
    const assay = lineStarting(md, 'CuSO4.5H2O 2.5 g @ 98%');
    expectScopes(tok(assay, '@'), 'keyword.operator.assay.ionwright');
    const kh = lineStarting(md, 'KH2PO4 3.40 g');
    expectScopes(tok(kh, 'K'), 'meta.embedded.block.batch.ionwright', 'support.type.element.ionwright');
    expectScopes(tok(kh, '#'), 'comment.line.number-sign.ionwright');
    const redox = lineStarting(md, 'MnO4^- + Fe^2+');
    expectScopes(tok(redox, '->'), 'meta.embedded.block.reaction.ionwright', 'keyword.operator.arrow.ionwright');
    expectScopes(tok(redox, 'Mn', 0), 'support.type.element.ionwright');
    expectScopes(tok(redox, '-', 0), 'constant.numeric.charge.ionwright');
    const prose = lineStarting(md, 'The neutralisation');
    expect(prose.some((t) => t.scopes.some((s) => s.endsWith('.ionwright')))).toBe(false);
  });
});
