/**
 * Section "The most different features": per-group values of the features that differ most.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { distributionSpec } from '../figures/distribution.ts';
import { figureBlock } from './figure.ts';

/** Renders the distributions section, one small figure per feature and cell. */
export async function distributionsSection(input: ReportInput): Promise<Markup> {
  const blocks: Markup[] = [];
  for (const [i, d] of input.distributions.entries()) {
    blocks.push(
      await figureBlock(
        distributionSpec(d, input.groupNames),
        `distribution-${i}`,
        html`${input.groupNames[0]}: ${d.values[0].length} values, ${input.groupNames[1]}: ${d.values[1].length}. Box: quartiles, whiskers to the extremes.`,
        'neither group has a value.',
      ),
    );
  }
  const body = blocks.length > 0 ? html`<div class="plot-row">${blocks}</div>` : html`<p class="missing">No feature distributions were given.</p>`;
  return html`<section id="distributions"><h2>The most different features</h2>
    <p>Every subject is one point. A feature chosen for its difference will look more different here than it would in new data.</p>${body}</section>`;
}
