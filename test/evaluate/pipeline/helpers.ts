/**
 * Classifiers and tables defined inside the tests, so the pipeline can be checked
 * independently of the production classifiers.
 */
import type { Classifier, Model, TrainingSet } from '../../../src/evaluate/classifier.ts';
import type { FeatureColumn, FeatureMatrix, EvaluationSettings } from '../../../src/evaluate/types.ts';
import { createRng } from '../../../src/shared/random.ts';

/**
 * L2-penalised logistic regression in scikit-learn's convention: minimises
 * sum_i logloss_i + ||w||² / (2C), intercept unpenalised (sklearn LogisticRegression docs,
 * "Mathematical formulation" [S]); solved to machine precision by Newton–Raphson.
 */
export function newtonLogistic(C: number): Classifier {
  return {
    name: 'test-newton-logistic',
    fit(train: TrainingSet): Model {
      const { X, nRows: n, nCols: p, y } = train;
      const d = p + 1;
      const beta = new Float64Array(d);
      for (let iter = 0; iter < 100; iter++) {
        const grad = new Float64Array(d);
        const H = new Float64Array(d * d);
        for (let i = 0; i < n; i++) {
          let z = beta[p];
          for (let j = 0; j < p; j++) z += beta[j] * X[i * p + j];
          const mu = 1 / (1 + Math.exp(-z));
          const w = mu * (1 - mu);
          const r = mu - y[i];
          for (let a = 0; a < d; a++) {
            const xa = a < p ? X[i * p + a] : 1;
            grad[a] += r * xa;
            for (let b = 0; b < d; b++) H[a * d + b] += w * xa * (b < p ? X[i * p + b] : 1);
          }
        }
        for (let j = 0; j < p; j++) {
          grad[j] += beta[j] / C;
          H[j * d + j] += 1 / C;
        }
        const step = solve(H, grad, d);
        let size = 0;
        for (let a = 0; a < d; a++) {
          beta[a] -= step[a];
          size = Math.max(size, Math.abs(step[a]));
        }
        if (size < 1e-12) break;
      }
      return {
        predict(Xt: Float64Array, m: number): Float64Array {
          const out = new Float64Array(m);
          for (let i = 0; i < m; i++) {
            let z = beta[p];
            for (let j = 0; j < p; j++) z += beta[j] * Xt[i * p + j];
            out[i] = 1 / (1 + Math.exp(-z));
          }
          return out;
        },
      };
    },
  };
}

/** Gaussian elimination with partial pivoting. */
function solve(A: Float64Array, b: Float64Array, n: number): Float64Array {
  const M = Float64Array.from(A);
  const x = Float64Array.from(b);
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r * n + c]) > Math.abs(M[piv * n + c])) piv = r;
    if (piv !== c) {
      for (let k = 0; k < n; k++) [M[c * n + k], M[piv * n + k]] = [M[piv * n + k], M[c * n + k]];
      [x[c], x[piv]] = [x[piv], x[c]];
    }
    for (let r = c + 1; r < n; r++) {
      const f = M[r * n + c] / M[c * n + c];
      for (let k = c; k < n; k++) M[r * n + k] -= f * M[c * n + k];
      x[r] -= f * x[c];
    }
  }
  for (let c = n - 1; c >= 0; c--) {
    let s = x[c];
    for (let k = c + 1; k < n; k++) s -= M[c * n + k] * x[k];
    x[c] = s / M[c * n + c];
  }
  return x;
}

/**
 * Nearest class mean on standardised inputs: probability = logistic(||x − m0||² − ||x − m1||²) / 2).
 * Cheap (O(n p)), learns only from its training rows.
 */
export const nearestMean: Classifier = {
  name: 'test-nearest-mean',
  fit(train: TrainingSet): Model {
    const { X, nRows: n, nCols: p, y } = train;
    const m = [new Float64Array(p), new Float64Array(p)];
    const count = [0, 0];
    for (let i = 0; i < n; i++) {
      count[y[i]]++;
      for (let j = 0; j < p; j++) m[y[i]][j] += X[i * p + j];
    }
    for (let g = 0; g < 2; g++) for (let j = 0; j < p; j++) m[g][j] /= Math.max(1, count[g]);
    return {
      predict(Xt: Float64Array, rows: number): Float64Array {
        const out = new Float64Array(rows);
        for (let i = 0; i < rows; i++) {
          let d = 0;
          for (let j = 0; j < p; j++) {
            const v = Xt[i * p + j];
            d += (v - m[0][j]) ** 2 - (v - m[1][j]) ** 2;
          }
          out[i] = 1 / (1 + Math.exp(-d / 2));
        }
        return out;
      },
    };
  },
};

/**
 * A seeded study table: `perGroup` subjects per group, `recordings` rows per subject, the given
 * grid cells x features; `signal(cell, feature)` is the shift in SD added to group 1.
 */
export function syntheticMatrix(options: {
  seed: number;
  perGroup: [number, number];
  recordings?: number;
  cells: [number, number, number][];
  features: string[];
  signal?: (cell: number, feature: number) => number;
}): FeatureMatrix {
  const rng = createRng(options.seed);
  const recordings = options.recordings ?? 1;
  const columns: FeatureColumn[] = [];
  options.cells.forEach(([order, delay, scale]) => options.features.forEach((feature) => columns.push({ feature, order, delay, scale })));
  const rowIds: string[] = [];
  const subjects: string[] = [];
  const labels: number[] = [];
  const values: number[] = [];
  for (let g = 0; g < 2; g++) {
    for (let s = 0; s < options.perGroup[g]; s++) {
      const subjectEffect = columns.map(() => rng.normal());
      for (let r = 0; r < recordings; r++) {
        rowIds.push(`g${g}-s${s}-r${r}`);
        subjects.push(`g${g}-s${s}`);
        labels.push(g);
        columns.forEach((_, c) => {
          const cell = Math.floor(c / options.features.length);
          const feature = c % options.features.length;
          const shift = g === 1 && options.signal ? options.signal(cell, feature) : 0;
          values.push(subjectEffect[c] + (recordings > 1 ? 0.3 * rng.normal() : 0) + shift);
        });
      }
    }
  }
  return { rowIds, subjects, labels: Uint8Array.from(labels), groupNames: ['control', 'patient'], columns, values: Float64Array.from(values) };
}

export const quickSettings: EvaluationSettings = {
  folds: 5,
  repeats: 2,
  permutations: 49,
  classifier: 'logistic',
  trees: 10,
  l2: 1,
  stopEarly: false,
  seed: 20240611,
};
