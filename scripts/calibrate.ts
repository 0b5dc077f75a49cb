/**
 * Calibration of the evaluation pipeline (issue 4): simulated null studies (both groups from
 * one process) go through evaluateStudy — headline test, grid scan with Westfall–Young
 * adjustment, nested CV, importance — and the rate of p < 0.05 (and p <= 0.05) is printed
 * with an exact Clopper–Pearson (1934, Biometrika 26, 404) 95% interval; for a valid test it
 * must cover 0.05. Then power on a scenario with a known difference in one grid cell.
 *
 * Studies are simulated feature tables, not raw recordings (the feature stage has its own
 * tests): each subject has a common factor, each (subject, cell) a cell factor, so features
 * are correlated within and across cells as ordinal features of one recording are.
 *
 * Run: node --import tsx scripts/calibrate.ts [--studies 200] [--power-studies 100]
 *      [--subjects 20] [--permutations 99] [--folds 5] [--repeats 1] [--classifier forest|logistic]
 *      [--trees 20] [--shift 1.0] [--seed 1]
 */
import { performance } from 'node:perf_hooks';
import { evaluateStudy } from '../src/evaluate/evaluate.ts';
import type { EvaluationResult } from '../src/evaluate/result.ts';
import type { ClassifierName, EvaluationSettings, FeatureColumn, FeatureMatrix } from '../src/evaluate/types.ts';
import { createRng, deriveSeed } from '../src/shared/random.ts';

const FEATURES = ['permutation_entropy', 'statistical_complexity', 'transition_entropy'];
const CELLS: [number, number, number][] = [
  [3, 1, 1],
  [4, 1, 1],
  [3, 2, 1],
  [4, 2, 1],
];

/** One simulated study; `shift` SD is added to permutation_entropy at cell (3, 2, 1) in group 1. */
export function simulateStudy(seed: number, perGroup: number, shift: number): FeatureMatrix {
  const rng = createRng(seed);
  const columns: FeatureColumn[] = CELLS.flatMap(([order, delay, scale]) => FEATURES.map((feature) => ({ feature, order, delay, scale })));
  const n = 2 * perGroup;
  const values = new Float64Array(n * columns.length);
  const labels = new Uint8Array(n);
  for (let s = 0; s < n; s++) {
    labels[s] = s < perGroup ? 0 : 1;
    const common = rng.normal();
    CELLS.forEach((_, c) => {
      const cellFactor = rng.normal();
      FEATURES.forEach((_f, f) => {
        const j = c * FEATURES.length + f;
        const signal = labels[s] === 1 && c === 2 && f === 0 ? shift : 0;
        values[s * columns.length + j] = 0.5 * common + 0.6 * cellFactor + 0.6 * rng.normal() + signal;
      });
    });
  }
  return {
    rowIds: Array.from({ length: n }, (_, s) => `s${s}`),
    subjects: Array.from({ length: n }, (_, s) => `s${s}`),
    labels,
    groupNames: ['group A', 'group B'],
    columns,
    values,
  };
}

/**
 * Exact (Clopper–Pearson) two-sided interval for x successes in n trials: the p where the
 * binomial tails equal alpha/2, found by bisection on the tail sums. Example: x = 10, n = 200
 * -> [0.0243, 0.0900] (scipy.stats.beta.ppf agrees).
 */
export function clopperPearson(x: number, n: number, level = 0.95): [number, number] {
  const alpha = 1 - level;
  const lower = x === 0 ? 0 : bisect((p) => binomialUpperTail(x, n, p) - alpha / 2);
  const upper = x === n ? 1 : bisect((p) => alpha / 2 - binomialLowerTail(x, n, p));
  return [lower, upper];
}

/** P(X >= x) for X ~ Binomial(n, p). */
function binomialUpperTail(x: number, n: number, p: number): number {
  return 1 - binomialLowerTail(x - 1, n, p);
}

/** P(X <= x) for X ~ Binomial(n, p), pmf summed in log space. */
function binomialLowerTail(x: number, n: number, p: number): number {
  if (x < 0) return 0;
  let logPmf = n * Math.log1p(-p); // k = 0
  let sum = Math.exp(logPmf);
  for (let k = 1; k <= x; k++) {
    logPmf += Math.log((n - k + 1) / k) + Math.log(p) - Math.log1p(-p);
    sum += Math.exp(logPmf);
  }
  return Math.min(1, sum);
}

/** Root of an increasing function on (0, 1). */
function bisect(f: (p: number) => number): number {
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function flag(name: string, fallback: string): string {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : fallback;
}

function rate(label: string, hits: number, n: number): string {
  const [lo, hi] = clopperPearson(hits, n);
  return `${label.padEnd(44)} ${hits}/${n} = ${(hits / n).toFixed(3)}  (95% Clopper–Pearson ${lo.toFixed(3)} to ${hi.toFixed(3)})`;
}

function runStudies(count: number, shift: number, perGroup: number, settings: EvaluationSettings, seed: number): EvaluationResult[] {
  const out: EvaluationResult[] = [];
  for (let i = 0; i < count; i++) {
    const matrix = simulateStudy(deriveSeed(seed, shift === 0 ? 'null-study' : 'signal-study', i), perGroup, shift);
    out.push(evaluateStudy(matrix, { ...settings, seed: deriveSeed(seed, 'evaluation', i) }));
    if ((i + 1) % 20 === 0) process.stderr.write(`  ${i + 1}/${count} studies\n`);
  }
  return out;
}

function summarise(results: EvaluationResult[], title: string): void {
  const n = results.length;
  const headline = results.map((r) => r.headline.p_value as number);
  const family = results.map((r) => Math.min(...r.cells.map((c) => c.p_adjusted as number)));
  const signalCell = results.map((r) => r.cells.find((c) => c.order === 3 && c.delay === 2)?.p_adjusted as number);
  const mean = (xs: number[]): number => xs.reduce((a, b) => a + b, 0) / xs.length;
  console.log(title);
  console.log(rate('headline p < 0.05', headline.filter((p) => p < 0.05).length, n));
  console.log(rate('headline p <= 0.05', headline.filter((p) => p <= 0.05).length, n));
  console.log(rate('any cell Westfall–Young adjusted p <= 0.05', family.filter((p) => p <= 0.05).length, n));
  console.log(rate('cell (3,2,1) adjusted p <= 0.05', signalCell.filter((p) => p <= 0.05).length, n));
  const nested = results.filter((r) => r.nested?.auc != null);
  console.log(`mean headline AUC ${mean(results.map((r) => r.headline.auc as number)).toFixed(3)}; naive best cell AUC ${mean(nested.map((r) => r.nested?.naive_best_auc as number)).toFixed(3)} vs nested ${mean(nested.map((r) => r.nested?.auc as number)).toFixed(3)}`);
}

async function main(): Promise<void> {
  const studies = Number(flag('--studies', '200'));
  const powerStudies = Number(flag('--power-studies', '100'));
  const perGroup = Number(flag('--subjects', '20'));
  const shift = Number(flag('--shift', '1.0'));
  const seed = Number(flag('--seed', '1'));
  const settings: EvaluationSettings = {
    folds: Number(flag('--folds', '5')),
    repeats: Number(flag('--repeats', '1')),
    permutations: Number(flag('--permutations', '99')),
    classifier: flag('--classifier', 'forest') as ClassifierName,
    trees: Number(flag('--trees', '20')),
    l2: 1,
    stopEarly: false,
    seed,
  };
  console.log(`calibration: ${perGroup} + ${perGroup} subjects, ${CELLS.length} cells x ${FEATURES.length} features, ${settings.folds} folds, ${settings.repeats} repeat(s), ${settings.permutations} permutations, ${settings.classifier}${settings.classifier === 'forest' ? ` (${settings.trees} trees)` : ` (l2 ${settings.l2})`}, seed ${seed}`);
  let t = performance.now();
  summarise(runStudies(studies, 0, perGroup, settings, seed), `null: ${studies} studies, both groups from one process`);
  console.log(`  (${((performance.now() - t) / 1000).toFixed(1)} s)`);
  t = performance.now();
  summarise(runStudies(powerStudies, shift, perGroup, settings, seed), `power: ${powerStudies} studies, permutation_entropy at cell (3,2,1) shifted by ${shift} SD in group B`);
  console.log(`  (${((performance.now() - t) / 1000).toFixed(1)} s)`);
}

if (import.meta.url === `file://${process.argv[1]}`) await main();
