/**
 * Empirical ROC curve (Fawcett 2006, Pattern Recogn. Lett. 27, 861, Algorithm 1): the
 * (false-positive rate, true-positive rate) points obtained by lowering the threshold
 * through every distinct score; tied scores move diagonally. Labels 1 are positives.
 */
export interface RocPoint {
  fpr: number;
  tpr: number;
}

/**
 * O(n log n). Starts at (0, 0) and ends at (1, 1). Returns [] when a class is empty.
 * Example: rocCurve([0.9, 0.4, 0.6], [1, 0, 1]) -> (0,0), (0,0.5), (0,1), (1,1).
 */
export function rocCurve(scores: ArrayLike<number>, labels: ArrayLike<number>): RocPoint[] {
  const order = Array.from({ length: scores.length }, (_, i) => i).sort((a, b) => scores[b] - scores[a]);
  let positives = 0;
  for (let i = 0; i < labels.length; i++) positives += labels[i] === 1 ? 1 : 0;
  const negatives = labels.length - positives;
  if (positives === 0 || negatives === 0) return [];
  const points: RocPoint[] = [{ fpr: 0, tpr: 0 }];
  let tp = 0;
  let fp = 0;
  for (let k = 0; k < order.length; k++) {
    const i = order[k];
    if (labels[i] === 1) tp++;
    else fp++;
    if (k === order.length - 1 || scores[order[k + 1]] !== scores[i]) points.push({ fpr: fp / negatives, tpr: tp / positives });
  }
  return points;
}
