/**
 * The lattice-energy chart: parsed back with a strict XML parser (sax, present in node_modules through
 * @vscode/vsce; test/chart-svg.ts) and checked for geometry, scaling, ticks, escaping, legend, melting points
 * and robustness. Label placement: test/chart.labels.test.ts.
 * Salts: rough six-coordinate Shannon radii and lattice energies from memory (common textbook values); the
 * chart only draws what it is given, so the checks do not depend on their accuracy.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CHART_CSS_VARIABLES, latticeChart, leastSquares, niceTicks, type LatticePoint } from '../../server/src/service/chart';
import { ticksWithin } from '../../server/src/service/chart/ticks';
import { all, hasClass, inverseScale, labelBox, num, one, overlappingPairs, parse, plotArea, pointsOf, ticksOf, type El, type PointView } from './chart-svg';

const isNiceStep = (step: number) => {
  const mag = Math.pow(10, Math.floor(Math.log10(step) + 1e-9));
  const m = Math.round((step / mag) * 1000) / 1000;
  return [1, 2, 2.5, 5, 10].includes(m);
};

// ---------------------------------------------------------------------------------------------------------
// Sample salts

const inv = (rPlus: number, rMinus: number) => 1 / (rPlus + rMinus);
// Six-coordinate radii (Å): Li⁺ 0.76, Na⁺ 1.02, K⁺ 1.38, Mg²⁺ 0.72, Ca²⁺ 1.00, F⁻ 1.33, Cl⁻ 1.81, O²⁻ 1.40.
const SALTS: LatticePoint[] = [
  { label: 'NaCl', kJPerMol: 787, method: 'Born–Haber cycle', estimate: false, inverseR0: inv(1.02, 1.81), chargeProduct: 1, meltingPointC: 801 },
  { label: 'KCl', kJPerMol: 717, method: 'Born–Haber cycle', estimate: false, inverseR0: inv(1.38, 1.81), chargeProduct: 1, meltingPointC: 770 },
  { label: 'MgO', kJPerMol: 3800, method: 'Born–Mayer equation', estimate: true, inverseR0: inv(0.72, 1.4), chargeProduct: 4, meltingPointC: 2852 },
  { label: 'CaO', kJPerMol: 3400, method: 'Kapustinskii equation', estimate: true, inverseR0: inv(1.0, 1.4), chargeProduct: 4 },
  { label: 'LiF', kJPerMol: 1037, method: 'Born–Haber cycle', estimate: false, inverseR0: inv(0.76, 1.33), chargeProduct: 1, meltingPointC: 845 },
  { label: 'CaF₂', kJPerMol: 2630, method: 'Born–Mayer equation', estimate: true, inverseR0: inv(1.0, 1.33), chargeProduct: 2, meltingPointC: 1418 },
];
const NH4NO3: LatticePoint = { label: 'NH₄NO₃', kJPerMol: 661, method: 'Kapustinskii equation', estimate: true, inverseR0: null, chargeProduct: 1 };

// ---------------------------------------------------------------------------------------------------------

describe('latticeChart: the svg element', () => {
  it('is a self-contained, accessible svg of the requested size', () => {
    const s = latticeChart(SALTS, { width: 800, height: 500, title: 'Salts of batch 7' });
    const svg = parse(s);
    expect(svg.name).toBe('svg');
    expect(svg.attrs.xmlns).toBe('http://www.w3.org/2000/svg');
    expect(svg.attrs.role).toBe('img');
    expect(svg.attrs.width).toBe('800');
    expect(svg.attrs.height).toBe('500');
    expect(svg.attrs.viewBox).toBe('0 0 800 500');
    expect(svg.children[0].name).toBe('title');
    expect(svg.children[0].text).toBe('Salts of batch 7');
    const desc = svg.children.find((c) => c.name === 'desc') as El;
    expect(desc.text).toMatch(/6 salts/);
    // aria-labelledby names the title and the desc
    const ids = svg.attrs['aria-labelledby'].split(' ');
    expect(ids).toEqual([svg.children[0].attrs.id, desc.attrs.id]);
    // nothing external, nothing executable
    expect(s).not.toMatch(/<script|@import|url\(|href=|<foreignObject|on[a-z]+="/i);
  });

  it('stays within the requested size: plot area, markers and labels', () => {
    for (const [width, height] of [
      [640, 400],
      [320, 240],
      [1200, 700],
    ]) {
      const svg = parse(latticeChart([...SALTS, NH4NO3], { width, height }));
      const plot = plotArea(svg);
      expect(plot.x0).toBeGreaterThan(0);
      expect(plot.y0).toBeGreaterThan(0);
      expect(plot.x1).toBeLessThan(width);
      expect(plot.y1).toBeLessThan(height);
      for (const p of pointsOf(svg)) {
        expect(p.cx).toBeGreaterThanOrEqual(plot.x0 - 0.01);
        expect(p.cx).toBeLessThanOrEqual(plot.x1 + 0.01);
        expect(p.cy).toBeGreaterThanOrEqual(plot.y0 - 0.01);
        expect(p.cy).toBeLessThanOrEqual(plot.y1 + 0.01);
      }
      for (const t of all(svg, (e) => e.name === 'text' && e.attrs.x !== undefined)) {
        expect(num(t.attrs.x)).toBeGreaterThanOrEqual(0);
        expect(num(t.attrs.x)).toBeLessThanOrEqual(width);
        expect(num(t.attrs.y)).toBeGreaterThanOrEqual(0);
        expect(num(t.attrs.y)).toBeLessThanOrEqual(height);
      }
    }
  });

  it('clamps nonsense sizes instead of failing', () => {
    const a = parse(latticeChart(SALTS, { width: NaN, height: -3 }));
    expect(a.attrs.width).toBe('640'); // default for a non-number
    expect(Number(a.attrs.height)).toBeGreaterThanOrEqual(160); // clamped up
    const b = parse(latticeChart(SALTS, { width: 1e9, height: Infinity }));
    expect(Number(b.attrs.width)).toBeLessThanOrEqual(4096);
    expect(b.attrs.height).toBe('400');
  });

  it('writes every coordinate with at most 2 decimals', () => {
    const s = latticeChart([...SALTS, NH4NO3]);
    const attrs = [...s.matchAll(/\s(x|y|x1|x2|y1|y2|cx|cy|r|width|height|d|transform|viewBox)="([^"]*)"/g)];
    expect(attrs.length).toBeGreaterThan(50);
    for (const [, name, value] of attrs) for (const m of value.match(/-?\d+(\.\d+)?/g) ?? []) expect(m, `${name}="${value}"`).toMatch(/^-?\d+(\.\d{1,2})?$/);
  });

  it('is deterministic, whatever the order of the input', () => {
    const a = latticeChart(SALTS);
    expect(latticeChart(SALTS)).toBe(a);
    expect(latticeChart([...SALTS].reverse())).toBe(a);
    expect(latticeChart([SALTS[3], SALTS[0], SALTS[5], SALTS[1], SALTS[4], SALTS[2]])).toBe(a);
  });

  it('reads its colours from CSS custom properties with fallbacks, text from currentColor', () => {
    const s = latticeChart([...SALTS, NH4NO3]);
    const style = one(parse(s), (e) => e.name === 'style').text;
    for (const v of Object.keys(CHART_CSS_VARIABLES)) expect(style).toContain(`var(${v},`);
    expect(style).toContain('var(--iw-chart-text,currentColor)');
    // Every rule is scoped to the chart, so it cannot restyle the host page.
    for (const rule of style.split('}').filter(Boolean)) expect(rule.trim()).toMatch(/^\.iw-lattice[ {]/);
  });
});

describe('latticeChart: geometry and scales', () => {
  const svg = parse(latticeChart(SALTS));
  const pts = pointsOf(svg);
  const byLabel = new Map(pts.map((p) => [p.title.split(':')[0], p]));

  it('draws every salt once, in order of x', () => {
    expect(pts).toHaveLength(6);
    const xOrder = [...SALTS].sort((a, b) => (a.inverseR0 as number) - (b.inverseR0 as number)).map((s) => s.label);
    expect(pts.map((p) => p.title.split(':')[0])).toEqual(xOrder);
  });

  it('places points monotonically: larger x → larger cx, higher energy → smaller cy', () => {
    for (const a of SALTS)
      for (const b of SALTS) {
        const pa = byLabel.get(a.label) as PointView;
        const pb = byLabel.get(b.label) as PointView;
        if ((a.inverseR0 as number) < (b.inverseR0 as number)) expect(pa.cx).toBeLessThan(pb.cx);
        if (a.kJPerMol > b.kJPerMol) expect(pa.cy).toBeLessThan(pb.cy);
      }
  });

  it('puts each point where the axis ticks say it is (linear scales, within rounding)', () => {
    const fromX = inverseScale(ticksOf(svg, 'iw-lc-xticks', 'x'));
    const yTicks = ticksOf(svg, 'iw-lc-yticks', 'y');
    // y tick labels sit 0.35 em below their gridline (font size 11)
    const fromY = inverseScale(yTicks, 11 * 0.35);
    for (const s of SALTS) {
      const p = byLabel.get(s.label) as PointView;
      expect(fromX(p.cx)).toBeCloseTo(s.inverseR0 as number, 3);
      expect(Math.abs(fromY(p.cy) - s.kJPerMol)).toBeLessThan(10); // 2-decimal pixels, ~0.1 px ≈ 1 kJ/mol
    }
    // and the gridlines are at the ticks
    const grid = all(svg, hasClass('iw-lc-grid'))[0].children;
    const horizontal = grid.filter((l) => l.attrs.y1 === l.attrs.y2).map((l) => num(l.attrs.y1));
    expect(horizontal.map((y) => Math.round(y + 11 * 0.35))).toEqual(yTicks.map((t) => Math.round(t.pos)));
  });

  it('uses nice ticks (1, 2, 2.5, 5 × 10ⁿ) that cover the data on the energy and melting-point axes', () => {
    for (const [cls, coord, values] of [
      ['iw-lc-yticks', 'y', SALTS.map((s) => s.kJPerMol)],
      ['iw-lc-mticks', 'y', SALTS.filter((s) => s.meltingPointC !== undefined).map((s) => s.meltingPointC as number)],
    ] as const) {
      const t = ticksOf(svg, cls, coord).map((k) => k.value);
      expect(t.length, cls).toBeGreaterThanOrEqual(3);
      const step = t[1] - t[0];
      expect(isNiceStep(step), `${cls} step ${step}`).toBe(true);
      for (let i = 1; i < t.length; i++) expect(t[i] - t[i - 1]).toBeCloseTo(step, 9);
      expect(t[0]).toBeLessThanOrEqual(Math.min(...values));
      expect(t[t.length - 1]).toBeGreaterThanOrEqual(Math.max(...values));
      // not absurdly wide: the data span at least a third of the axis
      expect(Math.max(...values) - Math.min(...values)).toBeGreaterThan((t[t.length - 1] - t[0]) / 3);
    }
  });

  it('runs the x axis edge to edge: nice ticks inside it, the outermost salts 3 % of the width from its ends', () => {
    // The first and last salt sit max(12 px, 3 % of the plot's width) inside the plot area, whatever the
    // spread of their radii: the rinse-trial salts span 0.333–0.353 Å⁻¹ and used to fill a fifth of the width.
    const narrow: LatticePoint[] = [0.333, 0.342, 0.344, 0.345, 0.353].map((x, i) => ({ ...SALTS[i], inverseR0: x }));
    for (const [salts, width] of [
      [SALTS, 640],
      [narrow, 640],
      [SALTS, 320],
      [narrow, 1200],
    ] as const) {
      const svg = parse(latticeChart([...salts], { width }));
      const plot = plotArea(svg);
      const edge = Math.max(12, 0.03 * (plot.x1 - plot.x0));
      const cxs = pointsOf(svg).map((p) => p.cx);
      expect(Math.min(...cxs) - plot.x0).toBeCloseTo(edge, 1);
      expect(plot.x1 - Math.max(...cxs)).toBeCloseTo(edge, 1);
      const ticks = ticksOf(svg, 'iw-lc-xticks', 'x');
      expect(ticks.length).toBeGreaterThanOrEqual(2);
      const step = ticks[1].value - ticks[0].value;
      expect(isNiceStep(step), `step ${step}`).toBe(true);
      for (const t of ticks) {
        expect(t.pos).toBeGreaterThanOrEqual(plot.x0 - 0.01);
        expect(t.pos).toBeLessThanOrEqual(plot.x1 + 0.01);
      }
    }
  });

  it('in charge-product mode, keeps half a unit beside the outermost charge products (room for dodged stacks)', () => {
    const svg = parse(latticeChart([...SALTS, NH4NO3], { x: 'charge-product' }));
    const plot = plotArea(svg);
    const fromX = inverseScale(ticksOf(svg, 'iw-lc-xticks', 'x'));
    expect(fromX(plot.x0)).toBeCloseTo(0.5, 2); // |z₊z₋| from 1 (NaCl) …
    expect(fromX(plot.x1)).toBeCloseTo(4.5, 2); // … to 4 (MgO)
    expect(ticksOf(svg, 'iw-lc-xticks', 'x').map((t) => t.value)).toEqual([1, 2, 3, 4]);
  });

  it('titles the axes with their units', () => {
    expect(one(svg, hasClass('iw-lc-ytitle')).text).toBe('Lattice energy (kJ/mol)');
    expect(one(svg, hasClass('iw-lc-xtitle')).text).toMatch(/^1\/\(r₊ \+ r₋\) \(Å⁻¹\)/);
    const c = parse(latticeChart(SALTS, { x: 'charge-product' }));
    expect(one(c, hasClass('iw-lc-xtitle')).text).toBe('Charge product |z₊z₋|');
  });

  it('in charge-product mode, x is |z₊z₋| with whole-number ticks; a stack is dodged sideways, keeping x order', () => {
    const c = parse(latticeChart([...SALTS, NH4NO3], { x: 'charge-product' }));
    const cp = pointsOf(c);
    expect(cp).toHaveLength(7); // NH₄NO₃ has no radius but a charge product
    const fromX = inverseScale(ticksOf(c, 'iw-lc-xticks', 'x'));
    const fromY = inverseScale(ticksOf(c, 'iw-lc-yticks', 'y'), 11 * 0.35);
    const salts = cp.map((p) => [...SALTS, NH4NO3].find((s) => s.label === p.title.split(':')[0]) as LatticePoint);
    cp.forEach((p, i) => {
      // within 0.4 of the gap between charge products (1 here), energy exact
      expect(Math.abs(fromX(p.cx) - salts[i].chargeProduct)).toBeLessThan(0.4);
      expect(Math.abs(fromY(p.cy) - salts[i].kJPerMol)).toBeLessThan(10);
    });
    for (let i = 0; i < cp.length; i++)
      for (let j = 0; j < cp.length; j++) {
        if (salts[i].chargeProduct < salts[j].chargeProduct) expect(cp[i].cx).toBeLessThan(cp[j].cx);
        // the five salts at |z₊z₋| = 1 lie within 380 kJ/mol (~30 px) of each other, yet no two markers overlap
        if (i < j) expect(Math.hypot(cp[i].cx - cp[j].cx, cp[i].cy - cp[j].cy), `${salts[i].label} / ${salts[j].label}`).toBeGreaterThanOrEqual(9);
      }
    // a label pushed away from its marker gets a leader from that marker's edge to the label's box
    const leaders = all(c, hasClass('iw-lc-leaders')).flatMap((g) => g.children);
    const boxes = one(c, hasClass('iw-lc-labels')).children.map(labelBox);
    for (const l of leaders) {
      const [x1, y1, x2, y2] = [l.attrs.x1, l.attrs.y1, l.attrs.x2, l.attrs.y2].map(Number);
      expect(cp.some((p) => Math.abs(Math.hypot(p.cx - x1, p.cy - y1) - 6) < 0.1)).toBe(true);
      expect(boxes.some((b) => x2 >= b.x0 - 1.5 && x2 <= b.x1 + 1.5 && y2 >= b.y0 - 1.5 && y2 <= b.y1 + 1.5)).toBe(true);
    }
    for (const t of ticksOf(c, 'iw-lc-xticks', 'x')) expect(Number.isInteger(t.value)).toBe(true);
    expect(all(c, hasClass('iw-lc-guide-line'))).toHaveLength(0);
  });

  it('labels every point with its formula, without labels overlapping each other', () => {
    const labels = one(svg, hasClass('iw-lc-labels')).children;
    expect(labels.map((l) => l.text).sort()).toEqual(SALTS.map((s) => s.label).sort());
    expect(overlappingPairs(labels)).toEqual([]);
    const boxes = labels.map(labelBox);
    // and no label sits on a marker's centre
    for (const p of pts) for (const b of boxes) expect(p.cx > b.x0 && p.cx < b.x1 && p.cy > b.y0 && p.cy < b.y1).toBe(false);
  });

  it('nudges labels of a stack of near-equal values apart (same x in charge-product mode)', () => {
    // Five salts within 16 px of each other at |z₊z₋| = 1: all labels to the right would overlap 7 times.
    const crowd: LatticePoint[] = [
      ['NaF', 910],
      ['NaCl', 787],
      ['KCl', 717],
      ['KBr', 689],
      ['NaBr', 747],
    ].map(([label, u]) => ({
      label: label as string,
      kJPerMol: u as number,
      method: 'Born–Haber cycle',
      estimate: false,
      inverseR0: null,
      chargeProduct: 1,
    }));
    const c = parse(latticeChart([...crowd, SALTS[2]], { x: 'charge-product' }));
    const labels = one(c, hasClass('iw-lc-labels')).children;
    expect(labels).toHaveLength(6);
    expect(overlappingPairs(labels)).toEqual([]);
  });
});

describe('latticeChart: markers, legend, tooltips', () => {
  it('distinguishes estimates (circles) from Born–Haber values (squares), with a legend entry for each', () => {
    const svg = parse(latticeChart(SALTS));
    for (const p of pointsOf(svg)) expect(p.shape).toBe(p.kind === 'estimate' ? 'circle' : 'rect');
    const items = all(svg, hasClass('iw-lc-legend-item'));
    const est = items.find((i) => i.attrs['data-kind'] === 'est') as El;
    const meas = items.find((i) => i.attrs['data-kind'] === 'meas') as El;
    expect(est.children.some((c) => c.name === 'circle')).toBe(true);
    expect(est.text).toMatch(/estimate/);
    expect(meas.children.some((c) => c.name === 'rect')).toBe(true);
    expect(meas.text).toMatch(/Born–Haber/);
    // The enthalpies behind the Born–Haber values were recalled, not measured here (server/src/chem/data/thermo.ts):
    // the legend and the description say so and do not call them measured.
    expect(meas.text).toBe('Born–Haber cycle (from recalled enthalpies)');
    expect(latticeChart(SALTS)).not.toMatch(/measured enthalp/);
  });

  it('shows only the legend entries for what is drawn', () => {
    const onlyEstimates = SALTS.filter((s) => s.estimate).map(({ meltingPointC: _, ...s }) => s);
    const svg = parse(latticeChart(onlyEstimates));
    const kinds = all(svg, hasClass('iw-lc-legend-item')).map((i) => i.attrs['data-kind']);
    expect(kinds).toEqual(['est']);
    expect(all(svg, (e) => e.name === 'rect' && hasClass('iw-lc-meas')(e))).toHaveLength(0);
  });

  it('gives each point a tooltip with formula, rounded value, method, x and melting point', () => {
    const svg = parse(latticeChart([...SALTS.slice(0, 3), { ...SALTS[3], kJPerMol: 3412.6 }]));
    const t = new Map(pointsOf(svg).map((p) => [p.title.split(':')[0], p.title]));
    expect(t.get('MgO')).toBe('MgO: ≈ 3800 kJ/mol (estimate, Born–Mayer equation)\n1/(r₊ + r₋) = 0.472 Å⁻¹, |z₊z₋| = 4\nmelting point 2852 °C');
    expect(t.get('CaO')).toMatch(/^CaO: ≈ 3413 kJ\/mol \(estimate, Kapustinskii equation\)\n1\/\(r₊ \+ r₋\) = 0\.417 Å⁻¹/);
    expect(t.get('CaO')).not.toMatch(/melting/);
    expect(t.get('NaCl')).toMatch(/^NaCl: 787 kJ\/mol \(Born–Haber cycle, from recalled enthalpies\)/);
    expect(t.get('NaCl')).not.toContain('≈');
  });
});

describe('latticeChart: melting points', () => {
  it('puts known melting points on a right axis in °C, one cross per salt, on its scale', () => {
    const svg = parse(latticeChart(SALTS));
    expect(one(svg, hasClass('iw-lc-mtitle')).text).toBe('Melting point (°C)');
    const mps = all(svg, hasClass('iw-lc-mp'));
    const withMp = SALTS.filter((s) => s.meltingPointC !== undefined);
    expect(mps).toHaveLength(withMp.length);
    const mTicks = ticksOf(svg, 'iw-lc-mticks', 'y');
    // the right axis runs upwards like the left one: a larger value, a smaller y
    for (let i = 1; i < mTicks.length; i++) {
      expect(mTicks[i].value).toBeGreaterThan(mTicks[i - 1].value);
      expect(mTicks[i].pos).toBeLessThan(mTicks[i - 1].pos);
    }
    const fromM = inverseScale(mTicks, 11 * 0.35);
    const crossY: Array<[number, number]> = [];
    const plot = plotArea(svg);
    const pts = new Map(pointsOf(svg).map((p) => [p.title.split(':')[0], p]));
    for (const g of mps) {
      const title = g.children.find((c) => c.name === 'title')?.text as string;
      const [, label, value] = /^(.+): melting point (\d+) °C$/.exec(title) as RegExpExecArray;
      const salt = withMp.find((s) => s.label === label) as LatticePoint;
      expect(Number(value)).toBe(salt.meltingPointC);
      // the cross is centred at the salt's x and at its melting point on the right axis
      const d = (g.children.find((c) => c.name === 'path') as El).attrs.d;
      const nums = (d.match(/-?\d+(\.\d+)?/g) as string[]).map(Number);
      const cx = (nums[0] + nums[2]) / 2;
      const cy = (nums[1] + nums[3]) / 2;
      expect(cx).toBeCloseTo((pts.get(label) as PointView).cx, 1);
      expect(Math.abs(fromM(cy) - (salt.meltingPointC as number))).toBeLessThan(10);
      crossY.push([salt.meltingPointC as number, cy]);
      expect(cy).toBeGreaterThanOrEqual(plot.y0 - 0.01);
      expect(cy).toBeLessThanOrEqual(plot.y1 + 0.01);
    }
    for (const [ma, ya] of crossY) for (const [mb, yb] of crossY) if (ma > mb) expect(ya).toBeLessThan(yb);
    expect(all(svg, hasClass('iw-lc-legend-item')).some((i) => i.attrs['data-kind'] === 'melt' && /melting point/.test(i.text))).toBe(true);
    expect(one(svg, (e) => e.name === 'desc').text).toMatch(/Melting points of 5 salts on the right axis/);
  });

  it('has no right axis when no melting point is known (or only non-finite ones)', () => {
    const none = SALTS.map((s) => ({ ...s, meltingPointC: s.meltingPointC === undefined ? undefined : NaN }));
    const svg = parse(latticeChart(none));
    expect(all(svg, hasClass('iw-lc-mticks'))).toHaveLength(0);
    expect(all(svg, hasClass('iw-lc-mp'))).toHaveLength(0);
    expect(all(svg, hasClass('iw-lc-legend-item')).map((i) => i.attrs['data-kind'])).not.toContain('melt');
  });
});

describe('latticeChart: least-squares guides', () => {
  it('fits slope and intercept exactly on synthetic points', () => {
    expect(leastSquares([1, 2, 3], [2, 4, 7])).toEqual({ slope: 2.5, intercept: expect.closeTo(-2 / 3, 12), n: 3 });
    const fit = leastSquares(
      [0.3, 0.35, 0.4, 0.45],
      [0.3, 0.35, 0.4, 0.45].map((x) => 2000 * x - 100),
    ) as NonNullable<ReturnType<typeof leastSquares>>;
    expect(fit.slope).toBeCloseTo(2000, 8);
    expect(fit.intercept).toBeCloseTo(-100, 8);
    expect(leastSquares([0.4, 0.4, 0.4], [1, 2, 3])).toBeNull(); // one x value
    expect(leastSquares([0.4], [1])).toBeNull();
  });

  it('draws one dashed guide per charge-product group of ≥ 3 salts, along the fitted line', () => {
    // z = 1: U = 2200·x − 0 exactly; z = 4: U = 8000·x + 50 exactly; z = 2: only two salts, no guide.
    const mk = (label: string, x: number, z: number, u: number): LatticePoint => ({
      label,
      kJPerMol: u,
      method: 'Kapustinskii equation',
      estimate: true,
      inverseR0: x,
      chargeProduct: z,
    });
    const pts = [
      mk('A1', 0.3, 1, 660),
      mk('B1', 0.36, 1, 792),
      mk('C1', 0.46, 1, 1012),
      mk('A4', 0.4, 4, 3250),
      mk('B4', 0.44, 4, 3570),
      mk('C4', 0.47, 4, 3810),
      mk('A2', 0.41, 2, 2400),
      mk('B2', 0.44, 2, 2600),
    ];
    const svg = parse(latticeChart(pts));
    const guides = all(svg, hasClass('iw-lc-guide-line'));
    expect(guides.map((g) => g.attrs['data-z'])).toEqual(['1', '4']);
    const fromX = inverseScale(ticksOf(svg, 'iw-lc-xticks', 'x'));
    const fromY = inverseScale(ticksOf(svg, 'iw-lc-yticks', 'y'), 11 * 0.35);
    for (const [g, slope, intercept, x0, x1] of [
      [guides[0], 2200, 0, 0.3, 0.46],
      [guides[1], 8000, 50, 0.4, 0.47],
    ] as const) {
      const line = g.children.find((c) => c.name === 'line') as El;
      expect(line.attrs['stroke-dasharray']).toBeTruthy();
      const ax = fromX(num(line.attrs.x1));
      const ay = fromY(num(line.attrs.y1));
      const bx = fromX(num(line.attrs.x2));
      const by = fromY(num(line.attrs.y2));
      expect(ax).toBeCloseTo(x0, 3);
      expect(bx).toBeCloseTo(x1, 3);
      expect(Math.abs((by - ay) / (bx - ax) - slope) / slope).toBeLessThan(0.01);
      expect(Math.abs(ay - (slope * ax + intercept))).toBeLessThan(10);
      expect(g.children.find((c) => c.name === 'title')?.text).toMatch(/guide.*not a model/i);
    }
    expect(all(svg, hasClass('iw-lc-legend-item')).find((i) => i.attrs['data-kind'] === 'guide')?.text).toMatch(/guide.*not a model/);
  });

  it('draws no guide for a group whose salts share one x value', () => {
    const same: LatticePoint[] = [700, 750, 800].map((u, i) => ({
      label: `S${i}`,
      kJPerMol: u,
      method: 'Kapustinskii equation',
      estimate: true,
      inverseR0: 0.35,
      chargeProduct: 1,
    }));
    const svg = parse(latticeChart(same));
    expect(all(svg, hasClass('iw-lc-guide-line'))).toHaveLength(0);
    const cxs = new Set(pointsOf(svg).map((p) => p.cx));
    expect(cxs.size).toBe(1);
  });

  it('draws no guide for salts bunched within 5 % of one x (three sulfates at 0.343–0.346 Å⁻¹)', () => {
    const bunched: LatticePoint[] = [
      [0.343, 2905],
      [0.345, 2914],
      [0.346, 2923],
    ].map(([x, u], i) => ({
      label: `T${i}`,
      kJPerMol: u,
      method: 'Kapustinskii equation',
      estimate: true,
      inverseR0: x,
      chargeProduct: 4,
    }));
    expect(all(parse(latticeChart(bunched)), hasClass('iw-lc-guide-line'))).toHaveLength(0);
  });
});

describe('latticeChart: bad input', () => {
  it('escapes <&"\' in labels, title and method, and drops characters XML forbids', () => {
    const nasty = '<b>&"Na\'Cl"</b>';
    const s = latticeChart(
      [
        { ...SALTS[0], label: nasty, method: 'A & B <cycle>' },
        { ...SALTS[2], label: 'Mg\u0001O\uD800' },
      ],
      { title: 'Title <script>alert("x")</script> & more' },
    );
    expect(s).not.toContain('<b>');
    expect(s).not.toContain('<script>');
    const svg = parse(s); // strict parser: throws on a stray < or &
    expect(svg.children[0].text).toBe('Title <script>alert("x")</script> & more');
    const labels = one(svg, hasClass('iw-lc-labels')).children.map((l) => l.text);
    expect(labels).toContain(nasty);
    expect(labels).toContain('MgO');
    const titles = pointsOf(svg).map((p) => p.title);
    expect(titles.some((t) => t.startsWith(`${nasty}: 787 kJ/mol (A & B <cycle>`))).toBe(true);
  });

  it('drops NaN, Infinity and non-positive values without crashing, and says so', () => {
    const bad: LatticePoint[] = [
      { ...SALTS[0], kJPerMol: NaN },
      { ...SALTS[1], kJPerMol: Infinity },
      { ...SALTS[2], kJPerMol: -5 },
      { ...SALTS[3], inverseR0: NaN },
      { ...SALTS[4], inverseR0: -Infinity },
    ];
    const s = latticeChart([...bad, SALTS[5]]);
    expect(s).not.toMatch(/NaN|Infinity/);
    const svg = parse(s);
    expect(pointsOf(svg).map((p) => p.title.split(':')[0])).toEqual(['CaF₂']);
    expect(one(svg, (e) => e.name === 'desc').text).toMatch(/5 entries with missing or invalid values left out/);
    // all bad: the message, not an empty string
    const none = latticeChart(bad);
    expect(parse(none).text).toMatch(/No salts with lattice energies to chart/);
  });

  it('survives values far too small for tick labels (a melting point of 1e-200 °C)', () => {
    const tiny = [
      { ...SALTS[0], meltingPointC: 1.1e-200 },
      { ...SALTS[1], kJPerMol: 1e-200, meltingPointC: 2e-200 },
    ];
    const svg = parse(latticeChart(tiny));
    expect(pointsOf(svg)).toHaveLength(2);
    expect(ticksOf(svg, 'iw-lc-mticks', 'y').every((t) => Number.isFinite(t.value))).toBe(true);
  });

  it('survives garbage that slips past the types', () => {
    const garbage = [null, 42, 'NaCl', { label: undefined, kJPerMol: 800, inverseR0: 0.35, chargeProduct: 1 }, {}] as unknown as LatticePoint[];
    const svg = parse(latticeChart(garbage, { x: 'sideways' as never, title: 7 as never }));
    expect(pointsOf(svg)).toHaveLength(1);
    expect(pointsOf(svg)[0].title).toMatch(/^\?: ≈ 800 kJ\/mol \(estimate, model\)/);
    expect(() => latticeChart(undefined as never, null as never)).not.toThrow();
    expect(parse(latticeChart(undefined as never)).text).toMatch(/No salts with lattice energies to chart/);
  });

  it('says there is nothing to chart for an empty list, as a small svg', () => {
    const s = latticeChart([]);
    const svg = parse(s);
    expect(svg.name).toBe('svg');
    expect(svg.attrs.role).toBe('img');
    expect(svg.attrs.viewBox).toMatch(/^0 0 640 \d+$/);
    expect(Number(svg.attrs.height)).toBeLessThan(100);
    expect(svg.children[0].name).toBe('title');
    expect(svg.text).toMatch(/No salts with lattice energies to chart/);
    expect(pointsOf(svg)).toHaveLength(0);
  });

  it('leaves out salts without radii in the inverse-radius mode and counts them', () => {
    const svg = parse(latticeChart([...SALTS, NH4NO3]));
    expect(pointsOf(svg)).toHaveLength(6);
    expect(one(svg, (e) => e.name === 'desc').text).toMatch(/1 salt without known ionic radii left out \(NH₄NO₃\)/);
    const only = parse(latticeChart([NH4NO3]));
    expect(only.text).toMatch(/No salts with lattice energies to chart/);
    expect(one(only, (e) => e.name === 'desc').text).toMatch(/without known ionic radii/);
    expect(pointsOf(parse(latticeChart([NH4NO3], { x: 'charge-product' })))).toHaveLength(1);
  });

  it('charts a single salt with a sensible range around it', () => {
    const svg = parse(latticeChart([SALTS[0]]));
    const [p] = pointsOf(svg);
    const plot = plotArea(svg);
    expect(p.cx).toBeGreaterThan(plot.x0);
    expect(p.cx).toBeLessThan(plot.x1);
    const y = ticksOf(svg, 'iw-lc-yticks', 'y').map((t) => t.value);
    expect(y[0]).toBeLessThanOrEqual(787);
    expect(y[y.length - 1]).toBeGreaterThanOrEqual(787);
    expect(y[y.length - 1] - y[0]).toBeGreaterThanOrEqual(0.2 * 787 - 1e-9); // not a ±5 kJ/mol magnifying glass
  });

  it('charts 500 salts: well-formed, all inside, labels thinned out and counted', () => {
    const many: LatticePoint[] = Array.from({ length: 500 }, (_, i) => ({
      label: `X${i}`,
      kJPerMol: 600 + ((i * 7919) % 3200),
      method: 'Kapustinskii equation',
      estimate: i % 3 !== 0,
      inverseR0: 0.3 + ((i * 104729) % 1000) / 5000,
      chargeProduct: 1 + (i % 4),
      meltingPointC: i % 5 ? undefined : 500 + i * 4,
    }));
    const svg = parse(latticeChart(many));
    const pts = pointsOf(svg);
    expect(pts).toHaveLength(500);
    const plot = plotArea(svg);
    for (const p of pts) {
      expect(p.cx).toBeGreaterThanOrEqual(plot.x0 - 0.01);
      expect(p.cx).toBeLessThanOrEqual(plot.x1 + 0.01);
      expect(p.cy).toBeGreaterThanOrEqual(plot.y0 - 0.01);
      expect(p.cy).toBeLessThanOrEqual(plot.y1 + 0.01);
    }
    const labels = one(svg, hasClass('iw-lc-labels')).children.length;
    expect(labels).toBeLessThan(500);
    expect(one(svg, (e) => e.name === 'desc').text).toContain(`${500 - labels} formula labels left out`);
  });
});

describe('niceTicks', () => {
  it('picks steps of 1, 2, 2.5 or 5 × 10ⁿ', () => {
    expect(niceTicks(0.313, 0.479, 5).ticks).toEqual([0.3, 0.35, 0.4, 0.45, 0.5]);
    expect(niceTicks(563, 3954, 5).step).toBe(1000);
    expect(niceTicks(0, 10, 4).step).toBe(2.5);
    expect(niceTicks(0.85, 4.15, 6, true).ticks).toEqual([0, 1, 2, 3, 4, 5]);
    expect(niceTicks(0, 10, 4, true).step).toBe(5); // 2.5 is no whole number: the next step up
    expect(niceTicks(0, 20, 4, true).step).toBe(5);
    expect(niceTicks(0, 1, 5, true).step).toBe(1); // nothing below 1
  });

  it('covers any range with evenly spaced nice ticks', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.integer({ min: 2, max: 10 }),
        fc.boolean(),
        (lo, span, target, integer) => {
          const hi = lo + span;
          const t = niceTicks(lo, hi, target, integer);
          expect(t.ticks[0]).toBeLessThanOrEqual(lo);
          expect(t.ticks[t.ticks.length - 1]).toBeGreaterThanOrEqual(hi);
          expect(isNiceStep(t.step)).toBe(true);
          if (integer) expect(Number.isInteger(t.step)).toBe(true);
          expect(t.ticks.length).toBeGreaterThanOrEqual(2);
          expect(t.ticks.length).toBeLessThanOrEqual(2 * target + 3);
          for (let i = 1; i < t.ticks.length; i++) expect(Math.abs(t.ticks[i] - t.ticks[i - 1] - t.step)).toBeLessThan(t.step * 1e-6);
        },
      ),
    );
  });

  it('ticksWithin: nice ticks inside a range, at least two', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
        fc.integer({ min: 2, max: 12 }),
        (lo, span, target) => {
          const hi = lo + span;
          const t = ticksWithin(lo, hi, target);
          expect(t.ticks.length).toBeGreaterThanOrEqual(2);
          expect(isNiceStep(t.step)).toBe(true);
          for (const v of t.ticks) {
            expect(v).toBeGreaterThanOrEqual(lo - span * 1e-9);
            expect(v).toBeLessThanOrEqual(hi + span * 1e-9);
          }
        },
      ),
    );
    expect(ticksWithin(0.5, 4.5, 6, true).ticks).toEqual([1, 2, 3, 4]);
    expect(ticksWithin(NaN, 1, NaN).ticks.every(Number.isFinite)).toBe(true); // no endless search for more ticks
  });

  it('widens a zero or non-finite range instead of failing', () => {
    const z = niceTicks(5, 5);
    expect(z.ticks[0]).toBeLessThan(5);
    expect(z.ticks[z.ticks.length - 1]).toBeGreaterThan(5);
    expect(niceTicks(NaN, Infinity).ticks.every(Number.isFinite)).toBe(true);
    expect(niceTicks(5e-324, 5e-324).ticks.every(Number.isFinite)).toBe(true);
    const huge = niceTicks(-1e308, 1e308);
    expect(huge.ticks.every(Number.isFinite)).toBe(true);
  });
});
