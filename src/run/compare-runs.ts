/**
 * Comparison of two run records (their results.json): which settings, inputs and versions
 * changed, and how the headline and per-cell results moved. No I/O besides reading the two
 * files in {@link readRunRecord}.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../shared/errors.ts';
import type { Results } from './results.ts';

/** A setting whose value differs, as dotted path and JSON text of both sides ('(absent)' when missing). */
export interface SettingChange {
  path: string;
  a: string;
  b: string;
}

/** One number of both runs and its change b − a (null when either side is missing). */
export interface Movement {
  name: string;
  a: number | null;
  b: number | null;
  change: number | null;
}

export interface CellMovement {
  order: number;
  delay: number;
  scale: number;
  auc: Movement;
  pAdjusted: Movement;
}

export interface RunComparison {
  settings: SettingChange[];
  recordings: { added: string[]; removed: string[]; changed: string[] };
  headline: Movement[];
  cells: CellMovement[];
  univariate: { significantA: number; significantB: number; largestMoves: (Movement & { column: string })[] };
}

/**
 * Reads results.json of a run folder (or the file itself). Throws InputError naming the path
 * when it is missing or not a patternfold results file.
 */
export function readRunRecord(path: string): Results {
  const file = existsSync(path) && statSync(path).isDirectory() ? join(path, 'results.json') : path;
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    const code = (e as { code?: string }).code;
    throw new InputError(`${file}: ${code === 'ENOENT' ? 'no such file' : 'not readable JSON'} — give a run folder (holding results.json) or a results.json file`);
  }
  const schema = (data as { schema?: unknown } | null)?.schema;
  if (typeof schema !== 'string' || !schema.startsWith('patternfold-results/')) {
    throw new InputError(`${file}: not a patternfold results file (no "schema": "patternfold-results/…") — give the results.json of a run`);
  }
  return data as Results;
}

const move = (name: string, a: number | null | undefined, b: number | null | undefined): Movement => ({
  name,
  a: a ?? null,
  b: b ?? null,
  change: a === null || a === undefined || b === null || b === undefined ? null : b - a,
});

/** Leaf-by-leaf differences of two JSON values, paths dotted ("grid.scale"); arrays compare whole. */
export function settingChanges(a: unknown, b: unknown, path = ''): SettingChange[] {
  const isObject = (v: unknown) => v !== null && typeof v === 'object' && !Array.isArray(v);
  if (isObject(a) && isObject(b)) {
    const keys = [...new Set([...Object.keys(a as object), ...Object.keys(b as object)])].sort();
    return keys.flatMap((k) => settingChanges((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], path ? `${path}.${k}` : k));
  }
  const text = (v: unknown) => (v === undefined ? '(absent)' : JSON.stringify(v));
  return text(a) === text(b) ? [] : [{ path, a: text(a), b: text(b) }];
}

const cellKey = (c: { order: number; delay: number; scale: number }) => `${c.order}/${c.delay}/${c.scale}`;

/**
 * What changed from run A to run B: settings (study settings, seed, overrides, study file
 * hash, tool version), recordings added, removed or with other content, the headline numbers
 * and each grid cell's AUC and adjusted p-value, and the univariate rows (q < 0.05 counts and
 * the five largest moves of Hedges' g). Cells present in one run only have nulls on the other side.
 */
export function compareRuns(a: Results, b: Results): RunComparison {
  const settings = settingChanges(
    { tool: a.tool?.version, study: { sha256: a.study.sha256, seed: a.study.seed, overrides: a.study.overrides, groups: a.study.groups }, ...a.settings },
    { tool: b.tool?.version, study: { sha256: b.study.sha256, seed: b.study.seed, overrides: b.study.overrides, groups: b.study.groups }, ...b.settings },
  );
  const recA = new Map(a.recordings.map((r) => [r.id, r.sha256]));
  const recB = new Map(b.recordings.map((r) => [r.id, r.sha256]));
  const recordings = {
    added: [...recB.keys()].filter((id) => !recA.has(id)),
    removed: [...recA.keys()].filter((id) => !recB.has(id)),
    changed: [...recB.keys()].filter((id) => recA.has(id) && recA.get(id) !== recB.get(id)),
  };
  const ha = a.evaluation?.headline;
  const hb = b.evaluation?.headline;
  const headline = [
    move('AUC (cross-validated)', ha?.auc, hb?.auc),
    move('balanced accuracy', ha?.balanced_accuracy, hb?.balanced_accuracy),
    move('p-value (permutation)', ha?.p_value, hb?.p_value),
    move('permutations run', ha?.permutations, hb?.permutations),
    move('nested best-cell AUC', a.evaluation?.nested?.auc, b.evaluation?.nested?.auc),
  ];
  const cellsA = new Map((a.evaluation?.cells ?? []).map((c) => [cellKey(c), c]));
  const cellsB = new Map((b.evaluation?.cells ?? []).map((c) => [cellKey(c), c]));
  const keys = [...new Set([...cellsA.keys(), ...cellsB.keys()])];
  const cells = keys
    .map((k) => {
      const ca = cellsA.get(k);
      const cb = cellsB.get(k);
      const c = (ca ?? cb)!;
      return { order: c.order, delay: c.delay, scale: c.scale, auc: move('AUC', ca?.auc, cb?.auc), pAdjusted: move('adjusted p', ca?.p_adjusted, cb?.p_adjusted) };
    })
    .sort((x, y) => x.scale - y.scale || x.delay - y.delay || x.order - y.order);
  const column = (r: { feature: string; order: number; delay: number; scale: number }) => `${r.feature} ${r.order}/${r.delay}/${r.scale}`;
  const uniA = new Map((a.univariate ?? []).map((r) => [column(r), r]));
  const uniB = new Map((b.univariate ?? []).map((r) => [column(r), r]));
  const significant = (rows: Results['univariate']) => (rows ?? []).filter((r) => r.qValue !== null && r.qValue < 0.05).length;
  const largestMoves = [...uniB.keys()]
    .filter((k) => uniA.has(k))
    .map((k) => ({ column: k, ...move("Hedges' g", uniA.get(k)!.hedgesG, uniB.get(k)!.hedgesG) }))
    .filter((m) => m.change !== null && m.change !== 0)
    .sort((x, y) => Math.abs(y.change!) - Math.abs(x.change!))
    .slice(0, 5);
  return { settings, recordings, headline, cells, univariate: { significantA: significant(a.univariate), significantB: significant(b.univariate), largestMoves } };
}
