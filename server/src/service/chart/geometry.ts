/** Boxes and segments in svg pixels (y grows downwards). */

export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface Segment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

/** The square of half-side `half` around a centre. */
export const squareAround = (cx: number, cy: number, half: number): Rect => ({ x0: cx - half, y0: cy - half, x1: cx + half, y1: cy + half });

/** Whether two boxes share more than an edge. */
export const rectsOverlap = (a: Rect, b: Rect): boolean => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/** Whether `inner` lies within `outer`. */
export const rectInside = (inner: Rect, outer: Rect): boolean => inner.x0 >= outer.x0 && inner.x1 <= outer.x1 && inner.y0 >= outer.y0 && inner.y1 <= outer.y1;

/** The point of a box nearest to (x, y). */
export const nearestPointOf = (box: Rect, x: number, y: number): [number, number] => [
  Math.max(box.x0, Math.min(box.x1, x)),
  Math.max(box.y0, Math.min(box.y1, y)),
];

/** Distance from a point to a box (0 inside it). */
export function distanceToRect(box: Rect, x: number, y: number): number {
  const [nx, ny] = nearestPointOf(box, x, y);
  return Math.hypot(nx - x, ny - y);
}

/** The segment's bounding box. */
export const segmentBounds = (s: Segment): Rect => ({
  x0: Math.min(s.x1, s.x2),
  y0: Math.min(s.y1, s.y2),
  x1: Math.max(s.x1, s.x2),
  y1: Math.max(s.y1, s.y2),
});

/** Whether a segment passes through the inside of a box (Liang–Barsky clipping). */
export function segmentCrossesRect(s: Segment, box: Rect): boolean {
  const dx = s.x2 - s.x1;
  const dy = s.y2 - s.y1;
  let enter = 0;
  let leave = 1;
  const edges: Array<[number, number]> = [
    [-dx, s.x1 - box.x0],
    [dx, box.x1 - s.x1],
    [-dy, s.y1 - box.y0],
    [dy, box.y1 - s.y1],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q <= 0) return false;
      continue;
    }
    const t = q / p;
    if (p < 0) enter = Math.max(enter, t);
    else leave = Math.min(leave, t);
    if (enter >= leave) return false;
  }
  return true;
}
