/**
 * Figure: feature importance as horizontal bars, largest first, with ±1 SD whiskers when given.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Importance } from '../types.ts';
import { displayText } from '../display-text.ts';
import { formatCell, isPresent } from '../format.ts';

/**
 * Builds the vega-lite specification of the importance bars for the `top` rows with the largest
 * importance; rows with a missing importance are left out. No usable row gives null.
 *
 * @example importanceBarsSpec({ method: 'permutation', rows: [{ feature: 'pe', order: 3, delay: 1, scale: 1, importance: 0.1 }] }) // a spec
 */
export function importanceBarsSpec(importance: Importance, top = 20): TopLevelSpec | null {
  const rows = importance.rows
    .filter((r) => isPresent(r.importance))
    .sort((a, b) => (b.importance as number) - (a.importance as number))
    .slice(0, top);
  if (rows.length === 0) return null;
  const values = rows.map((r, i) => {
    const label = `${displayText(r.feature)} ${formatCell(r)}`;
    const imp = r.importance as number;
    const sd = isPresent(r.sd) ? r.sd : null;
    return { rank: i, label, importance: imp, low: sd === null ? null : imp - sd, high: sd === null ? null : imp + sd };
  });
  const layer: object[] = [{ mark: { type: 'bar', color: '#56B4E9' }, encoding: { x: { field: 'importance', type: 'quantitative', title: displayText(importance.method) } } }];
  if (values.some((v) => v.low !== null)) {
    layer.push({
      transform: [{ filter: 'datum.low !== null' }],
      mark: { type: 'rule', color: '#333' },
      encoding: { x: { field: 'low', type: 'quantitative' }, x2: { field: 'high' } },
    });
  }
  return {
    data: { values },
    width: 360,
    height: { step: 16 },
    encoding: { y: { field: 'label', type: 'nominal', sort: { field: 'rank', op: 'min' }, title: null, axis: { labelLimit: 360 } } },
    layer,
  } as TopLevelSpec;
}
