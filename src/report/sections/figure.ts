/**
 * The frame of one figure: the SVG, a caption, and a plain note when there is nothing to draw.
 */
import type { TopLevelSpec } from 'vega-lite';
import { html } from '../html.ts';
import type { Markup, HtmlValue } from '../html.ts';
import { renderSvg } from '../figures/render-svg.ts';

/**
 * Renders `spec` into a `<figure>` with its caption; when `spec` is null, a short paragraph
 * saying what is missing (`whyMissing`) takes its place, so a missing figure is never silent.
 */
export async function figureBlock(spec: TopLevelSpec | null, name: string, caption: HtmlValue, whyMissing: string): Promise<Markup> {
  if (spec === null) return html`<p class="missing">No figure: ${whyMissing}</p>`;
  const svg = await renderSvg(spec, name);
  return html`<figure class="plot" data-figure="${name}">${svg}<figcaption>${caption}</figcaption></figure>`;
}
