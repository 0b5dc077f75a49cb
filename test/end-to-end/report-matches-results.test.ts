/**
 * One source of truth (issue 5): the numbers the report shows are those of results.json, and
 * the report carries what is needed to reproduce the run.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import type { Io } from '../../src/cli/terminal.ts';
import { formatNumber, formatP } from '../../src/report/format.ts';
import { twoGroupStudy } from '../helpers/tmp.ts';

const STUDY = `name: e2e
seed: 11
groups:
  a: a/*.csv
  b: b/*.csv
grid: {order: [3, 4], delay: [1], scale: [1, 2]}
evaluation: {folds: 3, repeats: 2, permutations: 19, trees: 20}
`;

describe('patternfold run', () => {
  const dir = twoGroupStudy(STUDY, 6, 300);
  const out = join(dir, 'out');
  const io: Io = { out: () => undefined, err: () => undefined };
  const done = main(['run', join(dir, 'study.yaml'), '--out', out, '--quiet'], io);

  it('writes the full report folder', async () => {
    expect(await done).toBe(0);
    const results = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
    expect(results.outputs.sort()).toEqual(
      ['features.arrow', 'features-wide.csv', 'features.csv', 'predictions.csv', 'quality.csv', 'report.html', 'results.json', 'univariate.csv'].sort(),
    );
  });

  it('shows the headline AUC, its interval and the permutation p of results.json', async () => {
    await done;
    const results = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    const h = results.evaluation.headline;
    expect(html).toContain(`p = ${formatP(h.p_value)}`);
    expect(html).toContain(formatNumber(h.auc, 2));
    expect(h.permutations).toBe(19);
    expect(html).toMatch(new RegExp(`shuffled ${h.permutations} times`));
  });

  it('carries the study file verbatim and the SHA-256 of every input file', async () => {
    await done;
    const results = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    for (const r of results.recordings) expect(html).toContain(r.sha256);
    expect(html).toContain('grid: {order: [3, 4], delay: [1], scale: [1, 2]}');
  });

  it('exports one probability per subject and repeat, and one wide row per recording', async () => {
    await done;
    const predictions = readFileSync(join(out, 'predictions.csv'), 'utf8').trim().split('\n');
    expect(predictions[0]).toBe('subject,group,repeat,probability');
    expect(predictions).toHaveLength(1 + 12 * 2);
    const wide = readFileSync(join(out, 'features-wide.csv'), 'utf8').trim().split('\n');
    expect(wide).toHaveLength(1 + 12);
    expect(wide[0].split(',')).toHaveLength(3 + 4 * 9);
  });
});
