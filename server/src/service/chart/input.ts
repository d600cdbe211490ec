/** What the chart is given, checked: the salts it can plot, and a word for each one it cannot. */
import { asText, count, fnv1a, oneLine, shorten } from './text';

export interface LatticePoint {
  /** Display formula, Unicode (e.g. "MgO", "CaF₂", "Na₂SO₄"). */
  label: string;
  /** Lattice energy, positive, kJ/mol. */
  kJPerMol: number;
  /** E.g. "Kapustinskii equation", "Born–Mayer equation", "Born–Haber cycle". */
  method: string;
  /** Model estimate (true) or a Born–Haber value from tabulated enthalpies (false). */
  estimate: boolean;
  /** 1/(r₊ + r₋) in 1/Å, six-coordinate radii; null if unknown. */
  inverseR0: number | null;
  /** |z₊ z₋|. */
  chargeProduct: number;
  /** Where known. */
  meltingPointC?: number;
}

export type XMode = 'inverse-radius' | 'charge-product';

export interface LatticeChartOptions {
  /** Default 'inverse-radius'; points with inverseR0 null are left out in that mode and counted in the <desc>. */
  x?: XMode;
  /** Default 640. */
  width?: number;
  /** Default 400. */
  height?: number;
  /** Default "Lattice energies". */
  title?: string;
}

/** A salt that will be drawn. */
export interface Plotted {
  label: string;
  /** The label as drawn (shortened). */
  shown: string;
  kJ: number;
  method: string;
  estimate: boolean;
  /** Its value on the x axis. */
  x: number;
  inverseR0: number | null;
  chargeProduct: number | null;
  meltingPoint: number | null;
}

export interface ChartInput {
  mode: XMode;
  width: number;
  height: number;
  title: string;
  /** In drawing order: by x, then by energy from the top, then by label (so the input order does not matter). */
  plotted: Plotted[];
  /** Sentences for the <desc> about the salts that are not drawn. */
  leftOut: string[];
  /** Unique per chart content, the same for the same content. */
  id: string;
}

const DEFAULT_WIDTH = 640;
const DEFAULT_HEIGHT = 400;
const MIN_WIDTH = 200;
const MIN_HEIGHT = 160;
const MAX_SIZE = 4096;
const MAX_LABEL_CHARS = 22;

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function clampSize(v: unknown, fallback: number, min: number): number {
  if (!finite(v)) return fallback;
  return Math.round(Math.min(MAX_SIZE, Math.max(min, v)));
}

export function readChartInput(points: unknown, options: unknown): ChartInput {
  const opts = (options && typeof options === 'object' ? options : {}) as LatticeChartOptions;
  const mode: XMode = opts.x === 'charge-product' ? 'charge-product' : 'inverse-radius';
  const width = clampSize(opts.width, DEFAULT_WIDTH, MIN_WIDTH);
  const height = clampSize(opts.height, DEFAULT_HEIGHT, MIN_HEIGHT);
  const title = oneLine(asText(opts.title)) || 'Lattice energies';
  const plotted: Plotted[] = [];
  const noRadius: string[] = [];
  let invalid = 0;
  for (const raw of Array.isArray(points) ? points : []) {
    const read = readPoint(raw, mode);
    if (read === 'invalid') invalid++;
    else if (typeof read === 'string') noRadius.push(read);
    else plotted.push(read);
  }
  plotted.sort(drawingOrder);
  noRadius.sort(compareText);
  const id = `iw-lc-${fnv1a(JSON.stringify([mode, width, height, title, plotted, noRadius, invalid]))}`;
  return { mode, width, height, title, plotted, leftOut: leftOutSentences(noRadius, invalid), id };
}

/** A point to draw, the label of a salt without radii (inverse-radius mode), or 'invalid'. */
function readPoint(raw: unknown, mode: XMode): Plotted | string {
  if (!raw || typeof raw !== 'object') return 'invalid';
  const p = raw as Partial<LatticePoint>;
  const label = oneLine(asText(p.label)) || '?';
  const kJ = p.kJPerMol;
  if (!finite(kJ) || kJ <= 0) return 'invalid';
  const inverseR0 = finite(p.inverseR0) && p.inverseR0 > 0 ? p.inverseR0 : null;
  const chargeProduct = finite(p.chargeProduct) && p.chargeProduct > 0 ? p.chargeProduct : null;
  if (mode === 'inverse-radius' && (p.inverseR0 === null || p.inverseR0 === undefined)) return label;
  const x = mode === 'inverse-radius' ? inverseR0 : chargeProduct;
  if (x === null) return 'invalid';
  return {
    label,
    shown: shorten(label, MAX_LABEL_CHARS),
    kJ,
    method: oneLine(asText(p.method)) || (p.estimate === false ? 'Born–Haber cycle' : 'model'),
    estimate: p.estimate !== false,
    x,
    inverseR0,
    chargeProduct,
    meltingPoint: finite(p.meltingPointC) ? p.meltingPointC : null,
  };
}

const compareText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

function drawingOrder(a: Plotted, b: Plotted): number {
  return (
    a.x - b.x ||
    b.kJ - a.kJ ||
    compareText(a.label, b.label) ||
    compareText(a.method, b.method) ||
    Number(a.estimate) - Number(b.estimate) ||
    (a.meltingPoint ?? -Infinity) - (b.meltingPoint ?? -Infinity) ||
    0
  );
}

function leftOutSentences(noRadius: string[], invalid: number): string[] {
  const out: string[] = [];
  if (noRadius.length) {
    const names = `${noRadius.slice(0, 6).join(', ')}${noRadius.length > 6 ? ', …' : ''}`;
    out.push(`${count(noRadius.length, 'salt')} without known ionic radii left out (${names}).`);
  }
  if (invalid) out.push(`${count(invalid, 'entry', 'entries')} with missing or invalid values left out.`);
  return out;
}
