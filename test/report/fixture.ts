/**
 * A realistic ReportInput with INVENTED, clearly synthetic values: 20 + 20 subjects, a grid of
 * 3 orders x 3 delays x 4 scales, nine features. Numbers are drawn from the project's seeded
 * generator so every run builds the same page; none of them is a result of any real study.
 * `hostileInput` puts script tags, quotes, ampersands and a right-to-left override into every
 * user-supplied string.
 */
import { createRng } from '../../src/shared/random.ts';
import type { Rng } from '../../src/shared/random.ts';
import { FEATURE_NAMES } from '../../src/features/types.ts';
import type {
  CohortRow, CurvePoint, GridScanCell, PlaneCell, ReportCell, ReportInput, UnivariateRow,
} from '../../src/report/types.ts';

const ORDERS = [3, 4, 5];
const DELAYS = [1, 2, 4];
const SCALES = [1, 2, 3, 4];

function cells(): ReportCell[] {
  const out: ReportCell[] = [];
  for (const order of ORDERS) for (const delay of DELAYS) for (const scale of SCALES) out.push({ order, delay, scale });
  return out;
}

function factorial(n: number): number {
  return n <= 1 ? 1 : n * factorial(n - 1);
}

/** Shannon entropy (nats) of a distribution given as (probability, multiplicity) pairs. */
function entropy(parts: [number, number][]): number {
  let s = 0;
  for (const [p, k] of parts) if (p > 0) s -= k * p * Math.log(p);
  return s;
}

/**
 * (H, C) of a distribution over N patterns given as (probability, multiplicity) pairs, with
 * C = Q0 J(P, U) H as in shared/DESIGN.md. Used only to draw plausible bound curves for the
 * fixture (families from Martin, Plastino & Rosso 2006, Physica A 369, 439 [M]).
 */
function hc(parts: [number, number][], N: number): CurvePoint {
  const h = entropy(parts) / Math.log(N);
  const mixed: [number, number][] = parts.map(([p, k]) => [(p + 1 / N) / 2, k]);
  const js = entropy(mixed) - entropy(parts) / 2 - Math.log(N) / 2;
  const q0 = -2 / (((N + 1) / N) * Math.log(N + 1) - 2 * Math.log(2 * N) + Math.log(N));
  return { h, c: q0 * js * h };
}

function boundCurves(order: number): { min: CurvePoint[]; max: CurvePoint[] } {
  const N = factorial(order);
  const min: CurvePoint[] = [];
  for (let i = 0; i <= 60; i++) {
    const p = 1 / N + ((1 - 1 / N) * i) / 60;
    min.push(hc([[p, 1], [(1 - p) / (N - 1), N - 1]], N));
  }
  const max: CurvePoint[] = [];
  for (let n = 0; n <= N - 2; n += Math.max(1, Math.floor((N - 1) / 40))) {
    const steps = 8;
    for (let i = 0; i <= steps; i++) {
      const p = (i / steps) / (N - n);
      max.push(hc([[0, n], [p, 1], [(1 - p) / (N - n - 1), N - n - 1]], N));
    }
  }
  max.sort((a, b) => a.h - b.h);
  return { min: min.sort((a, b) => a.h - b.h), max };
}

/** Linear interpolation of C at H along a curve sorted by H. */
function interpolate(curve: CurvePoint[], h: number): number {
  for (let i = 1; i < curve.length; i++) {
    if (curve[i].h >= h) {
      const a = curve[i - 1], b = curve[i];
      return b.h === a.h ? b.c : a.c + ((b.c - a.c) * (h - a.h)) / (b.h - a.h);
    }
  }
  return curve[curve.length - 1].c;
}

function gauss(rng: Rng, mean: number, sd: number): number {
  return mean + sd * rng.normal();
}

function round(v: number, d = 4): number {
  return Math.round(v * 10 ** d) / 10 ** d;
}

export interface FixtureNames {
  studyName: string;
  groupNames: [string, string];
  subjectPrefix: [string, string];
  filePrefix: string;
  warning: string;
  studyExtra: string;
}

const PLAIN: FixtureNames = {
  studyName: 'Synthetic demo: resting heart-rate series (invented values)',
  groupNames: ['control', 'patient'],
  subjectPrefix: ['c', 'p'],
  filePrefix: 'data/',
  warning: 'order 5 at scale 4 leaves fewer than 5 windows per pattern',
  studyExtra: '',
};

export const HOSTILE_SCRIPT = '<script>alert(1)</script>';
export const HOSTILE_QUOTES = `"'&`;
export const RLO = '\u202E';

const HOSTILE: FixtureNames = {
  studyName: `${HOSTILE_SCRIPT} study ${HOSTILE_QUOTES}${RLO}gnp.exe`,
  groupNames: [`${HOSTILE_SCRIPT}`, `${HOSTILE_QUOTES}${RLO}b`],
  subjectPrefix: [`<img src=x onerror=alert(2)>`, `"'&${RLO}`],
  filePrefix: `<script>alert(3)</script>/${RLO}`,
  warning: `</td><script>alert(4)</script>`,
  studyExtra: '\n# </pre><script>alert(5)</script>\n',
};

export function buildInput(names: FixtureNames = PLAIN, perGroup = 20): ReportInput {
  const rng = createRng(20240611);
  const subjects: { id: string; group: 0 | 1 }[] = [];
  for (const g of [0, 1] as const) for (let i = 1; i <= perGroup; i++) subjects.push({ id: `${names.subjectPrefix[g]}${String(i).padStart(2, '0')}`, group: g });

  const cohort: CohortRow[] = subjects.map((s, i) => ({
    id: `${s.id}-rec1`,
    subject: s.id,
    group: s.group,
    length: 4000 + Math.round(rng.next() * 2000),
    missingShare: round(rng.next() < 0.2 ? rng.next() * 0.05 : 0),
    tiedShare: round(0.02 + rng.next() * 0.08),
    warnings: i % 9 === 4 ? [names.warning] : [],
  }));

  const grid = cells();
  const gridScan: GridScanCell[] = grid.map((c) => {
    const auc = c.order === 5 && c.scale === 4 ? null : round(0.55 + 0.05 * c.order - 0.02 * c.delay - 0.01 * c.scale + gauss(rng, 0, 0.02), 3);
    return { ...c, auc, adjustedP: auc === null ? null : round(Math.min(1, Math.max(0.001, (0.76 - auc) * 4)), 3) };
  });

  const univariate: UnivariateRow[] = [];
  for (const c of grid) {
    for (const feature of FEATURE_NAMES) {
      const g = round(gauss(rng, feature.includes('entropy') ? -0.6 : 0.1, 0.4), 3);
      const missing = feature === 'weighted_permutation_entropy' && c.order === 5 && c.scale === 4;
      const m0 = round(0.5 + rng.next() * 0.4);
      univariate.push({
        ...c, feature, n: [perGroup, perGroup - (missing ? 3 : 0)],
        mean: [m0, missing ? null : round(m0 + g * 0.05)], sd: [0.05, missing ? null : 0.05],
        hedgesG: missing ? null : g, gLow: missing ? null : round(g - 0.63, 3), gHigh: missing ? null : round(g + 0.63, 3),
        mannWhitneyP: missing ? null : round(Math.min(1, Math.exp(-Math.abs(g) * 4)), 5),
        auc: missing ? null : round(0.5 - g * 0.2, 3),
        q: missing ? null : round(Math.min(1, Math.exp(-Math.abs(g) * 4) * 3), 5),
        note: missing ? 'too few windows per pattern for 3 subjects' : undefined,
      });
    }
  }

  const chosen: ReportCell[] = [{ order: 3, delay: 1, scale: 1 }, { order: 4, delay: 1, scale: 2 }, { order: 5, delay: 2, scale: 1 }];
  const plane: PlaneCell[] = chosen.map((cell) => {
    const bounds = boundCurves(cell.order);
    return {
      cell,
      bounds,
      points: subjects.map((s, i) => {
        const h = round(Math.min(0.99, gauss(rng, s.group === 0 ? 0.9 : 0.82, 0.03)));
        const lo = interpolate(bounds.min, h);
        const hi = interpolate(bounds.max, h);
        const c = round(lo + (hi - lo) * Math.min(0.95, Math.max(0.05, gauss(rng, 0.6, 0.15))));
        return { subject: s.id, group: s.group, h: i === 3 ? null : h, c: i === 3 ? null : c };
      }),
    };
  });

  const distributions = univariate
    .filter((r) => r.hedgesG !== null)
    .sort((a, b) => Math.abs(b.hedgesG as number) - Math.abs(a.hedgesG as number))
    .slice(0, 6)
    .map((r) => ({
      feature: r.feature, order: r.order, delay: r.delay, scale: r.scale,
      values: [0, 1].map((g) => Array.from({ length: perGroup }, () => round(gauss(rng, g === 0 ? 0.8 : 0.8 + 0.05 * (r.hedgesG as number), 0.05)))) as [number[], number[]],
    }));

  const roc = [{ fpr: 0, tpr: 0 }];
  for (let i = 1; i <= perGroup; i++) {
    const fpr = i / perGroup;
    roc.push({ fpr: round(fpr - 0.5 / perGroup), tpr: round(Math.min(1, Math.sqrt(fpr) * 1.05)) });
    roc.push({ fpr: round(fpr), tpr: round(Math.min(1, Math.sqrt(fpr) * 1.05)) });
  }

  const nullScores = Array.from({ length: 999 }, () => round(gauss(rng, 0.5, 0.07), 3));
  const columns = univariate.map((r) => `${r.feature} m${r.order} τ${r.delay} s${r.scale}`);
  const projection = {
    subjects: subjects.map((s) => s.id),
    groups: subjects.map((s) => s.group),
    columns,
    rows: subjects.map((s) => univariate.map((r, j) => (j % 37 === 5 && s.group === 1 ? null : round(gauss(rng, s.group * (r.hedgesG ?? 0), 1))))),
  };

  const studyText = `# Synthetic demo study (invented)\nname: ${JSON.stringify(names.studyName)}\ngroups:\n  ${JSON.stringify(names.groupNames[0])}: ${names.filePrefix}control/*.csv\n  ${JSON.stringify(names.groupNames[1])}: ${names.filePrefix}patient/*.csv\ngrid:\n  order: [3, 4, 5]\n  delay: [1, 2, 4]\n  scale: [1, 2, 3, 4]\nfolds: 5\nrepeats: 10\npermutations: 999\nseed: 7\n${names.studyExtra}`;

  return {
    studyName: names.studyName,
    groupNames: names.groupNames,
    subjectsPerGroup: [perGroup, perGroup],
    alpha: 0.05,
    headline: {
      auc: 0.781, interval: { low: 0.652, high: 0.893, level: 0.95, method: 'percentile bootstrap over subjects, 2000 draws' },
      permutationP: 0.004, permutationPSe: round(Math.sqrt((0.004 * 0.996) / 999), 5),
      permutations: 999, repeats: 10, folds: 5, classifier: 'logistic',
    },
    cohort,
    warnings: [
      { message: 'The two groups differ in median recording length by 4%.' },
      { subject: subjects[4].id, file: `${names.filePrefix}control/${subjects[4].id}.csv`, message: names.warning },
    ],
    notes: [`2 recording(s) lie outside the study file's folder (e.g. ../${names.filePrefix}x.csv): keep the folders together when you share the study`],
    gridScan,
    selection: {
      naiveBest: { order: 5, delay: 1, scale: 1, auc: 0.842 }, nestedAuc: 0.781,
      nestedInterval: { low: 0.652, high: 0.893, level: 0.95, method: 'percentile bootstrap over subjects' },
      pickedCells: [{ order: 5, delay: 1, scale: 1, times: 31 }, { order: 4, delay: 1, scale: 1, times: 15 }, { order: 5, delay: 1, scale: 2, times: 4 }],
    },
    univariate,
    plane,
    distributions,
    roc,
    nullScores,
    projection,
    importance: {
      method: 'mean drop in out-of-fold AUC when the column is permuted',
      rows: univariate.slice(0, 60).map((r, i) => ({ feature: r.feature, order: r.order, delay: r.delay, scale: r.scale, importance: round(0.05 * Math.exp(-i / 8), 4), sd: round(0.005 + 0.003 * (i % 4), 4) })),
    },
    reproduction: {
      studyPath: `${names.filePrefix}study.yaml`,
      studyText,
      commandLine: ['patternfold', 'run', `${names.filePrefix}study.yaml`, '--out', `reports/it's here`],
      inputFiles: subjects.map((s) => ({ path: `${names.filePrefix}${s.group === 0 ? 'control' : 'patient'}/${s.id}.csv`, sha256: 'ab'.repeat(32), bytes: 48213 })),
      toolVersion: '0.1.0', nodeVersion: 'v20.20.2',
      dependencies: { vega: '6.4.0', 'vega-lite': '6.4.3', 'ml-pca': '4.1.1', 'escape-html': '1.0.3' },
      platform: 'linux x64', seed: 7, startedAt: '2024-06-11T09:30:00.000Z', durationMs: 83_500,
    },
  };
}

export function hostileInput(): ReportInput {
  return buildInput(HOSTILE);
}
