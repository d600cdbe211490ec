/**
 * Where the formula labels and the guide captions go.
 *
 * The placement, greedy with collision boxes:
 * 1. Hard obstacles: every mark (energy marker, melting-point cross) as its box with 1 px clearance. A label
 *    never overlaps a mark (its own included), another label, a leader line, or the edge of the plot area.
 *    Soft obstacles: the guide lines and the melting-point connectors; a label may cross them, but within a
 *    group of candidates a spot that crosses none is preferred.
 * 2. Order: labels of crowded points first (most marks of other salts within CROWD px), then drawing order.
 *    A crowded point has few free spots; an isolated one still finds room afterwards.
 * 3. Candidates, in two passes over all labels (the second only for labels the first could not place):
 *    - near: eight spots around the marker (right, left, above, below, the four corners). A near label must
 *      be clearly nearest to its own marker: every mark of another salt is at least 1.5 × its own distance
 *      + 2 px from the label's box. Otherwise "NaCl" could end up beside another salt's cross.
 *    - far: beside the marker slid by one or two lines, then 16 directions × 5 rings, one to six lines out;
 *      each with a leader line from the marker's edge to the box. The leader must cross no mark of another
 *      salt and no label, and the box must keep BESIDE px from every other salt's mark, so that it is not
 *      read as that salt's label.
 *    In each pass the first candidate that passes is taken. Near spots go to everyone before any leader is
 *    drawn, so that a leader never takes the spot beside a marker whose turn comes later.
 * 4. A label with no candidate left is dropped, never drawn over something: its point keeps its tooltip (the
 *    marker's <title> names the salt), the <desc> counts the dropped labels, and a note in the chart says
 *    how many (draw.ts).
 *
 * Guide captions come after the formula labels, at a few spots along their line, under the same hard rules;
 * one that does not fit is left out (the line's tooltip and the legend say what it is).
 *
 * Deterministic: no randomness, and every decision depends on whether something is there, never on the
 * order in which the R-trees return it. The R-trees only narrow the search; every overlap is then decided
 * exactly (boxes that share an edge do not overlap).
 */
import RBush from 'rbush';
import { distanceToRect, nearestPointOf, rectInside, rectsOverlap, segmentBounds, segmentCrossesRect, squareAround, type Rect, type Segment } from './geometry';
import type { Plotted } from './input';
import { FONT, type ChartLayout } from './layout';
import { textWidth } from './text';

/** A mark (the salt's energy marker or melting-point cross) that no label may cover. */
export interface Mark {
  /** The salt it belongs to. */
  owner: number;
  /** Its centre. */
  x: number;
  y: number;
  /** What it covers, with clearance. */
  box: Rect;
}

/** A label to place beside its salt's energy marker. */
export interface LabelRequest {
  owner: number;
  width: number;
  height: number;
  /** The marker's centre and radius. */
  x: number;
  y: number;
  radius: number;
}

export interface PlacedLabel {
  owner: number;
  box: Rect;
  /** From the marker's edge to the box, for a label placed away from its marker. */
  leader: Segment | null;
}

export interface Placement {
  /** In the order placed. */
  placed: PlacedLabel[];
  /** Owners whose label found no room, in request order. */
  dropped: number[];
}

/** Other salts' marks within this distance make a point crowded (placed first). */
const CROWD = 36;
/** How much farther than its own marker any other salt's mark must be from a near label. */
const NEAREST_RATIO = 1.5;
const NEAREST_SLACK = 2;
/** Far labels keep this far from other salts' marks. */
const BESIDE = 14;

interface Entry {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
  owner: number;
  /** For marks, the centre; for leaders and soft lines, the segment. */
  x?: number;
  y?: number;
  segment?: Segment;
}

const entry = (box: Rect, owner: number, extra: Partial<Entry> = {}): Entry => ({
  minX: box.x0,
  minY: box.y0,
  maxX: box.x1,
  maxY: box.y1,
  owner,
  ...extra,
});

const query = (box: Rect, grow = 0) => ({ minX: box.x0 - grow, minY: box.y0 - grow, maxX: box.x1 + grow, maxY: box.y1 + grow });
const boxOf = (e: Entry): Rect => ({ x0: e.minX, y0: e.minY, x1: e.maxX, y1: e.maxY });

/** What is already on the plot, and the questions a candidate asks of it. */
export class LabelSpace {
  private readonly marks = new RBush<Entry>();
  private readonly labels = new RBush<Entry>();
  private readonly leaders = new RBush<Entry>();
  private readonly soft = new RBush<Entry>();

  constructor(
    private readonly bounds: Rect,
    marks: readonly Mark[],
    softLines: readonly Segment[] = [],
  ) {
    this.marks.load(marks.map((m) => entry(m.box, m.owner, { x: m.x, y: m.y })));
    this.soft.load(softLines.map((s) => entry(segmentBounds(s), -1, { segment: s })));
  }

  /** Inside the plot area, and clear of every mark, label and leader. */
  isFree(box: Rect): boolean {
    if (!rectInside(box, this.bounds)) return false;
    const q = query(box);
    const overlaps = (e: Entry) => rectsOverlap(box, boxOf(e));
    if (this.marks.search(q).some(overlaps) || this.labels.search(q).some(overlaps)) return false;
    return !this.leaders.search(q).some((e) => segmentCrossesRect(e.segment as Segment, box));
  }

  /** Whether a guide line or a connector passes through the box. */
  crossesSoft(box: Rect): boolean {
    return this.soft.search(query(box)).some((e) => segmentCrossesRect(e.segment as Segment, box));
  }

  /** The distance from the box to the nearest centre of another salt's mark, if any is within `reach`. */
  nearestOther(box: Rect, owner: number, reach: number): number {
    let nearest = Infinity;
    for (const m of this.marks.search(query(box, reach))) if (m.owner !== owner) nearest = Math.min(nearest, distanceToRect(box, m.x as number, m.y as number));
    return nearest;
  }

  /** A leader that crosses no other salt's mark and no label. */
  leaderIsClear(leader: Segment, owner: number): boolean {
    const q = query(segmentBounds(leader));
    const crosses = (e: Entry) => segmentCrossesRect(leader, boxOf(e));
    return !this.marks.search(q).some((m) => m.owner !== owner && crosses(m)) && !this.labels.search(q).some(crosses);
  }

  occupy(box: Rect, owner: number, leader: Segment | null): void {
    this.labels.insert(entry(box, owner));
    if (leader) this.leaders.insert(entry(segmentBounds(leader), owner, { segment: leader }));
  }

  /** How many marks of other salts lie within `reach` of a point. */
  crowding(x: number, y: number, owner: number, reach: number): number {
    const around = this.marks.search({ minX: x - reach, minY: y - reach, maxX: x + reach, maxY: y + reach });
    return around.filter((m) => m.owner !== owner && Math.hypot((m.x as number) - x, (m.y as number) - y) <= reach).length;
  }
}

/** Places what fits, in the order described at the top; the space keeps what was placed. */
export function placeLabels(requests: readonly LabelRequest[], space: LabelSpace): Placement {
  const crowding = requests.map((r) => space.crowding(r.x, r.y, r.owner, CROWD));
  const order = requests.map((_, i) => i).sort((a, b) => crowding[b] - crowding[a] || a - b);
  const placed: PlacedLabel[] = [];
  // Near spots for everyone first, so that no leader takes the spot beside a marker placed later.
  const waiting = order.filter((i) => {
    const spot = firstFit(nearSpots(requests[i]), space, (box) => isClearlyNearest(requests[i], box, space));
    if (spot) placed.push(occupy(requests[i], spot, space));
    return !spot;
  });
  const droppedAt = waiting.filter((i) => {
    const request = requests[i];
    const spot = firstFit(
      farSpots(request),
      space,
      (box) => space.nearestOther(box, request.owner, BESIDE) >= BESIDE && space.leaderIsClear(leaderTo(request, box), request.owner),
    );
    if (spot) placed.push(occupy(request, spot, space));
    return !spot;
  });
  return { placed, dropped: droppedAt.sort((a, b) => a - b).map((i) => requests[i].owner) };
}

function occupy(request: LabelRequest, spot: Spot, space: LabelSpace): PlacedLabel {
  const leader = spot.far ? leaderTo(request, spot.box) : null;
  space.occupy(spot.box, request.owner, leader);
  return { owner: request.owner, box: spot.box, leader };
}

interface Spot {
  box: Rect;
  far: boolean;
}

/** The first free spot that passes `check`, preferring one that crosses no soft line. */
function firstFit(spots: readonly Spot[], space: LabelSpace, check: (box: Rect) => boolean): Spot | null {
  let fallback: Spot | null = null;
  for (const spot of spots) {
    if (!space.isFree(spot.box) || !check(spot.box)) continue;
    if (!space.crossesSoft(spot.box)) return spot;
    fallback ??= spot;
  }
  return fallback;
}

function isClearlyNearest(request: LabelRequest, box: Rect, space: LabelSpace): boolean {
  const own = distanceToRect(box, request.x, request.y);
  const needed = own * NEAREST_RATIO + NEAREST_SLACK;
  return space.nearestOther(box, request.owner, needed) >= needed;
}

/** A box of the label's size with its left edge at `x` and its baseline at `baseline`. */
function boxAt(request: LabelRequest, x: number, baseline: number): Rect {
  return { x0: x, y0: baseline - request.height * 0.8, x1: x + request.width, y1: baseline + request.height * 0.2 };
}

/** The eight spots touching the marker, best first: right, left, above, below, then the corners. */
function nearSpots(request: LabelRequest): Spot[] {
  const { x: cx, y: cy, width: w, height: lh } = request;
  const gap = request.radius + 3;
  const spots: Array<[number, number]> = [
    [cx + gap, cy + lh * 0.35],
    [cx - gap - w, cy + lh * 0.35],
    [cx - w / 2, cy - gap - 1],
    [cx - w / 2, cy + gap + lh * 0.8],
    [cx + gap - 2, cy - gap],
    [cx + gap - 2, cy + gap + lh * 0.7],
    [cx - gap - w + 2, cy - gap],
    [cx - gap - w + 2, cy + gap + lh * 0.7],
  ];
  return spots.map(([x, baseline]) => ({ box: boxAt(request, x, baseline), far: false }));
}

/** Directions for far spots, best first: the four sides, the diagonals, then the eight between. */
const DIRECTIONS = [0, 8, 12, 4, 14, 2, 10, 6, 15, 1, 9, 7, 13, 3, 11, 5].map((k) => (k * Math.PI) / 8);
/** How far out far spots are, in label heights beyond the near ring. */
const RINGS = [1, 2, 3, 4.5, 6];

/**
 * Spots away from the marker, each to be joined by a leader: first beside it, slid up or down by one and two
 * lines (for stacks of near-equal values), then rings one to six lines out, nearest first, each box's
 * nearest point the ring's distance away.
 */
function farSpots(request: LabelRequest): Spot[] {
  const { x: cx, y: cy, width: w, height: h } = request;
  const gap = request.radius + 3;
  const spots: Spot[] = [];
  for (const lines of [1, -1, 2, -2]) for (const x of [cx + gap, cx - gap - w]) spots.push({ box: boxAt(request, x, cy + h * (0.35 + lines)), far: true });
  for (const ring of RINGS)
    for (const angle of DIRECTIONS) {
      const ux = Math.round(Math.cos(angle) * 1e9) / 1e9;
      const uy = Math.round(Math.sin(angle) * 1e9) / 1e9;
      const distance = gap + ring * h;
      const midX = cx + ux * distance + (ux * w) / 2;
      const midY = cy + uy * distance + (uy * h) / 2;
      spots.push({ box: { x0: midX - w / 2, y0: midY - h / 2, x1: midX + w / 2, y1: midY + h / 2 }, far: true });
    }
  return spots;
}

/** A leader from the marker's edge (radius + 1.5 px out) to 1 px short of the label's box. */
export function leaderTo(request: LabelRequest, box: Rect): Segment {
  const [tx, ty] = nearestPointOf(box, request.x, request.y);
  const length = Math.hypot(tx - request.x, ty - request.y) || 1;
  const ux = (tx - request.x) / length;
  const uy = (ty - request.y) / length;
  const start = request.radius + 1.5;
  return { x1: request.x + ux * start, y1: request.y + uy * start, x2: tx - ux, y2: ty - uy };
}

// ---------------------------------------------------------------------------------------------------------
// The chart's labels

export interface ChartLabel {
  text: string;
  /** Left edge and baseline. */
  x: number;
  y: number;
}

export interface LabelPlacement {
  labels: ChartLabel[];
  leaders: Segment[];
  /** Per guide line, the middle and baseline of its caption; null where it did not fit. */
  captions: Array<{ x: number; y: number } | null>;
  /** Salts whose label did not fit. */
  omitted: number;
}

/** The chart's marks: each salt's energy marker and, where known, its melting-point cross. */
export function chartMarks(layout: ChartLayout): Mark[] {
  const { radius, half, cross } = layout.marker;
  return layout.marks.flatMap(({ cx, cy, meltY }, owner) => [
    { owner, x: cx, y: cy, box: squareAround(cx, cy, Math.max(radius, half) + 1) },
    ...(meltY !== null ? [{ owner, x: cx, y: meltY, box: squareAround(cx, meltY, cross + 1) }] : []),
  ]);
}

/** The melting-point connectors as segments (soft obstacles). */
function connectors(layout: ChartLayout): Segment[] {
  return layout.marks.flatMap(({ cx, cy, meltY }) => (meltY === null ? [] : [{ x1: cx, y1: cy, x2: cx, y2: meltY }]));
}

export function labelChart(plotted: readonly Plotted[], layout: ChartLayout): LabelPlacement {
  const soft = [...layout.guides.map((g) => g.segment), ...connectors(layout)];
  const space = new LabelSpace(layout.plot, chartMarks(layout), soft);
  const requests = plotted.map((p, owner) => ({
    owner,
    width: textWidth(p.shown, FONT.label),
    height: FONT.label,
    x: layout.marks[owner].cx,
    y: layout.marks[owner].cy,
    radius: layout.marker.radius,
  }));
  const { placed, dropped } = placeLabels(requests, space);
  // Drawn in drawing order, whatever the order of placement.
  const byOwner = [...placed].sort((a, b) => a.owner - b.owner);
  return {
    labels: byOwner.map((l) => ({ text: plotted[l.owner].shown, x: l.box.x0, y: l.box.y0 + FONT.label * 0.8 })),
    leaders: byOwner.flatMap((l) => (l.leader ? [l.leader] : [])),
    captions: layout.guides.map((g) => placeCaption(g.segment, g.caption, layout.plot, space)),
    omitted: dropped.length,
  };
}

/** Where along its line a caption may go: the middle first, then outwards in steps of 5 %. */
const CAPTION_STOPS = [0.5, ...Array.from({ length: 9 }, (_, k) => [0.45 - 0.05 * k, 0.55 + 0.05 * k]).flat()];

/** A guide's caption: the first free spot along the line, above it or below it. */
function placeCaption(segment: Segment, caption: string, plot: Rect, space: LabelSpace): { x: number; y: number } | null {
  const width = textWidth(caption, FONT.guide);
  const spots: Array<{ x: number; y: number; box: Rect; far: boolean }> = [];
  for (const t of CAPTION_STOPS)
    for (const below of [false, true]) {
      const along = segment.x1 + (segment.x2 - segment.x1) * t;
      const x = Math.max(plot.x0 + 2 + width / 2, Math.min(plot.x1 - 2 - width / 2, along));
      const y = segment.y1 + (segment.y2 - segment.y1) * t + (below ? 14 : -6);
      spots.push({ x, y, box: { x0: x - width / 2, y0: y - 9, x1: x + width / 2, y1: y + 2 }, far: false });
    }
  const spot = firstFit(spots, space, () => true) as (typeof spots)[number] | null;
  if (!spot) return null;
  space.occupy(spot.box, -1, null);
  return { x: spot.x, y: spot.y };
}
