/**
 * Section "Complexity against entropy": one complexity–entropy plane per chosen cell.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { isPresent } from '../format.ts';
import { complexityPlaneSpec } from '../figures/complexity-plane.ts';
import { figureBlock } from './figure.ts';

/** Renders the plane section; subjects without H or C are counted in the caption. */
export async function planeSection(input: ReportInput): Promise<Markup> {
  const blocks: Markup[] = [];
  for (const [i, plane] of input.plane.entries()) {
    const dropped = plane.points.filter((p) => !isPresent(p.h) || !isPresent(p.c)).length;
    blocks.push(
      await figureBlock(
        complexityPlaneSpec(plane, input.groupNames),
        `plane-${i}`,
        html`Each point is one subject. Dashed lines: the smallest and largest complexity possible at each entropy for order ${plane.cell.order} (Martin, Plastino &amp; Rosso 2006).${dropped > 0 ? ` ${dropped} subject(s) without a value are not drawn.` : ''}`,
        'no points or bounds were given for this cell.',
      ),
    );
  }
  const body = blocks.length > 0 ? html`<div class="plot-row">${blocks}</div>` : html`<p class="missing">No cells were chosen for the plane.</p>`;
  return html`<section id="plane"><h2>Complexity against entropy</h2>
    <p>Permutation entropy H says how evenly the ordinal patterns are used; statistical complexity C says how far their
    distribution is from both perfect order and pure noise (Rosso et al. 2007). Noise sits at the bottom right, strictly
    periodic signals at the bottom left, chaotic dynamics high in the middle.</p>${body}</section>`;
}
