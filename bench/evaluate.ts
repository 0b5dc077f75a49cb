/**
 * Benchmark of the headline permutation test: a seeded table of 120 subjects x 60 columns
 * (two groups of 60, a weak shift in 5 columns), 5 stratified folds, 1 repeat, a 100-tree
 * forest, 1000 label permutations, single thread.
 *
 * When Debian's python3-sklearn is installed, the same table goes through scikit-learn's
 * permutation_test_score (RandomForestClassifier(n_estimators=100), StratifiedKFold(5),
 * scoring roc_auc, n_jobs=1) with fewer permutations (default 20); its time is scaled
 * linearly to 1000 permutations and the ratio printed. Target (issue 4): ours <= 1/5 of it.
 *
 * Run: node --import tsx bench/evaluate.ts [--permutations 1000] [--sklearn-permutations 20] [--no-sklearn]
 */
import { spawnSync } from 'node:child_process';
import { performance } from 'node:perf_hooks';
import { classifierFor, prepareStudy } from '../src/evaluate/evaluate.ts';
import { runPermutationTest } from '../src/evaluate/permutation.ts';
import type { EvaluationSettings, FeatureMatrix } from '../src/evaluate/types.ts';
import { createRng } from '../src/shared/random.ts';

export interface EvaluateBenchFigures {
  oursSeconds: number;
  oursPermutations: number;
  sklearnSeconds: number | null;
  sklearnPermutations: number | null;
  /** sklearn's time scaled to oursPermutations, divided by ours (higher is better; target >= 5). */
  speedup: number | null;
}

/** The seeded 120 x 60 table: 60 subjects per group, columns 0..4 shifted by 0.4 SD in group 1. */
export function benchTable(seed = 2024): FeatureMatrix {
  const rng = createRng(seed);
  const n = 120;
  const p = 60;
  const values = new Float64Array(n * p);
  const labels = new Uint8Array(n);
  for (let r = 0; r < n; r++) {
    labels[r] = r < 60 ? 0 : 1;
    for (let c = 0; c < p; c++) values[r * p + c] = rng.normal() + (labels[r] === 1 && c < 5 ? 0.4 : 0);
  }
  return {
    rowIds: Array.from({ length: n }, (_, r) => `r${r}`),
    subjects: Array.from({ length: n }, (_, r) => `s${r}`),
    labels,
    groupNames: ['a', 'b'],
    columns: Array.from({ length: p }, (_, c) => ({ feature: `f${c}`, order: 3, delay: 1, scale: 1 })),
    values,
  };
}

const SKLEARN_SCRIPT = `
import json, sys, time
import numpy as np
from sklearn.ensemble import RandomForestClassifier
from sklearn.model_selection import StratifiedKFold, permutation_test_score
d = json.load(sys.stdin)
X = np.array(d["values"]).reshape(d["n"], d["p"]); y = np.array(d["labels"])
t = time.perf_counter()
score, perm, p = permutation_test_score(
    RandomForestClassifier(n_estimators=100, random_state=0, n_jobs=1), X, y,
    cv=StratifiedKFold(5, shuffle=True, random_state=0), n_permutations=d["B"],
    scoring="roc_auc", n_jobs=1, random_state=0)
print(json.dumps({"seconds": time.perf_counter() - t, "score": score, "p": p}))
`;

function flag(name: string, fallback: number): number {
  const i = process.argv.indexOf(name);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

/** Runs both sides and prints figures; returns them for bench/run-all.ts. */
export async function benchEvaluate(options: { permutations?: number; sklearnPermutations?: number; sklearn?: boolean } = {}): Promise<EvaluateBenchFigures> {
  const B = options.permutations ?? 1000;
  const sklearnB = options.sklearnPermutations ?? 20;
  const matrix = benchTable();
  const settings: EvaluationSettings = { folds: 5, repeats: 1, permutations: B, classifier: 'forest', trees: 100, l2: 1, stopEarly: false, seed: 7 };
  const start = performance.now();
  const study = prepareStudy(matrix, settings, classifierFor(settings));
  const observed = study.pipeline.statistics(study.subjects.labels);
  const run = runPermutationTest(study.pipeline, observed, B, null);
  const oursSeconds = (performance.now() - start) / 1000;
  console.log(`evaluate: headline test, 120 x 60, 5 folds, 100 trees, ${B} permutations, 1 thread`);
  console.log(`  patternfold   ${oursSeconds.toFixed(2)} s  (${((oursSeconds / (B + 1)) * 1000).toFixed(1)} ms per pipeline run)  AUC ${observed[0].toFixed(3)}  p ${run.headline.p_value.toFixed(4)}`);

  const figures: EvaluateBenchFigures = { oursSeconds, oursPermutations: B, sklearnSeconds: null, sklearnPermutations: null, speedup: null };
  if (options.sklearn === false) return figures;
  const input = JSON.stringify({ n: 120, p: 60, values: Array.from(matrix.values), labels: Array.from(matrix.labels), B: sklearnB });
  const py = spawnSync('/usr/bin/python3', ['-c', SKLEARN_SCRIPT], { input, encoding: 'utf8', env: { ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1' } });
  if (py.status !== 0) {
    console.log(`  scikit-learn  not measured (${(py.stderr || 'python3-sklearn not installed').trim().split('\n').pop()})`);
    return figures;
  }
  const sk = JSON.parse(py.stdout) as { seconds: number; score: number; p: number };
  // sklearn fits the observed CV plus sklearnB permuted ones: scale per pipeline run to B + 1 runs
  const scaled = (sk.seconds / (sklearnB + 1)) * (B + 1);
  figures.sklearnSeconds = sk.seconds;
  figures.sklearnPermutations = sklearnB;
  figures.speedup = scaled / oursSeconds;
  console.log(`  scikit-learn  ${sk.seconds.toFixed(2)} s for ${sklearnB} permutations (${((sk.seconds / (sklearnB + 1)) * 1000).toFixed(1)} ms per pipeline run) -> ${scaled.toFixed(1)} s scaled to ${B}  AUC ${sk.score.toFixed(3)}`);
  console.log(`  ratio         patternfold takes ${(1 / figures.speedup).toFixed(3)} of scikit-learn's time (${figures.speedup.toFixed(1)}x faster; target >= 5x)`);
  return figures;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchEvaluate({
    permutations: flag('--permutations', 1000),
    sklearnPermutations: flag('--sklearn-permutations', 20),
    sklearn: !process.argv.includes('--no-sklearn'),
  });
}
