/**
 * L2-penalised logistic regression fitted by Newton–Raphson (iteratively reweighted least
 * squares) with a backtracking line search.
 *
 * Model P(y = 1 | x) = σ(b + x·w), σ(z) = 1 / (1 + e^−z). The fit minimises
 *
 *   f(b, w) = Σ_i [log(1 + e^{z_i}) − y_i z_i] + (λ/2) ||w||²,   z_i = b + x_i·w,
 *
 * with the intercept b unpenalised (le Cessie & van Houwelingen 1992, Appl. Statist. 41,
 * 191–201, ridge logistic regression). This is scikit-learn's LogisticRegression with
 * C = 1/λ. Newton's method with backtracking (Boyd & Vandenberghe 2004, Convex
 * Optimization, Algorithm 9.5, α = 0.25, β = 0.5). Once the Newton decrement
 * λ_N²/2 = gᵀH⁻¹g/2 (an estimate of f − f*, §9.5.1) falls below 1e-12·(1 + |f|), where the
 * line search can no longer resolve the decrease in floating point, full Newton steps are
 * taken, and the fit stops after a step whose largest entry is at most 1e-10·(1 + max|β|);
 * convergence being quadratic there, the coefficients are then accurate to rounding.
 * Deterministic: the seed is not used.
 */
import type { Classifier, Model, TrainingSet } from '../classifier.ts';
import { InputError } from '../../shared/errors.ts';
import { checkPredictionInput, checkTrainingSet } from './check-input.ts';
import { choleskySolveInPlace } from './cholesky.ts';

export interface LogisticOptions {
  /** λ >= 0: penalty (λ/2)·||w||² on the weights, intercept unpenalised (scikit-learn's C = 1/λ). */
  l2: number;
}

/** A fitted logistic regression. */
export interface LogisticModel extends Model {
  readonly intercept: number;
  readonly weights: Float64Array;
  /** Newton iterations used. */
  readonly iterations: number;
}

const MAX_ITERATIONS = 100;
const FULL_STEP_DECREMENT = 1e-12;
const STEP_TOLERANCE = 1e-10;
const ARMIJO = 0.25;

/**
 * A logistic-regression classifier (name 'logistic') for {@link Classifier.fit}.
 * Throws InputError when l2 is negative or not finite.
 *
 * @example createLogistic({ l2: 1 }).fit(train, 0).predict(Xtest, nTest) gives P(class 1) per row.
 */
export function createLogistic(options: LogisticOptions): Classifier {
  checkLogisticOptions(options);
  return { name: 'logistic', fit: (train: TrainingSet) => fitLogistic(train, options) };
}

/**
 * Fits the penalised logistic regression described at the top of this file.
 *
 * Complexity O(n p²) per Newton iteration plus O(p³) for the solve; typically 5–10
 * iterations. Throws RangeError when the training set is malformed, holds a single class
 * (the unpenalised intercept has no finite optimum) or, with l2 = 0, the classes are
 * separable (no finite optimum: use l2 > 0).
 *
 * @example X = [0, 1, 2, 3] (one column), y = [0, 1, 0, 1], l2 = 1: the fit gives
 * intercept −0.679313 and weight 0.452875 (scikit-learn 1.2, C = 1, gives the same).
 */
export function fitLogistic(train: TrainingSet, options: LogisticOptions): LogisticModel {
  checkLogisticOptions(options);
  checkTrainingSet(train, 'logistic');
  checkBothClasses(train.y);
  const { X, nRows, nCols, y } = train;
  const d = nCols + 1;
  const beta = new Float64Array(d);
  const trial = new Float64Array(d);
  const gradient = new Float64Array(d);
  const step = new Float64Array(d);
  const hessian = new Float64Array(d * d);
  const prob = new Float64Array(nRows);
  let value = objective(X, nRows, nCols, y, options.l2, beta);
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
    gradientAndHessian(X, nRows, nCols, y, options.l2, beta, prob, gradient, hessian);
    step.set(gradient);
    if (!choleskySolveInPlace(hessian, step, d)) {
      throw new RangeError('logistic.fit: the Hessian is singular (too many columns for the rows with l2 = 0?) — use l2 > 0');
    }
    const decrement = dot(gradient, step);
    if (decrement / 2 <= FULL_STEP_DECREMENT * (1 + Math.abs(value))) {
      // Quadratic region: the predicted decrease is below the rounding of f, so the line
      // search could not see it; Newton's full step is the right one here.
      for (let j = 0; j < d; j++) beta[j] -= step[j];
      if (maxAbs(step) <= STEP_TOLERANCE * (1 + maxAbs(beta))) return logisticModel(beta, nCols, iteration);
      value = objective(X, nRows, nCols, y, options.l2, beta);
      continue;
    }
    let t = 1;
    for (;;) {
      for (let j = 0; j < d; j++) trial[j] = beta[j] - t * step[j];
      const next = objective(X, nRows, nCols, y, options.l2, trial);
      if (next <= value - ARMIJO * t * decrement) {
        value = next;
        break;
      }
      t /= 2;
    }
    beta.set(trial);
  }
  throw new RangeError(
    `logistic.fit: no convergence in ${MAX_ITERATIONS} Newton iterations (separable classes with l2 = ${options.l2}?) — use l2 > 0`,
  );
}

function logisticModel(beta: Float64Array, nCols: number, iterations: number): LogisticModel {
  const intercept = beta[0];
  const weights = beta.slice(1);
  return {
    intercept,
    weights,
    iterations,
    predict: (X: Float64Array, nRows: number) => {
      checkPredictionInput(X, nRows, nCols, 'logistic');
      const out = new Float64Array(nRows);
      for (let i = 0; i < nRows; i++) out[i] = sigmoid(intercept + rowDot(X, i * nCols, weights, nCols));
      return out; // a row with NaN gives NaN: it propagates through the dot product
    },
  };
}

/** f(β) of the file comment, with log(1 + e^z) evaluated without overflow. */
function objective(X: Float64Array, nRows: number, nCols: number, y: Uint8Array, l2: number, beta: Float64Array): number {
  let loss = 0;
  for (let i = 0; i < nRows; i++) {
    const z = beta[0] + rowDot(X, i * nCols, beta, nCols, 1);
    loss += softplus(z) - (y[i] === 1 ? z : 0);
  }
  let penalty = 0;
  for (let j = 1; j <= nCols; j++) penalty += beta[j] * beta[j];
  return loss + (l2 / 2) * penalty;
}

/** Gradient g and Hessian H (lower triangle) of f at β; index 0 is the intercept. O(n p²). */
function gradientAndHessian(
  X: Float64Array,
  nRows: number,
  nCols: number,
  y: Uint8Array,
  l2: number,
  beta: Float64Array,
  prob: Float64Array,
  g: Float64Array,
  H: Float64Array,
): void {
  const d = nCols + 1;
  g.fill(0);
  H.fill(0);
  for (let i = 0; i < nRows; i++) {
    const base = i * nCols;
    const p = sigmoid(beta[0] + rowDot(X, base, beta, nCols, 1));
    prob[i] = p;
    const r = p - y[i];
    const v = p * (1 - p);
    g[0] += r;
    H[0] += v;
    for (let j = 1; j <= nCols; j++) {
      const xj = X[base + j - 1];
      g[j] += r * xj;
      const vx = v * xj;
      const row = j * d;
      H[row] += vx;
      for (let k = 1; k <= j; k++) H[row + k] += vx * X[base + k - 1];
    }
  }
  for (let j = 1; j <= nCols; j++) {
    g[j] += l2 * beta[j];
    H[j * d + j] += l2;
  }
}

/** Σ_c X[base + c] · w[offset + c]. */
function rowDot(X: Float64Array, base: number, w: Float64Array, nCols: number, offset = 0): number {
  let s = 0;
  for (let c = 0; c < nCols; c++) s += X[base + c] * w[offset + c];
  return s;
}

function sigmoid(z: number): number {
  if (z >= 0) return 1 / (1 + Math.exp(-z));
  const e = Math.exp(z);
  return e / (1 + e);
}

function softplus(z: number): number {
  return z > 0 ? z + Math.log1p(Math.exp(-z)) : Math.log1p(Math.exp(z));
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

function maxAbs(a: Float64Array): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

function checkBothClasses(y: Uint8Array): void {
  let ones = 0;
  for (let i = 0; i < y.length; i++) ones += y[i];
  if (ones === 0 || ones === y.length) {
    throw new RangeError(
      `logistic.fit: all ${y.length} training labels are ${ones === 0 ? 0 : 1} — both classes are needed (stratify the folds)`,
    );
  }
}

function checkLogisticOptions(options: LogisticOptions): void {
  if (!Number.isFinite(options.l2) || options.l2 < 0) {
    throw new InputError(`logistic option l2: must be a finite number >= 0, got ${String(options.l2)} — use e.g. l2: 1`);
  }
}
