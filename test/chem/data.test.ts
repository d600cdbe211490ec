import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { ELEMENTS, element } from '../../server/src/chem/data/elements';
// @ts-expect-error plain ES module without types
import { generate } from '../../scripts/gen-data.mjs';

describe('element data', () => {
  it('the committed generated.ts matches the CSV tables in data/reference', () => {
    const committed = readFileSync(join(__dirname, '../../server/src/chem/data/generated.ts'), 'utf8');
    expect(committed).toBe(generate());
  });

  it('has all 118 elements in order of Z', () => {
    expect(ELEMENTS).toHaveLength(118);
    ELEMENTS.forEach((e, i) => expect(e.z).toBe(i + 1));
    expect(new Set(ELEMENTS.map((e) => e.symbol)).size).toBe(118);
  });

  it('uses the 2021 abridged value for hydrogen (CIAAW 2021: 1.0080 ± 0.0002)', () => {
    expect(element('H')?.mass).toBe(1.008);
    expect(element('H')?.massUncertainty).toBe(0.0002);
  });

  it('knows which elements have no standard atomic weight (CIAAW 2021, same set as the npm package chemical-elements)', async () => {
    const ce = await import('chemical-elements');
    const theirs = ce.elements.filter((e: { mass: number | null }) => e.mass == null).map((e: { symbol: string }) => e.symbol);
    const ours = ELEMENTS.filter((e) => !e.hasStandardWeight).map((e) => e.symbol);
    expect(ours).toEqual(theirs);
  });
});

describe('the README states the tables as they are', async () => {
  const readme = readFileSync(join(__dirname, '../../README.md'), 'utf8');
  const refReadme = readFileSync(join(__dirname, '../../data/reference/README.md'), 'utf8');
  const { ANIONS, CATIONS } = await import('../../server/src/chem/data/ions');
  const { MISWRITTEN, REAL } = await import('../fixtures/charge-sets');
  const { MOLECULAR_SUBSTANCES } = await import('../../server/src/chem/data/thermo');
  const { structureTable } = await import('../../server/src/chem/data/structures');
  const { accuracyTable, COVALENT_GROUP } = await import('../../server/src/chem/lattice/accuracy');
  const { METHODS } = await import('../../server/src/chem/lattice/lattice');
  const { parseCsv } = await import('../../scripts/gen-data.mjs' as string);

  it('counts of ions, test compounds, molecular substances and structure types', () => {
    const all = [...readme.matchAll(/(\d+) polyatomic anions, (\d+) polyatomic cations/g)];
    expect(all.length).toBeGreaterThan(0);
    for (const m of all) expect([Number(m[1]), Number(m[2])]).toEqual([ANIONS.length, CATIONS.length]);
    for (const m of readme.matchAll(/\((\d+) anions, (\d+) cations\)/g)) expect([Number(m[1]), Number(m[2])]).toEqual([ANIONS.length, CATIONS.length]);
    const real = /0 false warnings on (\d+) real compounds and ions, 0 misses on (\d+) mis-written formulas/.exec(readme)!;
    expect([Number(real[1]), Number(real[2])]).toEqual([Object.values(REAL).flat().length, MISWRITTEN.length]);
    expect(Number(/a table of (\d+) \(CRC melting and boiling points/.exec(readme)![1])).toBe(MOLECULAR_SUBSTANCES.size);
    expect(Number(/structure type \((\d+) types\)/.exec(readme)![1])).toBe(new Set([...structureTable().values()].map((t) => t.structure)).size);
  });

  it('the row counts of data/reference/README.md match the CSV files', () => {
    const claims = [...refReadme.matchAll(/^## ([a-z-]+\.csv) \((\d+) rows?/gm)];
    expect(claims.length).toBeGreaterThanOrEqual(10);
    for (const [, file, n] of claims) expect(parseCsv(readFileSync(join(__dirname, '../../data/reference', file), 'utf8')).length, file).toBe(Number(n));
    for (const [, file, n] of refReadme.matchAll(/and ([a-z-]+\.csv) \((\d+) rows?\)/g))
      expect(parseCsv(readFileSync(join(__dirname, '../../data/reference', file), 'utf8')).length, file).toBe(Number(n));
  });

  it('the table of measured errors per structure type is the one the code measures', () => {
    const t = accuracyTable();
    const pc = (x: number) => `${x < 0 && Math.round(Math.abs(x) * 100) !== 0 ? '−' : ''}${Math.round(Math.abs(x) * 100)}`;
    const cell = (group: string, m: string, showN: boolean) => {
      const e = t.get(group)!.methods[m as never] as { n: number; median: number; min: number; max: number };
      const range = pc(e.min) === pc(e.max) ? '' : ` (${pc(e.min)} to ${pc(e.max)})`;
      return `${pc(e.median)} %${range}${showN ? `, n = ${e.n}` : ''}`;
    };
    for (const group of ['rock salt', 'caesium chloride', 'fluorite', 'cadmium chloride', 'cadmium iodide', COVALENT_GROUP]) {
      const g = t.get(group)!;
      const n = g.methods[METHODS.bornMayer]!.n;
      const cells = [METHODS.bornMayer, METHODS.bornLande, METHODS.kapustinskii].map((m) =>
        cell(group, m, (g.methods as Record<string, { n: number }>)[m].n !== n),
      );
      const head = analyseHead(group);
      const row = `| ${group} | ${n} | ${cells.join(' | ')} | ${head} |`;
      expect(readme, row).toContain(row);
    }
  });
});

/** The method heading the card of a salt of the group that has no Born–Haber value. */
function analyseHead(group: string): string {
  const salt: Record<string, string> = {
    'rock salt': 'MgO',
    'caesium chloride': 'TlCl',
    fluorite: 'CdF2',
    'cadmium chloride': 'NiBr2',
    'cadmium iodide': 'CoBr2',
  };
  // The silver and copper(I) halides all have a cycle, which heads their cards.
  if (!salt[group]) return analyseFormula('AgI').lattice!.method === 'Born–Haber cycle' ? 'Born–Haber (all have one)' : '?';
  return analyseFormula(salt[group]).lattice!.method.replace(' equation', '');
}
