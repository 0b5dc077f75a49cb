/**
 * Figure: Hedges' g of every feature at every grid cell, diverging colours centred on zero,
 * with rows whose Benjamini–Hochberg q is at most alpha marked by a star.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { UnivariateRow } from '../types.ts';
import { displayText } from '../display-text.ts';
import { formatCell, isPresent } from '../format.ts';
import { heatTileLayers } from './heat-tiles.ts';

function cellSortKey(r: UnivariateRow): number {
  return (r.order * 1000 + r.delay) * 1000 + r.scale;
}

/**
 * Builds the vega-lite specification of the effect-size heatmap (feature down, cell across).
 * The colour domain is symmetric, ±max |g| (at least ±0.5), so zero is always the neutral
 * colour. Missing g is drawn grey. No rows give null.
 *
 * @example effectHeatmapSpec([{ feature: 'pe', order: 3, delay: 1, scale: 1, hedgesG: 0.4, q: 0.01, ... }], 0.05) // one rect with '*'
 */
export function effectHeatmapSpec(rows: UnivariateRow[], alpha: number, groupNames: readonly [string, string]): TopLevelSpec | null {
  if (rows.length === 0) return null;
  const sorted = [...rows].sort((a, b) => cellSortKey(a) - cellSortKey(b));
  const cellOrder = [...new Set(sorted.map(formatCell))];
  const featureOrder = [...new Set(rows.map((r) => displayText(r.feature)))];
  let maxAbs = 0.5;
  for (const r of rows) if (isPresent(r.hedgesG)) maxAbs = Math.max(maxAbs, Math.abs(r.hedgesG));
  const values = sorted.map((r) => ({
    feature: displayText(r.feature),
    cell: formatCell(r),
    g: isPresent(r.hedgesG) ? r.hedgesG : null,
    mark: isPresent(r.q) && r.q <= alpha ? '*' : '',
  }));
  const title = `Hedges' g (${displayText(groupNames[1])} − ${displayText(groupNames[0])})`;
  return {
    data: { values },
    width: { step: Math.max(12, Math.min(28, Math.floor(640 / cellOrder.length))) },
    height: { step: 22 },
    encoding: {
      x: { field: 'cell', type: 'ordinal', sort: cellOrder, title: 'grid cell (order m, delay τ, scale s)', axis: { labelAngle: -60 } },
      y: { field: 'feature', type: 'nominal', sort: featureOrder, title: null, axis: { labelLimit: 320 } },
    },
    layer: [
      ...heatTileLayers('g', 0.5, {
        field: 'g',
        type: 'quantitative',
        title,
        scale: { scheme: 'blueorange', domain: [-maxAbs, maxAbs], domainMid: 0 },
        legend: { orient: 'bottom', direction: 'horizontal', titleLimit: 400, gradientLength: 220 },
      }),
      { mark: { type: 'text', fontSize: 12, baseline: 'middle' }, encoding: { text: { field: 'mark', type: 'nominal' } } },
    ],
  } as TopLevelSpec;
}
