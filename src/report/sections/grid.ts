/**
 * Section "Where in the grid": per-cell CV score heatmap, the naive best cell beside the
 * nested-CV estimate, and the effect-size heatmap of every feature at every cell.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { formatCell, formatInterval, formatNumber } from '../format.ts';
import { gridHeatmapSpec } from '../figures/grid-heatmap.ts';
import { effectHeatmapSpec } from '../figures/effect-heatmap.ts';
import { figureBlock } from './figure.ts';

function selectionTable(input: ReportInput): Markup {
  const s = input.selection;
  const picked = s.pickedCells && s.pickedCells.length > 0
    ? html`<p>Cells picked by the inner loops: ${[...s.pickedCells].sort((a, b) => b.times - a.times).map((c, i) => html`${i > 0 ? ', ' : ''}${formatCell(c)} (${c.times}×)`)}.</p>`
    : '';
  return html`<table class="summary selection"><tbody>
      <tr><th scope="row">best single cell, scored on the data that chose it (optimistic)</th>
        <td>${s.naiveBest ? formatCell(s.naiveBest) : '—'}</td><td class="num">${formatNumber(s.naiveBest?.auc ?? null, 3)}</td></tr>
      <tr><th scope="row">nested cross-validation: cell chosen inside each training fold (honest)</th>
        <td>${s.nestedInterval ? formatInterval(s.nestedInterval) : ''}</td><td class="num">${formatNumber(s.nestedAuc, 3)}</td></tr>
    </tbody></table>${picked}
    <p class="note">The gap between the two rows is the optimism that picking the best of many cells adds.</p>`;
}

/** Renders the grid section. */
export async function gridSection(input: ReportInput): Promise<Markup> {
  const cellFigure = await figureBlock(
    gridHeatmapSpec(input.gridScan, input.alpha),
    'grid-score',
    html`Cross-validated AUC of each grid cell on its own. * marks a family-wise adjusted p ≤ ${String(input.alpha)} (maximum statistic over all cells under the same permutations).`,
    'no grid cells were scored.',
  );
  const effectFigure = await figureBlock(
    effectHeatmapSpec(input.univariate, input.alpha, input.groupNames),
    'effect-sizes',
    html`Hedges' g of each feature at each cell, ${input.groupNames[1]} minus ${input.groupNames[0]}; * marks Benjamini–Hochberg q ≤ ${String(input.alpha)}. Grey: not computable.`,
    'no univariate comparisons were given.',
  );
  return html`<section id="grid"><h2>Where in the grid</h2>${cellFigure}${selectionTable(input)}${effectFigure}</section>`;
}
