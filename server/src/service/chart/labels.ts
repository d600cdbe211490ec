/** Formula labels and guide captions (first cut: the nudging placement, moved as it was). */
import type { Rect, Segment } from './geometry';
import type { Plotted } from './input';
import { FONT, type ChartLayout } from './layout';
import { textWidth } from './text';

/** Up to this many salts every label is drawn, overlapping or not; above it, unplaceable labels are left out. */
const ALWAYS_LABEL = 30;
/** Label spots from this index on are a line or more away from the marker and get a leader line. */
const FAR_SPOTS = 8;

export interface PlacedLabel {
  text: string;
  x: number;
  y: number;
}

export interface LabelPlacement {
  labels: PlacedLabel[];
  leaders: Segment[];
  /** Per guide line, where its caption's middle and baseline are. */
  captions: Array<{ x: number; y: number }>;
  omitted: number;
}

const overlap = (a: Rect, b: Rect) =>
  Math.max(0, Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0)) * Math.max(0, Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0));

/** Boxes bucketed on a coarse grid so 500 labels cost little. */
class BoxIndex {
  private cells = new Map<string, Rect[]>();
  constructor(private size = 40) {}
  private keys(b: Rect): string[] {
    const out: string[] = [];
    for (let i = Math.floor(b.x0 / this.size); i <= Math.floor(b.x1 / this.size); i++)
      for (let j = Math.floor(b.y0 / this.size); j <= Math.floor(b.y1 / this.size); j++) out.push(`${i},${j}`);
    return out;
  }
  add(b: Rect) {
    for (const k of this.keys(b)) {
      const list = this.cells.get(k);
      if (list) list.push(b);
      else this.cells.set(k, [b]);
    }
  }
  overlapWith(b: Rect, except?: Rect): number {
    const seen = new Set<Rect>();
    let sum = 0;
    for (const k of this.keys(b))
      for (const o of this.cells.get(k) ?? []) {
        if (o === except || seen.has(o)) continue;
        seen.add(o);
        sum += overlap(b, o);
      }
    return sum;
  }
}

export function placeLabels(plotted: readonly Plotted[], layout: ChartLayout): LabelPlacement {
  const { plot, marks, marker } = layout;
  const r = marker.radius;
  const cross = marker.cross;
  const obstacles = new BoxIndex();
  const placed = new BoxIndex();
  const markerBoxes: Rect[] = marks.map(({ cx, cy }) => ({ x0: cx - r - 1, y0: cy - r - 1, x1: cx + r + 1, y1: cy + r + 1 }));
  for (const b of markerBoxes) obstacles.add(b);
  for (const c of marks)
    if (c.meltY !== null) obstacles.add({ x0: c.cx - cross - 1, y0: c.meltY - cross - 1, x1: c.cx + cross + 1, y1: c.meltY + cross + 1 });
  for (const g of layout.guides) {
    const { x1, y1, x2, y2 } = g.segment;
    const len = Math.hypot(x2 - x1, y2 - y1);
    const steps = Math.max(1, Math.ceil(len / 6));
    for (let k = 0; k <= steps; k++) {
      const px = x1 + ((x2 - x1) * k) / steps;
      const py = y1 + ((y2 - y1) * k) / steps;
      obstacles.add({ x0: px - 2.5, y0: py - 2.5, x1: px + 2.5, y1: py + 2.5 });
    }
  }
  const captions: Array<{ x: number; y: number }> = [];
  for (const g of layout.guides) {
    const s = g.segment;
    const tw = textWidth(g.caption, FONT.guide);
    let best: { x: number; y: number; box: Rect; score: number } | null = null;
    for (const t of [0.5, 0.35, 0.65, 0.2, 0.8, 0.05, 0.95])
      for (const below of [false, true]) {
        const px = s.x1 + (s.x2 - s.x1) * t;
        const py = s.y1 + (s.y2 - s.y1) * t;
        const x = Math.max(plot.x0 + 2 + tw / 2, Math.min(plot.x1 - 2 - tw / 2, px));
        const y = below ? py + 14 : py - 6;
        const box = { x0: x - tw / 2, y0: y - 9, x1: x + tw / 2, y1: y + 2 };
        const outside = box.y0 < plot.y0 || box.y1 > plot.y1 - 1;
        const score = obstacles.overlapWith(box) + (outside ? 1e6 : 0);
        if (!best || score < best.score - 0.5) best = { x, y, box, score };
      }
    const chosen = best as { x: number; y: number; box: Rect };
    captions.push({ x: chosen.x, y: chosen.y });
    obstacles.add(chosen.box);
  }

  const labels: PlacedLabel[] = [];
  const leaders: Segment[] = [];
  let omitted = 0;
  const lh = FONT.label;
  plotted.forEach((p, i) => {
    const { cx, cy } = marks[i];
    const w = textWidth(p.shown, FONT.label);
    const g = r + 3;
    const spots: Array<[number, number]> = [
      [cx + g, cy + lh * 0.35],
      [cx - g - w, cy + lh * 0.35],
      [cx - w / 2, cy - g - 1],
      [cx - w / 2, cy + g + lh * 0.8],
      [cx + g - 2, cy - g],
      [cx + g - 2, cy + g + lh * 0.7],
      [cx - g - w + 2, cy - g],
      [cx - g - w + 2, cy + g + lh * 0.7],
      [cx + g, cy + lh * 1.35],
      [cx + g, cy - lh * 0.65],
      [cx - g - w, cy + lh * 1.35],
      [cx - g - w, cy - lh * 0.65],
      [cx + g, cy + lh * 2.35],
      [cx + g, cy - lh * 1.65],
      [cx - g - w, cy + lh * 2.35],
      [cx - g - w, cy - lh * 1.65],
    ];
    let best: { x: number; y: number; box: Rect; score: number; k: number } | null = null;
    for (let k = 0; k < spots.length; k++) {
      const [bx, by] = spots[k];
      const box = { x0: bx, y0: by - lh * 0.8, x1: bx + w, y1: by + lh * 0.2 };
      const outside = box.x0 < plot.x0 + 1 || box.x1 > plot.x1 - 1 || box.y0 < plot.y0 - 6 || box.y1 > plot.y1 - 1;
      const score = obstacles.overlapWith(box, markerBoxes[i]) + placed.overlapWith(box) + (outside ? 1e6 : 0) + k * 0.01;
      if (!best || score < best.score) best = { x: bx, y: by, box, score, k };
      if (score < 1) break;
    }
    if (!best) return;
    if (best.score >= 1 && plotted.length > ALWAYS_LABEL) {
      omitted++;
      return;
    }
    placed.add(best.box);
    labels.push({ text: p.shown, x: best.x, y: best.y });
    if (best.k >= FAR_SPOTS) {
      const b = best.box;
      const tx = Math.max(b.x0, Math.min(b.x1, cx));
      const ty = Math.max(b.y0, Math.min(b.y1, cy));
      const len = Math.hypot(tx - cx, ty - cy);
      if (len > r + 4) {
        const ux = (tx - cx) / len;
        const uy = (ty - cy) / len;
        leaders.push({ x1: cx + ux * (r + 1.5), y1: cy + uy * (r + 1.5), x2: tx - ux, y2: ty - uy });
      }
    }
  });
  return { labels, leaders, captions, omitted };
}
