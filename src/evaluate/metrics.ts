/**
 * Classification metrics from out-of-fold probabilities: the confusion matrix at threshold
 * 0.5, sensitivity, specificity, balanced accuracy (Brodersen et al. 2010, ICPR, p. 3121:
 * the mean of the per-class recalls, which stays at 0.5 for an uninformative classifier
 * whatever the group sizes) and the AUC with DeLong's 95% interval (auc.ts).
 * Class 1 (the second group) is the positive class.
 */
import { aucWithInterval } from './auc.ts';

/** Counts at threshold 0.5: a probability above 0.5 predicts class 1 (ties go to class 0, as scikit-learn's predict). */
export interface ConfusionMatrix {
  true_positive: number;
  false_negative: number;
  true_negative: number;
  false_positive: number;
}

export interface ClassificationMetrics {
  /** AUC of the given probabilities. */
  auc: number;
  /** DeLong (1988) standard error of that AUC; null when a group has fewer than 2 subjects. */
  auc_se: number | null;
  /** DeLong 95% Wald interval, clipped to [0, 1]; null with auc_se. */
  auc_ci: [number, number] | null;
  confusion: ConfusionMatrix;
  /** TP / (TP + FN): recall of the second group. */
  sensitivity: number;
  /** TN / (TN + FP): recall of the first group. */
  specificity: number;
  /** (sensitivity + specificity) / 2. */
  balanced_accuracy: number;
}

/**
 * Confusion matrix of probabilities against 0/1 labels at threshold 0.5. O(n).
 * Example: p [0.9, 0.4, 0.6, 0.1], labels [1, 1, 0, 0] -> TP 1, FN 1, TN 1, FP 1.
 */
export function confusionAtHalf(probabilities: ArrayLike<number>, labels: ArrayLike<number>): ConfusionMatrix {
  const m: ConfusionMatrix = { true_positive: 0, false_negative: 0, true_negative: 0, false_positive: 0 };
  for (let i = 0; i < labels.length; i++) {
    const predicted = probabilities[i] > 0.5 ? 1 : 0;
    if (labels[i] === 1) {
      if (predicted === 1) m.true_positive++;
      else m.false_negative++;
    } else if (predicted === 1) m.false_positive++;
    else m.true_negative++;
  }
  return m;
}

/**
 * All metrics of one set of out-of-fold probabilities (one per subject).
 *
 * O(n log n). Sensitivity or specificity is NaN when its class is empty; the AUC interval is
 * null when a class has fewer than 2 members.
 * Example: p [0.9, 0.4, 0.6, 0.1], labels [1, 1, 0, 0] -> sensitivity 0.5, specificity 0.5,
 * balanced accuracy 0.5, AUC 0.5.
 */
export function classificationMetrics(probabilities: ArrayLike<number>, labels: ArrayLike<number>): ClassificationMetrics {
  const confusion = confusionAtHalf(probabilities, labels);
  const sensitivity = confusion.true_positive / (confusion.true_positive + confusion.false_negative);
  const specificity = confusion.true_negative / (confusion.true_negative + confusion.false_positive);
  const interval = aucWithInterval(probabilities, labels, 0.95);
  const hasInterval = Number.isFinite(interval.se);
  return {
    auc: interval.auc,
    auc_se: hasInterval ? interval.se : null,
    auc_ci: hasInterval ? [interval.low, interval.high] : null,
    confusion,
    sensitivity,
    specificity,
    balanced_accuracy: (sensitivity + specificity) / 2,
  };
}
