/**
 * Section "All subjects at a glance": PCA projection and feature importance.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { projectSubjects } from '../projection.ts';
import { pcaScatterSpec } from '../figures/pca-scatter.ts';
import { importanceBarsSpec } from '../figures/importance-bars.ts';
import { figureBlock } from './figure.ts';

/** Renders the projection and importance figures. */
export async function overviewSection(input: ReportInput): Promise<Markup> {
  const projection = input.projection ? projectSubjects(input.projection) : null;
  const pca = await figureBlock(
    projection && input.projection ? pcaScatterSpec(input.projection, projection, input.groupNames) : null,
    'pca',
    html`Principal components of all features, each standardised; missing values set to the feature's median for this picture only.
      ${projection ? `${projection.usedColumns} of ${input.projection?.columns.length ?? 0} columns used (the rest were constant or empty).` : ''}
      Unsupervised: the groups played no part in it.`,
    input.projection ? 'fewer than three subjects or no usable column.' : 'no feature matrix was given.',
  );
  const importance = await figureBlock(
    input.importance ? importanceBarsSpec(input.importance) : null,
    'importance',
    html`The 20 most important columns. ${input.importance ? input.importance.method : ''}`,
    'no feature importance was given.',
  );
  return html`<section id="overview"><h2>All subjects at a glance</h2><div class="plot-row">${pca}${importance}</div></section>`;
}
