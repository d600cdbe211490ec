/**
 * A scatter chart of the lattice energies of the salts a notes file mentions, as one self-contained inline
 * `<svg>` string for the HTML report (no scripts, no external fonts, no stylesheet outside the svg).
 *
 * What it shows:
 * - x: 1/(r₊ + r₋) in Å⁻¹ (default; salts without known radii are left out and counted in the <desc>) or
 *   the charge product |z₊z₋|; y (left): lattice energy in kJ/mol. "Nice" ticks (1, 2, 2.5, 5 × 10ⁿ), which
 *   cover the energies; the x axis runs edge to edge (its outermost salts 3 % of the width from its ends).
 * - Model estimates as hollow circles, Born–Haber values (from tabulated enthalpies, recalled) as filled squares,
 *   with a legend, so the two never differ by colour alone.
 * - Melting points, where known, on a second y axis on the right (°C) as crosses (×) at the salt's x,
 *   joined to the salt's energy marker by a faint dotted line, with their own legend entry. The right axis
 *   takes the melting-point colour; its title says what it is.
 * - In the inverse-radius mode, a dashed least-squares line per charge-product group with at least three
 *   salts at two or more distinct x values: a guide to the eye (U grows roughly with z₊z₋/r₀ by Coulomb's
 *   law), labelled as a guide and not as a model.
 * - Every marker has a <title> tooltip and a formula label (labels.ts says how labels are placed).
 * - On the charge-product axis, markers of salts sharing a charge product that would overlap are dodged
 *   sideways by less than 40 % of the gap between charge products.
 *
 * Theming: style.ts. The pipeline: input.ts (checks what it is given) → layout.ts (plot area, scales, marks)
 * → labels.ts (placement) → describe.ts and draw.ts (the svg).
 *
 * Pure: no editor, LSP or file-system imports. Never throws; same input → same string; every coordinate
 * and size in the svg is rounded to 2 decimals (tick labels and tooltips carry the digits their values need).
 */
import { describeChart } from './describe';
import { drawChart, drawEmptyChart } from './draw';
import { readChartInput, type LatticeChartOptions, type LatticePoint } from './input';
import { labelChart } from './labels';
import { layOutChart } from './layout';

export type { LatticeChartOptions, LatticePoint } from './input';
export { CHART_CSS_VARIABLES } from './style';
export { textWidth } from './text';
export { leastSquares, niceTicks, type LineFit, type Ticks } from './ticks';

export function latticeChart(points: LatticePoint[], options?: LatticeChartOptions): string {
  const input = readChartInput(points, options);
  if (input.plotted.length === 0) return drawEmptyChart(input);
  const layout = layOutChart(input);
  const placement = labelChart(input.plotted, layout);
  return drawChart(input, layout, placement, describeChart(input, layout, placement));
}
