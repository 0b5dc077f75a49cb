import { shannonEntropy } from './entropy.ts';
import type { TransitionEdges } from './ordinal-scan.ts';

/** Features of the ordinal transition network of one cell. */
export interface NetworkFeatures {
  /** Shannon entropy (nats) of the edge distribution. */
  transitionEntropy: number;
  /** H(next pattern | current pattern) in nats. */
  conditionalEntropy: number;
  /** Mean number of distinct successors over nodes with at least one outgoing edge. */
  outdegreeMean: number;
  /** Population variance of that number. */
  outdegreeVariance: number;
  /** Share of transitions whose source and target patterns are equal. */
  selfLoopFraction: number;
}

/**
 * Features of the ordinal transition network (Small 2013, Proc. IEEE ISCAS, 2509; McCullough
 * et al. 2015, Chaos 25, 053101): nodes are patterns, weighted directed edges the observed
 * transitions from window t to window t+1. With T the number of transitions:
 * transition_entropy = -sum_e (c_e/T) ln(c_e/T); conditional_entropy = transition_entropy
 * minus the entropy of the edges' source patterns (the chain rule H(A,B) = H(A) + H(B|A),
 * Cover & Thomas 2006, eq. 2.14), clamped at 0 against rounding; outdegree mean and
 * population variance over nodes with an outgoing edge; self_loop_fraction = (sum of c_e over
 * edges with source = target) / T. Edges must be distinct and sorted by source.
 *
 * O(E) for E edges. Returns null when there is no transition.
 *
 * @example
 * transitionFeatures({ source: Int32Array.of(0, 0, 1), target: Int32Array.of(0, 1, 0), count: Float64Array.of(1, 1, 2) })
 * // { transitionEntropy: 1.0397..., conditionalEntropy: 0.3466..., outdegreeMean: 1.5,
 * //   outdegreeVariance: 0.25, selfLoopFraction: 0.25 }
 */
export function transitionFeatures(edges: TransitionEdges): NetworkFeatures | null {
  const { source, target, count } = edges;
  let total = 0;
  let selfLoops = 0;
  for (let e = 0; e < count.length; e++) {
    total += count[e];
    if (source[e] === target[e]) selfLoops += count[e];
  }
  if (!(total > 0)) return null;
  const sourceTotals: number[] = [];
  const outdegrees: number[] = [];
  for (let e = 0; e < count.length; e++) {
    if (e === 0 || source[e] !== source[e - 1]) {
      sourceTotals.push(0);
      outdegrees.push(0);
    }
    sourceTotals[sourceTotals.length - 1] += count[e];
    outdegrees[outdegrees.length - 1]++;
  }
  const transitionEntropy = shannonEntropy(count);
  const mean = outdegrees.reduce((a, b) => a + b, 0) / outdegrees.length;
  const variance = outdegrees.reduce((a, d) => a + (d - mean) * (d - mean), 0) / outdegrees.length;
  return {
    transitionEntropy,
    conditionalEntropy: Math.max(0, transitionEntropy - shannonEntropy(sourceTotals)),
    outdegreeMean: mean,
    outdegreeVariance: variance,
    selfLoopFraction: selfLoops / total,
  };
}
