/**
 * The chart's theming: the CSS custom properties it reads, the fallback colours, and the <style> it carries.
 *
 * Text, axes and grid follow `currentColor`, so the host sets `color` on the container. The fallback accents
 * are mid-tones with at least 3:1 contrast on both a white and a #1e1e1e background. Elements also carry
 * plain presentation attributes in these colours, so the chart stays legible if a host's content security
 * policy drops the <style>.
 */

/** The custom properties the chart reads, and what each colours (fallback in brackets). */
export const CHART_CSS_VARIABLES = {
  '--iw-chart-text': 'titles, tick labels, formula labels, legend text (currentColor)',
  '--iw-chart-axis': 'axis lines and tick marks (currentColor)',
  '--iw-chart-grid': 'gridlines, drawn at 15 % opacity (currentColor)',
  '--iw-chart-estimate': 'hollow circles of model estimates (#3b7dd8)',
  '--iw-chart-measured': 'filled squares of Born–Haber values (#b3478f)',
  '--iw-chart-melt': 'melting-point crosses, their connectors, the right axis (#c2621a)',
  '--iw-chart-guide': 'dashed least-squares guide lines and their labels, at 60 % opacity (currentColor)',
  '--iw-chart-halo': 'outline behind formula labels, set it to the page background to lift labels off gridlines (none)',
  '--iw-chart-font': 'font family (system-ui, sans-serif)',
} as const;

/** Presentation-attribute colours, the same as the fallbacks in the style sheet. */
export const COLOURS = {
  estimate: '#3b7dd8',
  measured: '#b3478f',
  melt: '#c2621a',
};

/** Every rule is scoped by the class `iw-lattice`, so the chart cannot restyle the host page. */
export const STYLE = [
  '.iw-lattice{max-width:100%;height:auto;font-family:var(--iw-chart-font,system-ui,sans-serif)}',
  '.iw-lattice .iw-lc-text{fill:var(--iw-chart-text,currentColor)}',
  '.iw-lattice .iw-lc-axis{stroke:var(--iw-chart-axis,currentColor)}',
  '.iw-lattice .iw-lc-grid{stroke:var(--iw-chart-grid,currentColor);stroke-opacity:.15}',
  '.iw-lattice .iw-lc-est{stroke:var(--iw-chart-estimate,#3b7dd8)}',
  '.iw-lattice .iw-lc-meas{fill:var(--iw-chart-measured,#b3478f);stroke:var(--iw-chart-measured,#b3478f)}',
  '.iw-lattice .iw-lc-melt{stroke:var(--iw-chart-melt,#c2621a)}',
  '.iw-lattice .iw-lc-melt-text{fill:var(--iw-chart-melt,#c2621a)}',
  '.iw-lattice .iw-lc-guide{stroke:var(--iw-chart-guide,currentColor)}',
  '.iw-lattice .iw-lc-guide-text{fill:var(--iw-chart-guide,currentColor)}',
  '.iw-lattice .iw-lc-label{paint-order:stroke;stroke:var(--iw-chart-halo,none);stroke-width:3px;stroke-linejoin:round}',
].join('');
