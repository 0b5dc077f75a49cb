/**
 * Figure: cross-validated score of every grid cell, one panel per order, delay across and
 * scale down, with cells whose family-wise adjusted p is at most alpha marked by a star.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { GridScanCell } from '../types.ts';
import { formatNumber, isPresent } from '../format.ts';
import { heatTileLayers } from './heat-tiles.ts';

/**
 * Builds the vega-lite specification of the per-cell score heatmap.
 * Cells with a missing AUC are drawn grey and labelled "—" (a layer of their own: vega-lite
 * leaves null values out of a colour scale). An empty grid gives null.
 *
 * @example gridHeatmapSpec([{ order: 3, delay: 1, scale: 1, auc: 0.8, adjustedP: 0.01 }], 0.05) // a spec with one rect
 */
export function gridHeatmapSpec(cells: GridScanCell[], alpha: number): TopLevelSpec | null {
  if (cells.length === 0) return null;
  const values = cells.map((c) => ({
    order: `m = ${c.order}`,
    orderValue: c.order,
    delay: c.delay,
    scale: c.scale,
    auc: isPresent(c.auc) ? c.auc : null,
    label: `${formatNumber(c.auc, 2)}${isPresent(c.adjustedP) && c.adjustedP <= alpha ? '*' : ''}`,
    dark: isPresent(c.auc) && c.auc >= 0.8,
  }));
  return {
    data: { values },
    facet: { column: { field: 'order', type: 'ordinal', title: null, sort: { field: 'orderValue' } } },
    spec: {
      width: { step: 46 },
      height: { step: 30 },
      encoding: {
        x: { field: 'delay', type: 'ordinal', title: 'delay τ' },
        y: { field: 'scale', type: 'ordinal', title: 'scale s' },
      },
      layer: [
        ...heatTileLayers('auc', 1, { field: 'auc', type: 'quantitative', title: 'CV AUC', scale: { scheme: 'blues', domain: [0.5, 1], clamp: true } }),
        {
          mark: { type: 'text', fontSize: 11 },
          encoding: {
            text: { field: 'label', type: 'nominal' },
            color: { condition: { test: 'datum.dark', value: 'white' }, value: 'black' },
          },
        },
      ],
    },
  } as TopLevelSpec;
}
