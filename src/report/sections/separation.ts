/**
 * Section "How well the groups separate": out-of-fold ROC curve and permutation null.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { formatP } from '../format.ts';
import { rocCurveSpec } from '../figures/roc-curve.ts';
import { nullHistogramSpec } from '../figures/null-histogram.ts';
import { figureBlock } from './figure.ts';

/** Renders the ROC and permutation-null figures side by side. */
export async function separationSection(input: ReportInput): Promise<Markup> {
  const h = input.headline;
  const roc = await figureBlock(
    rocCurveSpec(input.roc, h.auc),
    'roc',
    html`Out-of-fold predictions: each subject scored by a model that never saw it. Dashed: chance.`,
    'no out-of-fold predictions were given.',
  );
  const nullFig = await figureBlock(
    nullHistogramSpec(input.nullScores, h.auc),
    'permutation-null',
    html`The whole pipeline rerun with shuffled labels. The line marks the real score; p = ${formatP(h.permutationP)}.`,
    'no permutation scores were given.',
  );
  return html`<section id="separation"><h2>How well the groups separate</h2><div class="plot-row">${roc}${nullFig}</div></section>`;
}
