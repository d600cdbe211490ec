/**
 * Where the chart's formula labels go (server/src/service/chart/labels.ts). Three levels:
 * - the placement on random points (fast-check): no two label boxes intersect, no label box covers a mark,
 *   every box lies in the plot area, and each label is nearest to its own point or joined to it by a leader;
 * - the same read back from the drawn svg of random salts, with the geometry taken from the svg alone;
 * - the report's charts of real notes (the demo notes and a salt-bath note): each label names the salt it
 *   is drawn beside.
 * The geometry checks here are written out on their own (sampling, plain distances), not taken from the
 * chart's code. Lattice energies, radii and melting points come from the project's own analysis; the checks
 * do not depend on their values.
 */
import fc from 'fast-check';
import MarkdownIt from 'markdown-it';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { latticeChart, type LatticePoint } from '../../server/src/service/chart';
import { LabelSpace, placeLabels, type LabelRequest, type Mark } from '../../server/src/service/chart/labels';
import { analyseDocument } from '../../server/src/service/document';
import { latticePoints, reportHtml } from '../../server/src/service/report';
import { boxesOverlap, crossesOf, distanceToBox, labelBox, labelReadings, labelsOf, leadersOf, one, parse, plotArea, pointsOf, type Box } from './chart-svg';

const RADIUS = 4.5;
const HEIGHT = 11.5;

const square = (x: number, y: number, half: number): Box => ({ x0: x - half, y0: y - half, x1: x + half, y1: y + half });
const strictlyInside = (b: Box, x: number, y: number) => x > b.x0 && x < b.x1 && y > b.y0 && y < b.y1;
/** Whether a segment passes through the inside of a box, by sampling 400 points along it. */
const segmentEnters = (s: { x1: number; y1: number; x2: number; y2: number }, b: Box) => {
  for (let k = 0; k <= 400; k++) if (strictlyInside(b, s.x1 + ((s.x2 - s.x1) * k) / 400, s.y1 + ((s.y2 - s.y1) * k) / 400)) return true;
  return false;
};

// ---------------------------------------------------------------------------------------------------------
// The placement itself

interface Scene {
  bounds: Box;
  marks: Mark[];
  requests: LabelRequest[];
}

/** Random salts on a plot: an energy marker each, a melting-point cross for some, labels of random width. */
const sceneArb = fc
  .record({
    width: fc.integer({ min: 150, max: 800 }),
    height: fc.integer({ min: 120, max: 500 }),
    points: fc.array(
      fc.record({
        x: fc.double({ min: 0, max: 1, noNaN: true }),
        y: fc.double({ min: 0, max: 1, noNaN: true }),
        melt: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: null }),
        labelWidth: fc.double({ min: 6, max: 140, noNaN: true }),
      }),
      { minLength: 1, maxLength: 45 },
    ),
  })
  .map(({ width, height, points }): Scene => {
    const bounds = { x0: 20, y0: 30, x1: 20 + width, y1: 30 + height };
    const at = (f: number, lo: number, hi: number) => lo + 6 + f * (hi - lo - 12);
    const marks: Mark[] = [];
    const requests: LabelRequest[] = [];
    points.forEach((p, owner) => {
      const x = at(p.x, bounds.x0, bounds.x1);
      const y = at(p.y, bounds.y0, bounds.y1);
      marks.push({ owner, x, y, box: square(x, y, RADIUS + 1) });
      if (p.melt !== null) {
        const my = at(p.melt, bounds.y0, bounds.y1);
        marks.push({ owner, x, y: my, box: square(x, my, 4.75) });
      }
      requests.push({ owner, width: p.labelWidth, height: HEIGHT, x, y, radius: RADIUS });
    });
    return { bounds, marks, requests };
  });

const run = (scene: Scene) => placeLabels(scene.requests, new LabelSpace(scene.bounds, scene.marks));

describe('label placement on random points', () => {
  it('never overlaps a label or a mark, stays in the plot, and labels the right point', () => {
    fc.assert(
      fc.property(sceneArb, (scene) => {
        const { placed, dropped } = run(scene);
        // Every label is placed or dropped, once.
        expect([...placed.map((l) => l.owner), ...dropped].sort((a, b) => a - b)).toEqual(scene.requests.map((r) => r.owner));
        for (const label of placed) {
          const request = scene.requests[label.owner];
          const { box } = label;
          expect(box.x1 - box.x0).toBeCloseTo(request.width, 9);
          expect(box.y1 - box.y0).toBeCloseTo(request.height, 9);
          expect(box.x0 >= scene.bounds.x0 && box.x1 <= scene.bounds.x1 && box.y0 >= scene.bounds.y0 && box.y1 <= scene.bounds.y1).toBe(true);
          // No label box covers a mark, its own included.
          for (const m of scene.marks) expect(boxesOverlap(box, m.box), `label ${label.owner} on a mark of ${m.owner}`).toBe(false);
          // No two label boxes intersect.
          for (const other of placed) if (other !== label) expect(boxesOverlap(box, other.box), `labels ${label.owner} and ${other.owner}`).toBe(false);
          const others = scene.marks.filter((m) => m.owner !== label.owner);
          if (label.leader === null) {
            // Nearest to its own point: every other salt's mark is farther from the box than its own marker.
            const own = distanceToBox(box, request.x, request.y);
            for (const m of others) expect(distanceToBox(box, m.x, m.y), `label ${label.owner} beside a mark of ${m.owner}`).toBeGreaterThan(own);
          } else {
            // Joined to its own point: from the marker's edge to the box, across no other salt's mark or label.
            const s = label.leader;
            expect(Math.hypot(s.x1 - request.x, s.y1 - request.y)).toBeCloseTo(RADIUS + 1.5, 6);
            expect(distanceToBox(box, s.x2, s.y2)).toBeLessThanOrEqual(1.5);
            for (const m of others) expect(segmentEnters(s, m.box), `leader of ${label.owner} across a mark of ${m.owner}`).toBe(false);
            for (const other of placed)
              if (other !== label) expect(segmentEnters(s, other.box), `leader of ${label.owner} across label ${other.owner}`).toBe(false);
          }
        }
      }),
      { numRuns: 300 },
    );
  });

  it('places every label when the points are well apart', () => {
    // Points in separate cells of 80 × 70 px, labels at most 60 px wide: there is always room beside each.
    const spread = fc.uniqueArray(fc.integer({ min: 0, max: 39 }), { minLength: 1, maxLength: 12 }).chain((cells) =>
      fc.tuple(
        fc.constant(cells),
        fc.array(fc.tuple(fc.integer({ min: -10, max: 10 }), fc.integer({ min: -10, max: 10 }), fc.integer({ min: 10, max: 60 })), {
          minLength: cells.length,
          maxLength: cells.length,
        }),
      ),
    );
    fc.assert(
      fc.property(spread, ([cells, jitter]) => {
        const bounds = { x0: 0, y0: 0, x1: 640, y1: 350 };
        const marks: Mark[] = [];
        const requests: LabelRequest[] = cells.map((cell, owner) => {
          const x = 40 + (cell % 8) * 80 + jitter[owner][0];
          const y = 35 + Math.floor(cell / 8) * 70 + jitter[owner][1];
          marks.push({ owner, x, y, box: square(x, y, RADIUS + 1) });
          return { owner, width: jitter[owner][2], height: HEIGHT, x, y, radius: RADIUS };
        });
        const { placed, dropped } = placeLabels(requests, new LabelSpace(bounds, marks));
        expect(dropped).toEqual([]);
        expect(placed.every((l) => l.leader === null)).toBe(true);
      }),
    );
  });

  it('is deterministic', () => {
    fc.assert(
      fc.property(sceneArb, (scene) => {
        expect(run(scene)).toEqual(run(scene));
      }),
      { numRuns: 50 },
    );
  });
});

// ---------------------------------------------------------------------------------------------------------
// The drawn chart

const saltArb = fc.record({
  kJPerMol: fc.double({ min: 500, max: 15000, noNaN: true }),
  estimate: fc.boolean(),
  inverseR0: fc.option(fc.double({ min: 0.2, max: 0.6, noNaN: true }), { nil: null, freq: 8 }),
  chargeProduct: fc.integer({ min: 1, max: 9 }),
  meltingPointC: fc.option(fc.double({ min: 100, max: 3000, noNaN: true }), { nil: undefined }),
});
const chartArb = fc.record({
  salts: fc
    .uniqueArray(fc.stringMatching(/^[A-Z][a-z]?(?:[A-Z][a-z]?[₂₃₄]?){0,3}$/), { minLength: 1, maxLength: 30 })
    .chain((labels) =>
      fc.tuple(
        ...labels.map((label) => saltArb.map((s): LatticePoint => ({ ...s, label, method: s.estimate ? 'Kapustinskii equation' : 'Born–Haber cycle' }))),
      ),
    ),
  x: fc.constantFrom('inverse-radius' as const, 'charge-product' as const),
  width: fc.integer({ min: 320, max: 1000 }),
  height: fc.integer({ min: 240, max: 700 }),
});

describe('labels of the drawn chart, read back from the svg', () => {
  it('never overlap each other or a mark, and each names the point it is drawn beside', () => {
    fc.assert(
      fc.property(chartArb, ({ salts, x, width, height }) => {
        const svg = parse(latticeChart(salts, { x, width, height }));
        const points = pointsOf(svg);
        if (points.length === 0) return; // every salt without radii: the empty chart, tested in chart.test.ts
        const marks = [...points.map((p) => p.box), ...crossesOf(svg).map((c) => c.box)];
        const labels = labelsOf(svg);
        const boxes = labels.map(labelBox);
        const plot = plotArea(svg);
        for (const [i, box] of boxes.entries()) {
          expect(box.x0 >= plot.x0 && box.x1 <= plot.x1 && box.y0 >= plot.y0 && box.y1 <= plot.y1).toBe(true);
          for (const m of marks) expect(boxesOverlap(box, m), `${labels[i].text} on a mark`).toBe(false);
          for (const [j, other] of boxes.entries()) if (j !== i) expect(boxesOverlap(box, other), `${labels[i].text} / ${labels[j].text}`).toBe(false);
        }
        // A salt whose marker sits on another's (same x and energy) cannot be told apart by place.
        const at = new Map(points.map((p) => [p.salt, p]));
        for (const reading of labelReadings(svg)) {
          const own = at.get(reading.text);
          const read = at.get(reading.salt);
          expect(own, `${reading.text} is a salt`).toBeDefined();
          if (reading.salt !== reading.text)
            expect(Math.hypot(own!.cx - read!.cx, own!.cy - read!.cy), `${reading.text} read as ${reading.salt}`).toBeLessThan(1);
        }
        // Labels left out are counted, in the <desc> and in the chart.
        const omitted = points.length - labels.length;
        expect(new Set(labels.map((l) => l.text)).size).toBe(labels.length);
        const desc = one(svg, (e) => e.name === 'desc').text;
        if (omitted) {
          expect(desc).toContain(`${omitted} formula labels left out`);
          expect(one(svg, (e) => (e.attrs.class ?? '').includes('iw-lc-note')).text).toMatch(new RegExp(`^${omitted} labels? left out`));
        } else expect(desc).not.toMatch(/labels left out/);
      }),
      { numRuns: 150 },
    );
  });

  it('are byte-identical for the same salts, in any order', () => {
    fc.assert(
      fc.property(chartArb, fc.integer(), ({ salts, x, width, height }, seed) => {
        const a = latticeChart(salts, { x, width, height });
        const shuffled = [...salts].sort((p, q) => ((p.label.length * 31 + seed) % 7) - ((q.label.length * 31 + seed) % 7) || 0).reverse();
        expect(latticeChart(salts, { x, width, height })).toBe(a);
        expect(latticeChart(shuffled, { x, width, height })).toBe(a);
      }),
      { numRuns: 60 },
    );
  });
});

// ---------------------------------------------------------------------------------------------------------
// The report's charts of real notes

const CSS = readFileSync(join(__dirname, '../../media/preview.css'), 'utf8');
/** A salt bath of a fictional heat-treatment shop: nitrates with the chlorides carried over and a rinse. */
const SALT_BATH = [
  '# Salt bath B-2, trial week 14 (Harrow Lane heat-treatment shop)',
  '',
  'The bath is `NaNO3` with `KNO3`; drag-out from the quench tank brings `NaCl` and `KCl`, and the rinse',
  'after it holds `ZnSO4`, `CuSO4` and `MgSO4` from the plating line next door.',
  '',
].join('\n');
const NOTES: Array<[string, string, 'markdown' | 'fnote']> = [
  ['examples/rinse-trials.md', readFileSync(join(__dirname, '../../examples/rinse-trials.md'), 'utf8'), 'markdown'],
  ['examples/plating-bath.fnote', readFileSync(join(__dirname, '../../examples/plating-bath.fnote'), 'utf8'), 'fnote'],
  ['salt-bath.md', SALT_BATH, 'markdown'],
];

describe('labels of the report charts of real notes', () => {
  for (const [name, text, language] of NOTES) {
    it(`name the salt they are drawn beside (${name})`, () => {
      const doc = analyseDocument(text, language);
      const html = reportHtml(doc, { title: name, css: CSS, markdownIt: () => new MarkdownIt() });
      const inReport = html.match(/<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" class="iw-lattice"[\s\S]*?<\/svg>/g) ?? [];
      expect(inReport.length).toBeGreaterThanOrEqual(1);
      // The same salts against the charge product too, whether or not the report needs that chart.
      const points = latticePoints(doc.formulas.map((f) => f.analysis).filter((a) => a.ok));
      for (const chart of [...inReport, latticeChart(points, { x: 'charge-product' })]) {
        const svg = parse(chart);
        const drawn = pointsOf(svg).map((p) => p.salt);
        expect(drawn.length).toBeGreaterThanOrEqual(3);
        const readings = labelReadings(svg);
        // Every salt is labelled, and each label is read as the salt it names.
        expect(readings.map((r) => r.text).sort()).toEqual([...drawn].sort());
        for (const r of readings) expect(r.salt, `"${r.text}" is drawn beside ${r.salt} (${r.by})`).toBe(r.text);
      }
    });
  }

  it('the salt-bath note: NaCl, NaNO₃ and KNO₃ each read as themselves, crosses included', () => {
    const doc = analyseDocument(SALT_BATH, 'markdown');
    const points = latticePoints(doc.formulas.map((f) => f.analysis).filter((a) => a.ok));
    expect(points.map((p) => p.label)).toEqual(expect.arrayContaining(['NaCl', 'NaNO₃', 'KNO₃']));
    for (const x of ['inverse-radius', 'charge-product'] as const) {
      const svg = parse(latticeChart(points, { x }));
      expect(crossesOf(svg).map((c) => c.salt)).toEqual(expect.arrayContaining(['NaCl', 'NaNO₃', 'KNO₃']));
      const labels = labelsOf(svg);
      const crosses = crossesOf(svg);
      for (const l of labels) {
        const box = labelBox(l);
        // No label is nearer to another salt's melting-point cross than to its own marker, unless a leader joins it.
        const own = pointsOf(svg).find((p) => p.salt === l.text)!;
        const led = leadersOf(svg).some((s) => distanceToBox(box, s.x2, s.y2) <= 1.5 && Math.abs(Math.hypot(s.x1 - own.cx, s.y1 - own.cy) - 6) < 0.1);
        if (led) continue;
        for (const c of crosses)
          if (c.salt !== l.text)
            expect(distanceToBox(box, c.cx, c.cy), `${l.text} beside the cross of ${c.salt}`).toBeGreaterThan(distanceToBox(box, own.cx, own.cy));
      }
    }
  });
});
