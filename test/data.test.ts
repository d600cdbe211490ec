import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ELEMENTS, element } from '../server/src/chem/data/elements';
// @ts-expect-error plain ES module without types
import { generate } from '../scripts/gen-data.mjs';

describe('element data', () => {
  it('the committed generated.ts matches the CSV tables in data/reference', () => {
    const committed = readFileSync(join(__dirname, '../server/src/chem/data/generated.ts'), 'utf8');
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
