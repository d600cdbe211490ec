/** The chart's <desc>: what a screen reader says, and the place where whatever is not drawn is counted. */
import type { ChartInput, Plotted } from './input';
import type { LabelPlacement } from './labels';
import { meltingPointsOf, type ChartLayout } from './layout';
import { count, energyText } from './text';

export function describeChart(input: ChartInput, layout: ChartLayout, placement: LabelPlacement): string {
  const { plotted } = input;
  const estimates = plotted.filter((p) => p.estimate).length;
  const values = plotted.length - estimates;
  const xName = input.mode === 'inverse-radius' ? '1/(r₊ + r₋) in Å⁻¹' : 'the charge product |z₊z₋|';
  const parts = [
    `Scatter chart of lattice energy (kJ/mol) against ${xName} for ${count(plotted.length, 'salt')}: ` +
      `${estimates} model ${estimates === 1 ? 'estimate' : 'estimates'} (hollow circles) and ${values} ` +
      `Born–Haber ${values === 1 ? 'value' : 'values'} from tabulated enthalpies, recalled (filled squares).`,
    extremes(plotted),
  ];
  const meltingPoints = meltingPointsOf(plotted).length;
  if (meltingPoints) parts.push(`Melting points of ${count(meltingPoints, 'salt')} on the right axis (°C, crosses).`);
  if (layout.guides.length)
    parts.push(`Dashed least-squares guides, not models, for ${layout.guides.map((g) => `|z₊z₋| = ${g.guide.chargeProduct}`).join(', ')}.`);
  if (placement.omitted) parts.push(`${placement.omitted} formula labels left out to avoid overlap; every point has a tooltip.`);
  return [...parts, ...input.leftOut].join(' ');
}

function extremes(plotted: readonly Plotted[]): string {
  const top = plotted.reduce((a, b) => (b.kJ > a.kJ ? b : a));
  const bottom = plotted.reduce((a, b) => (b.kJ < a.kJ ? b : a));
  const say = (p: Plotted) => `${p.label} ${p.estimate ? '≈ ' : ''}${energyText(p.kJ)} kJ/mol`;
  return plotted.length === 1 ? `${say(top)}.` : `Highest ${say(top)}; lowest ${say(bottom)}.`;
}
