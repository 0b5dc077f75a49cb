/**
 * Figure: the whole pipeline's scores under permuted labels as a histogram, with the observed
 * score as a vertical rule.
 */
import type { TopLevelSpec } from 'vega-lite';
import { formatNumber, isPresent } from '../format.ts';

/**
 * Builds the vega-lite specification of the permutation null histogram. The bins span the
 * null scores and the observed score together, so the rule is always inside the plot.
 * Non-finite scores are left out. No finite null score gives null.
 *
 * @example nullHistogramSpec([0.4, 0.5, 0.55, 0.6], 0.8) // a spec with a rule at 0.8
 */
export function nullHistogramSpec(nullScores: number[], observed: number | null): TopLevelSpec | null {
  const scores = nullScores.filter(isPresent);
  if (scores.length === 0) return null;
  let lo = Math.min(...scores);
  let hi = Math.max(...scores);
  if (isPresent(observed)) {
    lo = Math.min(lo, observed);
    hi = Math.max(hi, observed);
  }
  if (hi - lo < 1e-9) {
    lo -= 0.05;
    hi += 0.05;
  }
  const layer: object[] = [
    {
      data: { values: scores.map((score) => ({ score })) },
      mark: { type: 'bar', color: '#9fb8cf' },
      encoding: {
        x: { field: 'score', type: 'quantitative', bin: { extent: [lo, hi], maxbins: 30 }, title: 'CV AUC under permuted labels' },
        y: { aggregate: 'count', type: 'quantitative', title: 'permutations' },
      },
    },
  ];
  if (isPresent(observed)) {
    layer.push({
      data: { values: [{ score: observed, label: `observed ${formatNumber(observed, 2)}` }] },
      layer: [
        { mark: { type: 'rule', color: '#D55E00', strokeWidth: 2 }, encoding: { x: { field: 'score', type: 'quantitative' } } },
        {
          mark: { type: 'text', color: '#D55E00', align: 'right', dx: -4, dy: -4, baseline: 'top', y: 0 },
          encoding: { x: { field: 'score', type: 'quantitative' }, text: { field: 'label', type: 'nominal' } },
        },
      ],
    });
  }
  return { title: `${scores.length} permutations`, width: 320, height: 200, layer } as TopLevelSpec;
}
