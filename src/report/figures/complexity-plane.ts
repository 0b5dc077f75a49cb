/**
 * Figure: the complexity–entropy plane at one grid cell (Rosso et al. 2007, Phys. Rev. Lett.
 * 99, 154102): subjects as points coloured by group, between the minimum and maximum
 * complexity curves of that order (Martin, Plastino & Rosso 2006, Physica A 369, 439), which
 * arrive as data.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { PlaneCell } from '../types.ts';
import { displayText } from '../display-text.ts';
import { formatCell, isPresent } from '../format.ts';
import { figureGroupNames, groupColour } from './groups.ts';

/**
 * Builds the vega-lite specification of one complexity–entropy plane. Points with a missing
 * H or C are left out (the caller reports how many). Gives null when neither a point nor a
 * curve is present.
 *
 * @example complexityPlaneSpec({ cell: { order: 3, delay: 1, scale: 1 }, points: [{ subject: 'a', group: 0, h: 0.9, c: 0.1 }], bounds: { min: [], max: [] } }, ['A', 'B'])
 *          // a spec with one point
 */
export function complexityPlaneSpec(plane: PlaneCell, groupNames: readonly [string, string]): TopLevelSpec | null {
  const names = figureGroupNames(groupNames);
  const points = plane.points
    .filter((p) => isPresent(p.h) && isPresent(p.c))
    .map((p) => ({ subject: displayText(p.subject), group: names[p.group], h: p.h, c: p.c }));
  const curves = [
    ...plane.bounds.min.map((p, i) => ({ curve: 'minimum', i, h: p.h, c: p.c })),
    ...plane.bounds.max.map((p, i) => ({ curve: 'maximum', i, h: p.h, c: p.c })),
  ];
  if (points.length === 0 && curves.length === 0) return null;
  return {
    title: `order ${plane.cell.order}, delay ${plane.cell.delay}, scale ${plane.cell.scale} (${formatCell(plane.cell)})`,
    width: 300,
    height: 220,
    layer: [
      {
        data: { values: curves },
        mark: { type: 'line', color: '#7a7a7a', strokeWidth: 1, strokeDash: [4, 3] },
        encoding: {
          x: { field: 'h', type: 'quantitative', scale: { domain: [0, 1] }, title: 'permutation entropy H' },
          y: { field: 'c', type: 'quantitative', title: 'statistical complexity C' },
          detail: { field: 'curve', type: 'nominal' },
          order: { field: 'i', type: 'quantitative' },
        },
      },
      {
        data: { values: points },
        mark: { type: 'point', filled: true, size: 36, opacity: 0.8 },
        encoding: {
          x: { field: 'h', type: 'quantitative' },
          y: { field: 'c', type: 'quantitative' },
          color: groupColour(groupNames),
          shape: { field: 'group', type: 'nominal', scale: { domain: names, range: ['circle', 'triangle-up'] } },
        },
      },
    ],
  } as TopLevelSpec;
}
