/**
 * Figure: subjects on the first two principal components, coloured by group.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { ProjectionInput } from '../types.ts';
import type { Projection } from '../projection.ts';
import { displayText } from '../display-text.ts';
import { formatPercent } from '../format.ts';
import { figureGroupNames, groupColour } from './groups.ts';

/**
 * Builds the vega-lite specification of the PCA scatter; axis titles carry the share of
 * variance of each component.
 *
 * @example pcaScatterSpec(input, { scores: [[0, 0]], explained: [0.6, 0.2], usedColumns: 2 }, ['A', 'B']) // a spec
 */
export function pcaScatterSpec(input: ProjectionInput, projection: Projection, groupNames: readonly [string, string]): TopLevelSpec {
  const names = figureGroupNames(groupNames);
  const values = projection.scores.map(([pc1, pc2], i) => ({
    subject: displayText(input.subjects[i] ?? ''),
    group: names[input.groups[i]],
    pc1,
    pc2,
  }));
  return {
    data: { values },
    width: 300,
    height: 240,
    mark: { type: 'point', filled: true, size: 40, opacity: 0.85 },
    encoding: {
      x: { field: 'pc1', type: 'quantitative', title: `PC1 (${formatPercent(projection.explained[0])} of variance)`, scale: { zero: false, nice: true } },
      y: { field: 'pc2', type: 'quantitative', title: `PC2 (${formatPercent(projection.explained[1])} of variance)`, scale: { zero: false, nice: true } },
      color: groupColour(groupNames),
      shape: { field: 'group', type: 'nominal', scale: { domain: names, range: ['circle', 'triangle-up'] } },
    },
  } as TopLevelSpec;
}
