/**
 * Worker threads and shards change where the work runs, never the numbers: --jobs 1 and
 * --jobs 2 give byte-identical outputs (run times aside), the pooled permutation stage equals
 * runPermutationTest in one thread (with and without Besag & Clifford 1991 sequential
 * stopping), and three shards filling a cache equal one unsharded run.
 */
import { readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadStudy } from '../../src/study/index.ts';
import { runStudy } from '../../src/run/index.ts';
import { computeShard, parseShard, shardItems } from '../../src/run/shard.ts';
import { createWorkPool } from '../../src/run/worker-pool.ts';
import { inThreadPermutationStage, permutationRanges, pooledPermutationStage } from '../../src/run/permutation-stage.ts';
import { classifierFor, prepareStudy } from '../../src/evaluate/evaluate.ts';
import { runPermutationTest } from '../../src/evaluate/permutation.ts';
import type { EvaluationSettings, FeatureMatrix } from '../../src/evaluate/index.ts';
import { createRng } from '../../src/shared/random.ts';
import { IN_THREAD } from '../../src/run/feature-work.ts';
import { gridsCovering } from '../../src/run/cell-groups.ts';
import { twoGroupStudy } from '../helpers/tmp.ts';

const STUDY =
  'name: t\nseed: 11\ngroups:\n  a: a/*.csv\n  b: b/*.csv\ngrid: {order: [3, 4], delay: [1, 2], scale: [1, 2]}\n' +
  'evaluation: {folds: 2, repeats: 2, permutations: 12, trees: 15}\n';
const folders: string[] = [];
afterAll(() => folders.forEach((d) => rmSync(d, { recursive: true, force: true })));

function withoutRunTimes(path: string): string {
  const results = JSON.parse(readFileSync(path, 'utf8'));
  delete results.run;
  return JSON.stringify(results, null, 2);
}

describe('worker threads', () => {
  it('--jobs 1 and --jobs 2 give byte-identical results.json (run times aside) and feature tables', async () => {
    const dir = twoGroupStudy(STUDY, 5, 250);
    folders.push(dir);
    const study = loadStudy(join(dir, 'study.yaml'), { overrides: [] });
    for (const jobs of [1, 2]) await runStudy(study, { out: join(dir, `j${jobs}`), stage: 'all', commandLine: 'test', jobs, cacheDir: null });
    const r1 = withoutRunTimes(join(dir, 'j1', 'results.json'));
    expect(JSON.parse(r1).evaluation.headline.permutations).toBe(12);
    expect(withoutRunTimes(join(dir, 'j2', 'results.json'))).toBe(r1);
    for (const file of ['features.csv', 'quality.csv', 'univariate.csv', 'predictions.csv']) {
      expect(readFileSync(join(dir, 'j2', file), 'utf8'), file).toBe(readFileSync(join(dir, 'j1', file), 'utf8'));
    }
  }, 60000);

  it('the pooled and the in-thread permutation stages equal runPermutationTest, also when it stops early', async () => {
    // two groups of 8 subjects, 3 columns of one cell, no group difference (so stopping happens)
    const rng = createRng(3);
    const n = 16;
    const matrix: FeatureMatrix = {
      rowIds: Array.from({ length: n }, (_, i) => `r${i}`),
      subjects: Array.from({ length: n }, (_, i) => `s${i}`),
      labels: Uint8Array.from({ length: n }, (_, i) => (i < 8 ? 0 : 1)),
      groupNames: ['a', 'b'],
      columns: [1, 2, 3].map((order) => ({ feature: 'permutation_entropy' as const, order: order + 2, delay: 1, scale: 1 })),
      values: Float64Array.from({ length: n * 3 }, () => rng.normal()),
    };
    const pool = createWorkPool(2);
    try {
      for (const stopEarly of [false, true]) {
        const settings: EvaluationSettings = { folds: 2, repeats: 1, permutations: 40, classifier: 'logistic', trees: 1, l2: 1, stopEarly, seed: 9 };
        const study = prepareStudy(matrix, settings, classifierFor(settings));
        const observed = study.pipeline.statistics(study.subjects.labels);
        const stopAfter = stopEarly ? 3 : null;
        const alone = runPermutationTest(study.pipeline, observed, 40, stopAfter);
        if (stopEarly) expect(alone.stoppedEarly).toBe(true);
        // the in-thread stage lets the event loop run between permutations (so Ctrl-C is served):
        // a callback queued before it starts has run by the time the last permutation reports
        let queuedRan = false;
        let ranBeforeLast = false;
        setImmediate(() => (queuedRan = true));
        const inThread = await inThreadPermutationStage(study, observed, 40, stopAfter, () => (ranBeforeLast = queuedRan));
        expect(ranBeforeLast).toBe(true);
        const pooled = await pooledPermutationStage(pool, matrix, settings)(study, observed, 40, stopAfter, () => undefined);
        for (const run of [pooled, inThread]) {
          expect(run.stoppedEarly).toBe(alone.stoppedEarly);
          expect(run.headline).toEqual(alone.headline);
          expect(run.nullStatistics.map((s) => Array.from(s))).toEqual(alone.nullStatistics.map((s) => Array.from(s)));
        }
      }
    } finally {
      await pool.close();
    }
  }, 60000);

  it('splits permutations into ordered ranges that cover 0..B-1 once', () => {
    expect(permutationRanges(10, 2, 2)).toEqual([[0, 3], [3, 6], [6, 9], [9, 10]]);
    expect(permutationRanges(0, 4)).toEqual([]);
    expect(permutationRanges(3, 8)).toEqual([[0, 1], [1, 2], [2, 3]]);
  });
});

describe('shards', () => {
  it('reads K/N and refuses anything else', () => {
    expect(parseShard('2/3')).toEqual({ index: 2, count: 3 });
    for (const bad of ['0/3', '4/3', '3', 'a/b', '1/0']) expect(() => parseShard(bad)).toThrow(/--shard: .* is not K\/N/);
  });

  it('shards 1/3, 2/3, 3/3 are disjoint, cover every (recording x cell) unit, and together equal one unsharded run', async () => {
    const dir = twoGroupStudy(STUDY.replace('permutations: 12', 'permutations: 0'), 4, 200);
    folders.push(dir);
    const study = loadStudy(join(dir, 'study.yaml'), { overrides: [] });
    const units = [1, 2, 3].flatMap((k) => shardItems(study, { index: k, count: 3 }).flatMap((item) => item.cells.map((c) => `${item.recording.id} ${c.order}/${c.delay}/${c.scale}`)));
    expect(units).toHaveLength(8 * 8);
    expect(new Set(units).size).toBe(64);
    const cacheDir = join(dir, 'shared-cache');
    let computed = 0;
    for (const k of [1, 2, 3]) computed += (await computeShard(study, { index: k, count: 3 }, { ...IN_THREAD, cacheDir })).computed;
    expect(computed).toBe(64);
    let rerun = 0;
    await runStudy(study, { out: join(dir, 'after-shards'), stage: 'features', commandLine: 'test', cacheDir, onComputed: (_id, cells) => (rerun += cells.length) });
    expect(rerun).toBe(0);
    await runStudy(study, { out: join(dir, 'plain'), stage: 'features', commandLine: 'test', cacheDir: null });
    for (const file of ['features.csv', 'quality.csv']) {
      expect(readFileSync(join(dir, 'after-shards', file), 'utf8')).toBe(readFileSync(join(dir, 'plain', file), 'utf8'));
    }
  });
});

describe('cell groups', () => {
  it('cover exactly the requested cells, sharing one grid where delays need the same orders', () => {
    const cells = [
      { order: 3, delay: 1, scale: 1 },
      { order: 4, delay: 1, scale: 1 },
      { order: 3, delay: 2, scale: 1 },
      { order: 4, delay: 2, scale: 1 },
      { order: 3, delay: 1, scale: 2 },
    ];
    expect(gridsCovering(cells)).toEqual([
      { order: [3, 4], delay: [1, 2], scale: [1] },
      { order: [3], delay: [1], scale: [2] },
    ]);
    expect(gridsCovering([])).toEqual([]);
  });
});
