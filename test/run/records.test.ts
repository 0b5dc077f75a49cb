/**
 * Run records (own folder per run, compare), the cache command and the progress display.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { claimRunFolder, runFolderBase } from '../../src/run/run-folder.ts';
import { settingChanges } from '../../src/run/compare-runs.ts';
import { createProgress, formatClock, progressLine } from '../../src/cli/progress.ts';
import { parseJobs } from '../../src/run/worker-pool.ts';
import { formatBytes } from '../../src/cli/cache-command.ts';
import { makeFolder, twoGroupStudy } from '../helpers/tmp.ts';
import { runCli } from '../helpers/cli.ts';

const STUDY = 'name: Rec Study\nseed: 2\ngroups:\n  a: a/*.csv\n  b: b/*.csv\ngrid: {order: [3], delay: [1], scale: [1, 2]}\nevaluation: {folds: 2, repeats: 1, permutations: 9, trees: 10}\n';
const folders: string[] = [];
afterAll(() => folders.forEach((d) => rmSync(d, { recursive: true, force: true })));

const cli = runCli;

describe('run records', () => {
  it('names a run reports/<slug>/<UTC time>-<hash> and never gives two runs one folder', () => {
    const base = runFolderBase({ name: 'Fresh vs Fatigued!', text: 'x', overrides: [] }, new Date('2026-12-01T10:20:30.456Z'));
    expect(base).toMatch(/^reports\/fresh-vs-fatigued\/20261201-102030Z-[0-9a-f]{8}$/);
    const dir = makeFolder({});
    folders.push(dir);
    const claimed = [1, 2, 3].map(() => claimRunFolder(join(dir, 'r', 'same')));
    expect(claimed).toEqual([join(dir, 'r', 'same'), join(dir, 'r', 'same-2'), join(dir, 'r', 'same-3')]);
  });

  it('compare prints the changed setting, the headline and every cell of both runs', async () => {
    const dir = twoGroupStudy(STUDY, 4, 200);
    folders.push(dir);
    const study = join(dir, 'study.yaml');
    expect((await cli('run', study, '--out', join(dir, 'A'), '--quiet', '--jobs', '1')).code).toBe(0);
    expect((await cli('run', study, '--out', join(dir, 'B'), '--quiet', '--jobs', '1', '--set', 'grid.scale=1,2,3')).code).toBe(0);
    const r = await cli('compare', join(dir, 'A'), join(dir, 'B', 'results.json'));
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/settings: \d+ change\(s\)/);
    expect(r.out).toMatch(/grid\.scale\s+\[1,2\]\s+\[1,2,3\]/);
    expect(r.out).toMatch(/recordings: same files, same content/);
    expect(r.out).toMatch(/AUC \(cross-validated\)/);
    const a = JSON.parse(readFileSync(join(dir, 'A', 'results.json'), 'utf8'));
    const cell = a.evaluation.cells.find((c: { scale: number }) => c.scale === 2);
    // the cell line shows run A's AUC as stored in results.json, and '-' for the cell run A lacks
    expect(r.out).toContain(`3/1/2  ${cell.auc.toFixed(3)}`);
    expect(r.out).toMatch(/3\/1\/3\s+-\s+\d\.\d{3}\s+-/);
    expect((await cli('compare', join(dir, 'A'), join(dir, 'nowhere'))).code).toBe(2);
  }, 60000);

  it('runs without --out go to folders of their own, and the cache command reports and clears the cache beside the study', async () => {
    const dir = twoGroupStudy(STUDY.replace('permutations: 9', 'permutations: 0'), 3, 150);
    folders.push(dir);
    const cwd = process.cwd();
    process.chdir(dir);
    try {
      expect((await cli('features', 'study.yaml', '--quiet')).code).toBe(0);
      expect((await cli('features', 'study.yaml', '--quiet')).code).toBe(0);
      const runs = readdirSync(join(dir, 'reports', 'rec-study'));
      expect(runs).toHaveLength(2);
      expect(new Set(runs).size).toBe(2);
      const shown = await cli('cache', 'study.yaml');
      expect(shown.out).toMatch(/12 cell entries, 6 pack entries, 6 recording entries, 6 series entries/);
      const cleared = await cli('cache', 'study.yaml', '--clear');
      expect(cleared.out).toMatch(/removed 30 entries/);
      expect((await cli('cache', 'study.yaml', '--prune-older-than', 'soon')).code).toBe(2);
      expect((await cli('features', 'study.yaml', '--quiet', '--no-cache')).code).toBe(0);
      expect((await cli('cache', 'study.yaml')).out).toMatch(/0 cell entries, 0 pack entries, 0 recording entries, 0 series entries/);
      expect((await cli('features', 'study.yaml', '--shard', '1/2')).out).toMatch(/shard 1\/2: 6 \(recording x cell\) unit\(s\) over 3 recording\(s\): 6 computed, 0 already cached/);
      expect(existsSync(join(dir, '.patternfold-cache', 'CACHEDIR.TAG'))).toBe(true);
    } finally {
      process.chdir(cwd);
    }
  });

  it('lists setting changes leaf by leaf', () => {
    expect(settingChanges({ grid: { order: [3], delay: [1] }, seed: 1 }, { grid: { order: [3, 4], delay: [1] }, seed: 1, x: true })).toEqual([
      { path: 'grid.order', a: '[3]', b: '[3,4]' },
      { path: 'x', a: '(absent)', b: 'true' },
    ]);
  });
});

describe('progress and options', () => {
  it('draws a bar with counts and time left on a terminal, colours only without NO_COLOR', () => {
    expect(progressLine('features', 5, 20, 10, 20, false)).toBe('features         [#####---------------] 5/20  0:10 elapsed, 0:30 left');
    expect(progressLine('features', 5, 20, 10, 20, true)).toContain('\u001b[32m');
    let written = '';
    let t = 0;
    const p = createProgress({ write: (s) => void (written += s), isTTY: true, columns: 100 }, { NO_COLOR: '1' }, () => t);
    p.onProgress('features', 1, 4);
    t = 1000;
    p.onProgress('features', 4, 4);
    expect(written).not.toContain('\u001b[32m');
    expect(written).toMatch(/\r.*1\/4.*\r.*4\/4.*\n$/s);
  });

  it('writes plain lines off a terminal: one per finished stage, one at counts 10, 100, ..., one per 10 seconds', () => {
    let written = '';
    let t = 0;
    const p = createProgress({ write: (s) => void (written += s), isTTY: false }, {}, () => t);
    p.onProgress('permutations', 1, 100);
    t = 2000;
    p.onProgress('permutations', 10, 100);
    t = 5000;
    p.onProgress('permutations', 50, 100);
    t = 12000;
    p.onProgress('permutations', 60, 100);
    t = 13000;
    p.onProgress('permutations', 100, 100);
    expect(written).toBe('permutations: 10/100 (0:02 elapsed, about 0:18 left)\npermutations: 60/100 (0:12 elapsed, about 0:08 left)\npermutations: 100/100 (0:13 elapsed)\n');
    expect(written).not.toContain('\u001b');
  });

  it('formats clocks, bytes and reads --jobs', () => {
    expect(formatClock(65)).toBe('1:05');
    expect(formatClock(3 * 3600 + 5)).toBe('3:00:05');
    expect(formatBytes(999)).toBe('999 B');
    expect(formatBytes(1500)).toBe('1.5 kB');
    expect(parseJobs('3')).toBe(3);
    expect(() => parseJobs('0')).toThrow(/--jobs: '0' is not a whole number of at least 1/);
  });

  it('the installed command runs with --jobs 2 from another folder (workers load the TypeScript sources)', async () => {
    const { spawnSync } = await import('node:child_process');
    const dir = twoGroupStudy(STUDY, 3, 150);
    folders.push(dir);
    mkdirSync(join(dir, 'elsewhere'));
    const bin = join(import.meta.dirname, '..', '..', 'bin', 'patternfold.js');
    const r = spawnSync(process.execPath, [bin, 'run', join(dir, 'study.yaml'), '--out', join(dir, 'o'), '--jobs', '2', '--quiet'], { cwd: join(dir, 'elsewhere'), encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(JSON.parse(readFileSync(join(dir, 'o', 'results.json'), 'utf8')).evaluation.headline.permutations).toBe(9);
  }, 60000);
});
