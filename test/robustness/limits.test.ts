/**
 * Resource limits (issue 7): check warns with an estimate; run refuses without --force and
 * writes nothing.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { estimateStatisticsCost } from '../../src/run/index.ts';
import { loadStudy } from '../../src/study/index.ts';
import { twoGroupStudy } from '../helpers/tmp.ts';
import { runCli } from '../helpers/cli.ts';

const cli = runCli;

const BASE = 'name: t\ngroups:\n  a: a/*.csv\n  b: b/*.csv\n';

describe('estimateStatisticsCost', () => {
  it('counts (1 + B)·repeats·folds·(1 + cells) fits plus the nested CV, repeats·folds·(cells·folds + 1) [D]', () => {
    const dir = twoGroupStudy(BASE + 'grid: {order: [3, 4], delay: [1], scale: [1, 2]}\nevaluation: {folds: 3, repeats: 2, permutations: 9}\n');
    const cost = estimateStatisticsCost(loadStudy(join(dir, 'study.yaml')));
    expect(cost.fits).toBe(10 * 2 * 3 * (1 + 4) + 2 * 3 * (4 * 3 + 1));
  });
});

describe('a study beyond sensible limits', () => {
  it('is warned about by check, with an estimate', async () => {
    const dir = twoGroupStudy(BASE + 'evaluation: {folds: 2, permutations: 1000000}\n');
    const r = await cli('check', join(dir, 'study.yaml'));
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/the statistics would need about [\d.]+e\+\d+ model fits, roughly .* of CPU time/);
  });

  it('needs --force to run, and nothing is written without it', async () => {
    const dir = twoGroupStudy(BASE + 'evaluation: {folds: 2, permutations: 1000000}\n');
    const out = join(dir, 'out');
    const r = await cli('run', join(dir, 'study.yaml'), '--out', out, '--quiet');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/or add --force to run it anyway/);
    expect(existsSync(out)).toBe(false);
  });

  it('flags an order whose m! exceeds the recordings (order 9 on 200 samples)', async () => {
    const dir = twoGroupStudy(BASE + 'grid: {order: [3, 9], delay: [1], scale: [1]}\nevaluation: {folds: 2, repeats: 1, permutations: 0}\n');
    const checked = await cli('check', join(dir, 'study.yaml'));
    expect(checked.out).toMatch(/order 9 has more possible patterns \(9! = 362880\) than the median recording has samples \(200\)/);
    const r = await cli('run', join(dir, 'study.yaml'), '--out', join(dir, 'out'), '--quiet');
    expect(r.code).toBe(2);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });
});
