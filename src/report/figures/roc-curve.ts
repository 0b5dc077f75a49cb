/**
 * Figure: the out-of-fold ROC curve with the chance diagonal.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { RocPoint } from '../types.ts';
import { formatNumber, isPresent } from '../format.ts';

/**
 * Builds the vega-lite specification of the ROC curve. Points are drawn in the given order
 * (the caller supplies them from (0, 0) to (1, 1)); non-finite points are left out. No
 * points give null.
 *
 * @example rocCurveSpec([{ fpr: 0, tpr: 0 }, { fpr: 0, tpr: 1 }, { fpr: 1, tpr: 1 }], 1) // a spec
 */
export function rocCurveSpec(points: RocPoint[], auc: number | null): TopLevelSpec | null {
  const values = points.filter((p) => isPresent(p.fpr) && isPresent(p.tpr)).map((p, i) => ({ i, fpr: p.fpr, tpr: p.tpr }));
  if (values.length === 0) return null;
  return {
    title: `out-of-fold ROC, AUC ${formatNumber(auc, 2)}`,
    width: 240,
    height: 240,
    layer: [
      {
        data: { values: [{ fpr: 0, tpr: 0 }, { fpr: 1, tpr: 1 }] },
        mark: { type: 'line', color: '#9a9a9a', strokeDash: [4, 3], strokeWidth: 1 },
        encoding: { x: { field: 'fpr', type: 'quantitative' }, y: { field: 'tpr', type: 'quantitative' } },
      },
      {
        data: { values },
        mark: { type: 'line', color: '#0072B2', strokeWidth: 2, interpolate: 'linear' },
        encoding: {
          x: { field: 'fpr', type: 'quantitative', scale: { domain: [0, 1] }, title: 'false-positive rate' },
          y: { field: 'tpr', type: 'quantitative', scale: { domain: [0, 1] }, title: 'true-positive rate' },
          order: { field: 'i', type: 'quantitative' },
        },
      },
    ],
  } as TopLevelSpec;
}
