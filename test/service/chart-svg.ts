/**
 * Reading the lattice-energy chart back, for the chart tests: a strict XML parser (sax) into a tiny DOM, and
 * the chart's parts (markers, crosses, labels, leaders, ticks) as plain geometry, read from the svg alone.
 */
import { createRequire } from 'node:module';
import { expect } from 'vitest';
import { textWidth } from '../../server/src/service/chart';

interface SaxParser {
  onopentag: (node: { name: string; attributes: Record<string, string> }) => void;
  onclosetag: (name: string) => void;
  ontext: (t: string) => void;
  onerror: (e: Error) => void;
  write(s: string): SaxParser;
  close(): SaxParser;
}
const sax = createRequire(import.meta.url)('sax') as { parser(strict: boolean): SaxParser };

export interface El {
  name: string;
  attrs: Record<string, string>;
  children: El[];
  text: string; // all text inside, concatenated
  parent: El | null;
}

/** The svg as a tree; throws on anything that is not well-formed XML. */
export function parse(svg: string): El {
  const p = sax.parser(true);
  const root: El = { name: '#root', attrs: {}, children: [], text: '', parent: null };
  let cur = root;
  p.onerror = (e) => {
    throw e;
  };
  p.onopentag = (node) => {
    const el: El = { name: node.name, attrs: { ...node.attributes }, children: [], text: '', parent: cur };
    cur.children.push(el);
    cur = el;
  };
  p.onclosetag = () => {
    cur = cur.parent as El;
  };
  p.ontext = (t) => {
    for (let e: El | null = cur; e; e = e.parent) e.text += t;
  };
  p.write(svg).close();
  expect(root.children).toHaveLength(1);
  return root.children[0];
}

export const all = (el: El, pred: (e: El) => boolean): El[] => {
  const out: El[] = [];
  const walk = (e: El) => {
    if (pred(e)) out.push(e);
    e.children.forEach(walk);
  };
  walk(el);
  return out;
};
export const hasClass = (c: string) => (e: El) => (e.attrs.class ?? '').split(/\s+/).includes(c);
export const one = (el: El, pred: (e: El) => boolean): El => {
  const found = all(el, pred);
  expect(found).toHaveLength(1);
  return found[0];
};
export const num = (s: string | undefined) => Number(s);
const tickValue = (t: string) => Number(t.replace('−', '-'));

export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface PointView {
  /** The salt, from the tooltip. */
  salt: string;
  title: string;
  kind: string;
  cx: number;
  cy: number;
  shape: string;
  /** What the marker covers. */
  box: Box;
}

export function pointsOf(svg: El): PointView[] {
  return all(svg, hasClass('iw-lc-pt')).map((g) => {
    const title = g.children.find((c) => c.name === 'title')?.text ?? '';
    const m = g.children.find((c) => c.name === 'circle' || c.name === 'rect') as El;
    const cx = m.name === 'circle' ? num(m.attrs.cx) : num(m.attrs.x) + num(m.attrs.width) / 2;
    const cy = m.name === 'circle' ? num(m.attrs.cy) : num(m.attrs.y) + num(m.attrs.height) / 2;
    const half = m.name === 'circle' ? num(m.attrs.r) : num(m.attrs.width) / 2;
    return {
      salt: title.split(': ')[0],
      title,
      kind: g.attrs['data-kind'],
      cx,
      cy,
      shape: m.name,
      box: { x0: cx - half, y0: cy - half, x1: cx + half, y1: cy + half },
    };
  });
}

export interface CrossView {
  salt: string;
  cx: number;
  cy: number;
  box: Box;
}

/** The melting-point crosses, from their paths and tooltips. */
export function crossesOf(svg: El): CrossView[] {
  return all(svg, hasClass('iw-lc-mp')).map((g) => {
    const title = g.children.find((c) => c.name === 'title')?.text ?? '';
    const d = (g.children.find((c) => c.name === 'path') as El).attrs.d;
    const [x0, y0, x1, y1] = (d.match(/-?\d+(\.\d+)?/g) as string[]).map(Number);
    return { salt: title.replace(/: melting point .*$/, ''), cx: (x0 + x1) / 2, cy: (y0 + y1) / 2, box: { x0, y0, x1, y1 } };
  });
}

export function plotArea(svg: El): Box {
  const r = one(svg, hasClass('iw-lc-plot'));
  const x = num(r.attrs.x);
  const y = num(r.attrs.y);
  return { x0: x, y0: y, x1: x + num(r.attrs.width), y1: y + num(r.attrs.height) };
}

/** Tick values with their pixel positions, from one of the tick label groups. */
export function ticksOf(svg: El, cls: string, coord: 'x' | 'y') {
  const g = all(svg, hasClass(cls));
  if (g.length === 0) return [];
  return g[0].children.filter((c) => c.name === 'text').map((t) => ({ value: tickValue(t.text), pos: num(t.attrs[coord]) }));
}

/** A linear map from pixel to data value, fitted through the tick labels' positions. */
export function inverseScale(ticks: Array<{ value: number; pos: number }>, offset = 0) {
  const a = ticks[0];
  const b = ticks[ticks.length - 1];
  return (px: number) => a.value + ((px - (a.pos - offset)) / (b.pos - a.pos)) * (b.value - a.value);
}

/** A label's box, with the chart's own width estimate (the font is the host's, so no exact metrics). */
export const labelBox = (l: El): Box => {
  const x = num(l.attrs.x);
  const y = num(l.attrs.y);
  return { x0: x, x1: x + textWidth(l.text, 11.5), y0: y - 9, y1: y + 2 };
};

export const labelsOf = (svg: El): El[] => one(svg, hasClass('iw-lc-labels')).children;

export interface Leader {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}
export const leadersOf = (svg: El): Leader[] =>
  all(svg, hasClass('iw-lc-leaders'))
    .flatMap((g) => g.children)
    .map((l) => ({ x1: num(l.attrs.x1), y1: num(l.attrs.y1), x2: num(l.attrs.x2), y2: num(l.attrs.y2) }));

/** Whether two boxes share more than an edge. */
export const boxesOverlap = (a: Box, b: Box) => !(a.x1 <= b.x0 || b.x1 <= a.x0 || a.y1 <= b.y0 || b.y1 <= a.y0);

/** Distance from a point to a box (0 inside). */
export const distanceToBox = (b: Box, x: number, y: number) => Math.hypot(Math.max(b.x0 - x, 0, x - b.x1), Math.max(b.y0 - y, 0, y - b.y1));

export function overlappingPairs(labels: El[]): string[] {
  const boxes = labels.map(labelBox);
  const out: string[] = [];
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++) if (boxesOverlap(boxes[i], boxes[j])) out.push(`${labels[i].text} / ${labels[j].text}`);
  return out;
}

/**
 * For each formula label, the salt it is read as belonging to, from the geometry alone: the salt of the
 * marker a leader line (ending at the label's box) starts from, or else the salt of the nearest mark (energy
 * marker or melting-point cross, by the distance from the mark's centre to the label's box).
 */
export function labelReadings(svg: El): Array<{ text: string; salt: string; by: 'leader' | 'nearest'; margin: number }> {
  const points = pointsOf(svg);
  const marks = [...points.map((p) => ({ salt: p.salt, cx: p.cx, cy: p.cy })), ...crossesOf(svg)];
  const leaders = leadersOf(svg);
  return labelsOf(svg).map((l) => {
    const box = labelBox(l);
    const leader = leaders.find((s) => distanceToBox(box, s.x2, s.y2) <= 1.5);
    if (leader) {
      // A leader starts 1.5 px beyond the marker's radius (4.5 px, 3 px on charts of over 100 salts).
      const start = points.length > 100 ? 4.5 : 6;
      const off = (p: PointView) => Math.abs(Math.hypot(p.cx - leader.x1, p.cy - leader.y1) - start);
      const from = [...points].sort((a, b) => off(a) - off(b))[0];
      return { text: l.text, salt: from.salt, by: 'leader' as const, margin: Infinity };
    }
    const byDistance = marks.map((m) => ({ salt: m.salt, d: distanceToBox(box, m.cx, m.cy) })).sort((a, b) => a.d - b.d);
    const other = byDistance.find((m) => m.salt !== byDistance[0].salt);
    return { text: l.text, salt: byDistance[0].salt, by: 'nearest' as const, margin: other ? other.d - byDistance[0].d : Infinity };
  });
}
