/**
 * Training-fold preprocessing on crafted tables: medians, means and spreads come from the
 * training rows only (values derived by hand [D]), constant and all-missing training columns
 * are left out.
 */
import { describe, expect, it } from 'vitest';
import { applyPreprocessing, fitPreprocessing, medianOfRows } from '../../../src/evaluate/preprocess.ts';

// 6 rows x 2 columns; rows 0..3 train, rows 4..5 test.
// column 0: train 1, 2, 3, NaN -> median 2 [D]; test 100, NaN. Median over all present rows would be 2.5.
// column 1: train 5, 5, NaN, 5 -> constant after imputation; test 7, 9.
const values = Float64Array.from([1, 5, 2, 5, 3, NaN, NaN, 5, 100, 7, NaN, 9]);
const train = Int32Array.from([0, 1, 2, 3]);
const test = Int32Array.from([4, 5]);

describe('fitPreprocessing / applyPreprocessing', () => {
  it('imputes with the training median, not the median of all rows', () => {
    const prep = fitPreprocessing(values, 2, Int32Array.from([0, 1]), train);
    expect(Array.from(prep.columns)).toEqual([0]);
    expect(prep.median[0]).toBe(2);
    // imputed training column 1,2,3,2: mean 2, population SD sqrt(0.5) [D]
    expect(prep.mean[0]).toBe(2);
    expect(prep.scale[0]).toBeCloseTo(Math.sqrt(0.5), 15);
    expect(prep.dropped).toEqual([{ column: 1, reason: 'constant in training rows' }]);
    const X = applyPreprocessing(values, 2, prep, test);
    expect(X[0]).toBeCloseTo(98 / Math.sqrt(0.5), 12);
    expect(X[1]).toBe(0); // the missing test value becomes the training median -> 0 after centring
  });

  it('gives standardised training columns: mean 0, population SD 1', () => {
    const prep = fitPreprocessing(values, 2, Int32Array.from([0]), train);
    const X = applyPreprocessing(values, 2, prep, train);
    const mean = X.reduce((a, b) => a + b, 0) / 4;
    expect(mean).toBeCloseTo(0, 15);
    expect(X.reduce((a, b) => a + b * b, 0) / 4).toBeCloseTo(1, 14);
  });

  it('leaves out a column that is all missing in the training rows', () => {
    const v = Float64Array.from([NaN, NaN, 4]);
    const prep = fitPreprocessing(v, 1, Int32Array.from([0]), Int32Array.from([0, 1]));
    expect(prep.columns.length).toBe(0);
    expect(prep.dropped).toEqual([{ column: 0, reason: 'all missing in training rows' }]);
  });

  it('medianOfRows averages the two middle values (numpy convention) and is NaN when all are missing', () => {
    const scratch = new Float64Array(4);
    expect(medianOfRows(Float64Array.from([3, NaN, 1, 2]), 1, 0, Int32Array.from([0, 1, 2, 3]), scratch)).toBe(2);
    expect(medianOfRows(Float64Array.from([4, 1, 3, 2]), 1, 0, Int32Array.from([0, 1, 2, 3]), scratch)).toBe(2.5);
    expect(medianOfRows(Float64Array.from([NaN, NaN]), 1, 0, Int32Array.from([0, 1]), scratch)).toBeNaN();
  });
});
