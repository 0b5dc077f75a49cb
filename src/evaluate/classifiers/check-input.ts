/**
 * Shape checks shared by the classifiers (internal).
 *
 * The pipeline imputes and scales before fitting, so a malformed table here is a bug in
 * the caller, not a user mistake: these throw RangeError (exit code 1), never InputError.
 */
import type { TrainingSet } from '../classifier.ts';

/**
 * Throws RangeError unless `train` has at least one row, X of length nRows·nCols without
 * NaN or infinity, and nRows labels that are 0 or 1.
 */
export function checkTrainingSet(train: TrainingSet, who: string): void {
  const { X, nRows, nCols, y } = train;
  if (!Number.isInteger(nRows) || nRows < 1 || !Number.isInteger(nCols) || nCols < 0) {
    throw new RangeError(`${who}.fit: needs at least one row and a whole number of columns, got nRows ${nRows}, nCols ${nCols}`);
  }
  if (X.length !== nRows * nCols) {
    throw new RangeError(`${who}.fit: X has ${X.length} values, expected nRows x nCols = ${nRows * nCols}`);
  }
  if (y.length !== nRows) throw new RangeError(`${who}.fit: y has ${y.length} labels, expected ${nRows}`);
  for (let i = 0; i < nRows; i++) {
    if (y[i] > 1) throw new RangeError(`${who}.fit: label of row ${i} is ${y[i]}, expected 0 or 1`);
  }
  for (let k = 0; k < X.length; k++) {
    if (!Number.isFinite(X[k])) {
      const row = Math.floor(k / nCols);
      throw new RangeError(
        `${who}.fit: X[row ${row}, column ${k - row * nCols}] is ${X[k]} — impute and scale inside the training fold before fitting`,
      );
    }
  }
}

/** Throws RangeError unless X holds nRows rows of nCols values. */
export function checkPredictionInput(X: Float64Array, nRows: number, nCols: number, who: string): void {
  if (!Number.isInteger(nRows) || nRows < 0 || X.length !== nRows * nCols) {
    throw new RangeError(`${who}.predict: X has ${X.length} values, expected nRows x ${nCols} columns with nRows = ${nRows}`);
  }
}
