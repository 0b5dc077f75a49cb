/**
 * Figure: values of one feature at one cell per group, every subject as a point over a box
 * summary (quartiles, whiskers to the extremes).
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Distribution } from '../types.ts';
import { displayText } from '../display-text.ts';
import { formatCell, isPresent } from '../format.ts';
import { figureGroupNames, groupColour } from './groups.ts';

/**
 * Band step per group in pixels. With paddingInner 0.2 the band is 0.8 STEP wide and xOffset
 * positions are measured from its left edge, so 0.4 STEP is the band's centre, where the box sits.
 */
const STEP = 90;

/** Golden-ratio conjugate: successive multiples mod 1 spread evenly over [0, 1) (Weyl 1916). */
const GOLDEN = 0.6180339887498949;

/**
 * Horizontal offset in [-0.5, 0.5) of the i-th point of a strip: a deterministic
 * low-discrepancy sequence, so points spread without random numbers and a rerun draws the
 * same picture.
 * @example stripOffset(0) // -0.5 ; stripOffset(1) // ≈ 0.118
 */
export function stripOffset(i: number): number {
  return ((i * GOLDEN) % 1) - 0.5;
}

/**
 * Builds the vega-lite specification of one strip-and-box figure. Non-finite values are left
 * out. Gives null when neither group has a value.
 *
 * @example distributionSpec({ feature: 'pe', order: 3, delay: 1, scale: 1, values: [[0.9, 0.8], [0.7]] }, ['A', 'B']) // a spec
 */
export function distributionSpec(d: Distribution, groupNames: readonly [string, string]): TopLevelSpec | null {
  const names = figureGroupNames(groupNames);
  const values: { group: string; value: number; offset: number }[] = [];
  for (const g of [0, 1] as const) {
    let i = 0;
    for (const v of d.values[g]) if (isPresent(v)) values.push({ group: names[g], value: v, offset: stripOffset(i++) });
  }
  if (values.length === 0) return null;
  return {
    title: `${displayText(d.feature)}, ${formatCell(d)}`,
    data: { values },
    width: { step: STEP },
    height: 190,
    encoding: {
      x: { field: 'group', type: 'nominal', scale: { domain: names, paddingInner: 0.2, paddingOuter: 0.1 }, title: null, axis: { labelAngle: 0, labelLimit: 85 } },
      y: { field: 'value', type: 'quantitative', scale: { zero: false }, title: null },
    },
    layer: [
      {
        mark: { type: 'boxplot', extent: 'min-max', size: 34, opacity: 0.35, median: { color: 'black' } },
        encoding: { color: { ...groupColour(groupNames), legend: null } },
      },
      {
        mark: { type: 'point', filled: true, size: 22, opacity: 0.85 },
        encoding: {
          xOffset: { field: 'offset', type: 'quantitative', scale: { domain: [-0.5, 0.5], range: [STEP * 0.4 - 20, STEP * 0.4 + 20] } },
          color: { ...groupColour(groupNames), legend: null },
        },
      },
    ],
  } as TopLevelSpec;
}
