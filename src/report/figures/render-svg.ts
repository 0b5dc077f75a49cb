/**
 * Static SVG from a vega-lite specification: vega-lite compiles it to a vega specification,
 * vega renders it head-less (no canvas, no DOM) to an SVG string, and the string is vetted
 * before it becomes markup. Text that vega draws is escaped by vega itself; the report's
 * tests check that with hostile names.
 */
import * as vega from 'vega';
import { compile } from 'vega-lite';
import type { TopLevelSpec } from 'vega-lite';
import { trustedSvg } from '../html.ts';
import type { Markup } from '../html.ts';

/** One font stack for the page and the figures (vega estimates text widths for it). */
export const FIGURE_FONT = 'Helvetica, Arial, sans-serif';

/** Shared look of every figure. */
const FIGURE_CONFIG = {
  font: FIGURE_FONT,
  background: 'white',
  view: { stroke: '#c8c8c8' },
  axis: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal', gridColor: '#e6e6e6' },
  legend: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal', labelLimit: 320 },
  header: { labelFontSize: 12, titleFontSize: 12 },
  title: { fontSize: 13, fontWeight: 'normal', anchor: 'start' },
} as const;

/**
 * Renames the ids vega gives gradients and clip paths (a process-wide counter, e.g.
 * `gradient_7`) to names scoped by the figure and numbered in order of appearance, so ids are
 * unique within the page and a rerun gives the same bytes.
 * @example scopeIds('<linearGradient id="gradient_7"/><path fill="url(#gradient_7)"/>', 'roc')
 *          // '<linearGradient id="roc-gradient-0"/><path fill="url(#roc-gradient-0)"/>'
 */
export function scopeIds(svg: string, figure: string): string {
  const renamed = new Map<string, string>();
  const counts = new Map<string, number>();
  const slug = figure.replace(/[^A-Za-z0-9-]/g, '-');
  for (const m of svg.matchAll(/\sid="((gradient|clip|pattern)_\d+)"/g)) {
    if (renamed.has(m[1])) continue;
    const n = counts.get(m[2]) ?? 0;
    counts.set(m[2], n + 1);
    renamed.set(m[1], `${slug}-${m[2]}-${n}`);
  }
  if (renamed.size === 0) return svg;
  return svg.replace(/((?:gradient|clip|pattern)_\d+)\b/g, (id) => renamed.get(id) ?? id);
}

/**
 * Renders a vega-lite specification to a vetted inline SVG. The vega loader is disabled, so a
 * specification that asks for a URL fails instead of loading it. Throws when vega fails or the
 * SVG holds something a static figure never needs (see trustedSvg).
 *
 * @example await renderSvg({ data: { values: [{ x: 1 }] }, mark: 'point', encoding: { x: { field: 'x', type: 'quantitative' } } }, 'demo')
 *          // Markup whose value starts with '<svg'
 */
export async function renderSvg(spec: TopLevelSpec, figure: string): Promise<Markup> {
  const withConfig = { ...spec, config: { ...FIGURE_CONFIG, ...(spec.config ?? {}) } } as TopLevelSpec;
  const compiled = compile(withConfig).spec;
  const loader = vega.loader();
  loader.load = async (uri: string) => {
    throw new Error(`report figure "${figure}": refused to load "${uri}" (figures are built from inline data only)`);
  };
  const view = new vega.View(vega.parse(compiled), { renderer: 'none', loader, logLevel: vega.Warn });
  try {
    const svg = await view.toSVG();
    return trustedSvg(scopeIds(svg, figure), figure);
  } finally {
    view.finalize();
  }
}
