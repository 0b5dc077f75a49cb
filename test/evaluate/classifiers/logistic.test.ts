/**
 * L2 logistic regression checks. Sources, beside each check:
 * - [S] scikit-learn 1.2.1 LogisticRegression(C = 1/λ, solver 'newton-cholesky', tol 1e-12)
 *   values in fixtures/*.json, written by scripts/fixtures/classifiers/make_tables.py;
 * - [D] the stationarity conditions of the penalised likelihood, evaluated in this file:
 *   Σ_i (p_i − y_i) = 0 and Σ_i (p_i − y_i) x_ij + λ w_j = 0.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createLogistic, fitLogistic } from '../../../src/evaluate/classifiers/index.ts';
import { InputError } from '../../../src/shared/errors.ts';
import { TABLES, bruteForceAuc, classifierOutOfFold, loadFixture, wholeTable } from './helpers.ts';
import docExamples from './fixtures/doc-examples.json' with { type: 'json' };

describe('logistic: coefficients against scikit-learn [S]', () => {
  // Both sides solve the same strictly convex problem to ~1e-12; tolerance 1e-6 absolute on
  // every coefficient (8 decimals agree in practice) leaves room for rounding only.
  for (const name of TABLES) {
    const t = loadFixture(name);
    for (const ref of t.logistic) {
      it(`${name}, lambda ${ref.lambda}: intercept and weights within 1e-6`, () => {
        const model = fitLogistic(wholeTable(t), { l2: ref.lambda });
        expect(Math.abs(model.intercept - ref.intercept)).toBeLessThan(1e-6);
        ref.weights.forEach((w, j) => expect(Math.abs(model.weights[j] - w)).toBeLessThan(1e-6));
      });
    }
  }

  it('doc example: X = 0..3, y = 0,1,0,1, lambda 1 [S]', () => {
    const ex = docExamples.logistic;
    const model = fitLogistic({ X: Float64Array.from(ex.X), nRows: 4, nCols: 1, y: Uint8Array.from(ex.y) }, { l2: ex.lambda });
    expect(model.intercept).toBeCloseTo(ex.intercept, 9);
    expect(model.weights[0]).toBeCloseTo(ex.weights[0], 9);
  });
});

describe('logistic: out-of-fold AUC against scikit-learn on the same folds [S]', () => {
  for (const name of TABLES) {
    it(`${name}: AUC within 0.03 and probabilities within 1e-6`, () => {
      const t = loadFixture(name);
      const ref = t.logistic.find((r) => r.lambda === 1)!;
      const prob = classifierOutOfFold(t, createLogistic({ l2: 1 }), 0);
      expect(Math.abs(bruteForceAuc(prob, t.y) - ref.oof_auc)).toBeLessThan(0.03);
      prob.forEach((p, i) => expect(Math.abs(p - ref.oof_probability[i])).toBeLessThan(1e-6));
    });
  }
});

describe('logistic: stationarity of the penalised likelihood [D]', () => {
  it('gradient vanishes at the fit on random tables', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 4, max: 40 }),
        fc.integer({ min: 1, max: 5 }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        fc.nat(),
        (nRows, nCols, l2, seed) => {
          // Deterministic pseudo-data from the seed (a linear congruential sequence), both classes present.
          let state = seed >>> 0;
          const next = () => ((state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32) * 4 - 2;
          const X = Float64Array.from({ length: nRows * nCols }, next);
          const y = Uint8Array.from({ length: nRows }, (_, i) => (i < 2 ? i : next() > 0 ? 1 : 0));
          const model = fitLogistic({ X, nRows, nCols, y }, { l2 });
          const p = model.predict(X, nRows);
          let g0 = 0;
          const g = new Float64Array(nCols);
          for (let i = 0; i < nRows; i++) {
            g0 += p[i] - y[i];
            for (let j = 0; j < nCols; j++) g[j] += (p[i] - y[i]) * X[i * nCols + j];
          }
          expect(Math.abs(g0)).toBeLessThan(1e-8);
          g.forEach((gj, j) => expect(Math.abs(gj + l2 * model.weights[j])).toBeLessThan(1e-8));
        },
      ),
    );
  });
});

describe('logistic: determinism and edge cases', () => {
  const t = loadFixture('linear');
  const train = wholeTable(t);

  it('ignores the seed: identical probabilities for any seed', () => {
    const a = createLogistic({ l2: 1 }).fit(train, 1).predict(train.X, train.nRows);
    const b = createLogistic({ l2: 1 }).fit(train, 2).predict(train.X, train.nRows);
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('a row with NaN predicts NaN', () => {
    const model = createLogistic({ l2: 1 }).fit(train, 1);
    const X = Float64Array.from(t.X.slice(0, 2 * t.nCols));
    X[1] = NaN;
    const p = model.predict(X, 2);
    expect(Number.isNaN(p[0])).toBe(true);
    expect(Number.isNaN(p[1])).toBe(false);
  });

  it('one class only is refused with a reason', () => {
    const one = { X: Float64Array.of(1, 2, 3), nRows: 3, nCols: 1, y: Uint8Array.of(0, 0, 0) };
    expect(() => fitLogistic(one, { l2: 1 })).toThrow('logistic.fit: all 3 training labels are 0 — both classes are needed (stratify the folds)');
  });

  it('separable classes without penalty are refused (no finite optimum)', () => {
    const sep = { X: Float64Array.of(-2, -1, 1, 2), nRows: 4, nCols: 1, y: Uint8Array.of(0, 0, 1, 1) };
    expect(() => fitLogistic(sep, { l2: 0 })).toThrow(/logistic\.fit: .*use l2 > 0/);
    expect(fitLogistic(sep, { l2: 1 }).weights[0]).toBeGreaterThan(0);
  });

  it('rejects a negative penalty with InputError', () => {
    expect(() => createLogistic({ l2: -1 })).toThrow(InputError);
    expect(() => createLogistic({ l2: -1 })).toThrow('logistic option l2: must be a finite number >= 0, got -1 — use e.g. l2: 1');
  });

  it('zero columns fits the intercept only: logit of the class-1 share [D]', () => {
    const model = fitLogistic({ X: new Float64Array(0), nRows: 4, nCols: 0, y: Uint8Array.of(0, 1, 1, 1) }, { l2: 1 });
    expect(model.intercept).toBeCloseTo(Math.log(3), 12);
  });
});
