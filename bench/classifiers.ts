/**
 * Benchmark of the classifiers (issue 4) on a seeded 96 x 60 table (48 rows per class,
 * class 1 shifted by 0.5 SD in four columns), one thread:
 *
 * - our forest: ms per 100-tree fit on all 96 rows, and per fit + predict on a 77/19 split
 *   (one fold of 5-fold CV, the permutation test's unit of work);
 * - ml-random-forest 2.1.0, 100 trees, in the bagging mode the tests compare with (every
 *   column, no per-split sampling) and with floor(sqrt(p)) columns per tree;
 * - scikit-learn's RandomForestClassifier(n_estimators=100, max_features='sqrt', n_jobs=1)
 *   fit time, by spawning /usr/bin/python3 when python3-sklearn is installed;
 * - the logistic regression (l2 = 1) against LogisticRegression(C=1, solver
 *   'newton-cholesky').
 *
 * Each figure is the median wall time of several runs after warm-up; ratios are other /
 * ours (above 1: ours is faster). Figures vary with the machine's load, printed first.
 *
 * Run: node --import tsx bench/classifiers.ts [--runs 30]
 *
 * Instruction counts, which do not depend on the machine's load: `--forest-fits N` only
 * warms up (50 fits) and then fits the forest N times on the 96-row table and predicts 19
 * rows, so that under valgrind
 *   valgrind --tool=callgrind --callgrind-out-file=/dev/null node --import tsx bench/classifiers.ts --forest-fits 10
 * and the same with 30 give the instructions per fit as (I(30) − I(10)) / 20.
 */
import { spawnSync } from 'node:child_process';
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { RandomForestClassifier } from 'ml-random-forest';
import type { TrainingSet } from '../src/evaluate/classifier.ts';
import { createForest, createLogistic } from '../src/evaluate/classifiers/index.ts';
import { createRng } from '../src/shared/random.ts';
import { argument } from './arguments.ts';

export interface ClassifierBenchRow {
  task: string;
  msPerFit: number;
  /** Other implementation's time / ours, when this row is the other one. */
  ratioToOurs?: number;
}

const N_ROWS = 96;
const N_COLS = 60;
const TREES = 100;


/** The seeded benchmark table (row-major), standardised as the pipeline would. */
function benchTable(): TrainingSet {
  const rng = createRng(20240601);
  const X = new Float64Array(N_ROWS * N_COLS);
  const y = new Uint8Array(N_ROWS);
  for (let i = 0; i < N_ROWS; i++) {
    y[i] = i % 2;
    for (let c = 0; c < N_COLS; c++) X[i * N_COLS + c] = rng.normal() + (c < 4 && y[i] === 1 ? 0.5 : 0);
  }
  return { X, nRows: N_ROWS, nCols: N_COLS, y };
}

function subset(t: TrainingSet, rows: number[]): TrainingSet {
  const X = new Float64Array(rows.length * t.nCols);
  rows.forEach((r, k) => X.set(t.X.subarray(r * t.nCols, (r + 1) * t.nCols), k * t.nCols));
  return { X, nRows: rows.length, nCols: t.nCols, y: Uint8Array.from(rows, (r) => t.y[r]) };
}

/** Median wall time in ms of `runs` calls after `warmup` unmeasured ones. */
function medianMs(runs: number, warmup: number, task: (k: number) => unknown): number {
  for (let k = 0; k < warmup; k++) task(k);
  const times: number[] = [];
  for (let k = 0; k < runs; k++) {
    const start = performance.now();
    task(warmup + k);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(runs / 2)];
}

function rowsOf(t: TrainingSet): number[][] {
  return Array.from({ length: t.nRows }, (_, i) => Array.from(t.X.subarray(i * t.nCols, (i + 1) * t.nCols)));
}

const PYTHON_TIMER = `
import json, sys, time
import numpy as np
from sklearn.ensemble import RandomForestClassifier
from sklearn.linear_model import LogisticRegression
d = json.load(sys.stdin)
X = np.array(d['X']).reshape(d['nRows'], d['nCols']); y = np.array(d['y'])
def median_ms(make, runs):
    make(0).fit(X, y)
    ts = []
    for k in range(runs):
        m = make(k + 1); t = time.perf_counter(); m.fit(X, y); ts.append((time.perf_counter() - t) * 1000)
    return sorted(ts)[runs // 2]
print(json.dumps({
  'forest': median_ms(lambda k: RandomForestClassifier(n_estimators=${TREES}, max_features='sqrt', random_state=k, n_jobs=1), d['runs']),
  'logistic': median_ms(lambda k: LogisticRegression(C=1.0, solver='newton-cholesky'), d['runs']),
}))
`;

/** scikit-learn's fit times, or null (with the reason printed) when python3-sklearn is missing. */
function sklearnTimes(t: TrainingSet, runs: number): { forest: number; logistic: number } | null {
  const input = JSON.stringify({ X: Array.from(t.X), y: Array.from(t.y), nRows: t.nRows, nCols: t.nCols, runs });
  const result = spawnSync('/usr/bin/python3', ['-c', PYTHON_TIMER], { input, encoding: 'utf8' });
  if (result.status !== 0) {
    console.log(`scikit-learn not measured: ${result.error?.message ?? result.stderr.trim().split('\n').pop()}`);
    return null;
  }
  return JSON.parse(result.stdout) as { forest: number; logistic: number };
}

export async function benchClassifiers(options: { runs?: number } = {}): Promise<ClassifierBenchRow[]> {
  const runs = options.runs ?? 30;
  const table = benchTable();
  const rows: ClassifierBenchRow[] = [];
  const report = (row: ClassifierBenchRow) => {
    rows.push(row);
    const ratio = row.ratioToOurs === undefined ? '' : `   ratio to ours ${row.ratioToOurs.toFixed(1)}x`;
    console.log(`${row.task.padEnd(62)} ${row.msPerFit.toFixed(2).padStart(9)} ms${ratio}`);
  };
  console.log(`classifiers on a seeded ${N_ROWS} x ${N_COLS} table, ${TREES} trees; load average ${loadavg().map((v) => v.toFixed(2)).join(' ')}`);

  const forest = createForest({ trees: TREES });
  const ours = medianMs(runs, 10, (k) => forest.fit(table, k));
  report({ task: 'ours: forest fit, 96 rows', msPerFit: ours });
  const trainRows = Array.from({ length: N_ROWS }, (_, i) => i).filter((i) => i % 5 !== 0);
  const testRows = Array.from({ length: N_ROWS }, (_, i) => i).filter((i) => i % 5 === 0);
  const train = subset(table, trainRows);
  const test = subset(table, testRows);
  report({ task: 'ours: forest fit 77 rows + predict 19 (one CV fold)', msPerFit: medianMs(runs, 10, (k) => forest.fit(train, k).predict(test.X, test.nRows)) });
  const bagging = createForest({ trees: TREES, maxFeatures: N_COLS });
  const oursBagging = medianMs(Math.max(3, runs / 5), 2, (k) => bagging.fit(table, k));
  report({ task: 'ours: bagging mode (maxFeatures = p), 96 rows', msPerFit: oursBagging });

  const mlRuns = 3;
  const X = rowsOf(table);
  const yList = Array.from(table.y);
  const mlBagging = medianMs(mlRuns, 1, (k) =>
    new RandomForestClassifier({ nEstimators: TREES, seed: k + 1, noOOB: true, maxFeatures: 1.0, replacement: false, treeOptions: { minNumSamples: 1, gainThreshold: 0 } }).train(X, yList),
  );
  report({ task: 'ml-random-forest: bagging mode (every column), 96 rows', msPerFit: mlBagging, ratioToOurs: mlBagging / oursBagging });
  const mlSqrt = medianMs(mlRuns, 1, (k) =>
    new RandomForestClassifier({ nEstimators: TREES, seed: k + 1, noOOB: true, maxFeatures: Math.floor(Math.sqrt(N_COLS)), replacement: false }).train(X, yList),
  );
  report({ task: 'ml-random-forest: sqrt(p) columns per tree, 96 rows', msPerFit: mlSqrt, ratioToOurs: mlSqrt / ours });

  const logistic = createLogistic({ l2: 1 });
  const oursLogistic = medianMs(runs, 5, (k) => logistic.fit(table, k));
  report({ task: 'ours: logistic fit (l2 = 1), 96 rows', msPerFit: oursLogistic });

  const sk = sklearnTimes(table, Math.max(5, Math.floor(runs / 3)));
  if (sk) {
    report({ task: "scikit-learn: RandomForestClassifier fit, max_features='sqrt'", msPerFit: sk.forest, ratioToOurs: sk.forest / ours });
    report({ task: "scikit-learn: LogisticRegression fit, 'newton-cholesky'", msPerFit: sk.logistic, ratioToOurs: sk.logistic / oursLogistic });
  }
  return rows;
}

/** Only forest fits (for instruction counts under callgrind); prints a checksum of the predictions. */
function forestFitsOnly(fits: number): void {
  const table = benchTable();
  const forest = createForest({ trees: TREES });
  const test = table.X.subarray(0, 19 * N_COLS);
  let checksum = 0;
  for (let k = 0; k < 50 + fits; k++) checksum += forest.fit(table, k).predict(test, 19)[0];
  console.log(`${fits} forest fits after 50 for warm-up; checksum ${checksum.toFixed(6)}`);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  if (process.argv.includes('--forest-fits')) forestFitsOnly(argument('--forest-fits', 10));
  else await benchClassifiers({ runs: argument('--runs', 30) });
}
