/**
 * Interrupted runs lose nothing and fool no one (issue 7): a real run in a child process is
 * killed with SIGKILL at several points; the output folder is then either absent or the
 * previous complete one, and a rerun gives exactly the numbers of an uninterrupted run.
 * The pause points come from the test hook in src/run/test-pause.ts.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { twoGroupStudy } from '../helpers/tmp.ts';

const BIN = join(import.meta.dirname, '..', '..', 'bin', 'patternfold.js');
const STUDY = `name: kill-test
seed: 7
groups:
  a: a/*.csv
  b: b/*.csv
grid: {order: [3, 4], delay: [1], scale: [1, 2]}
evaluation: {folds: 3, repeats: 2, permutations: 30, trees: 20}
`;

function runToEnd(dir: string, out: string): void {
  const r = spawnSync(process.execPath, [BIN, 'run', join(dir, 'study.yaml'), '--out', out, '--quiet'], { encoding: 'utf8' });
  expect(r.stderr).toBe('');
  expect(r.status).toBe(0);
}

/** Starts a run that pauses at `point`, waits until it says so, then kills it with SIGKILL. */
async function killAt(dir: string, out: string, point: string): Promise<void> {
  const child = spawn(process.execPath, [BIN, 'run', join(dir, 'study.yaml'), '--out', out, '--quiet'], {
    env: { ...process.env, PATTERNFOLD_TEST_PAUSE: point },
  });
  await new Promise<void>((resolve, reject) => {
    let err = '';
    child.stderr.on('data', (chunk: Buffer) => {
      err += chunk.toString();
      if (err.includes('patternfold-test-paused')) {
        child.kill('SIGKILL');
        resolve();
      }
    });
    child.on('exit', (code) => reject(new Error(`the run ended (${code}) before pausing at ${point}: ${err}`)));
  });
  await new Promise((resolve) => child.once('exit', resolve));
}

/** The parts of a run's output that must not depend on interruptions (times and paths aside). */
function numbers(out: string): unknown {
  const results = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
  return {
    features: readFileSync(join(out, 'features.csv'), 'utf8'),
    quality: readFileSync(join(out, 'quality.csv'), 'utf8'),
    predictions: readFileSync(join(out, 'predictions.csv'), 'utf8'),
    evaluation: results.evaluation,
    univariate: results.univariate,
    recordings: results.recordings,
  };
}

/**
 * Every entry of the feature cache beside the study verifies: its header's checksum is the
 * SHA-256 (FIPS 180-4, node:crypto) of its payload bytes (JSON text, or binary64 samples). Temporary files (dot names) are ignored.
 */
function corruptCacheEntries(dir: string): string[] {
  const root = join(dir, '.patternfold-cache');
  const bad: string[] = [];
  const walk = (folder: string): void => {
    for (const entry of readdirSync(folder, { withFileTypes: true })) {
      const path = join(folder, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (!entry.name.startsWith('.') && /^(cells|packs|recordings|series)$/.test(relative(root, path).split(sep)[0])) {
        const bytes = readFileSync(path);
        const newline = bytes.indexOf(0x0a);
        const [magic, , , checksum] = bytes.toString('latin1', 0, newline).split(' ');
        const body = bytes.subarray(newline + 1);
        if (magic !== 'patternfold-cache' || createHash('sha256').update(body).digest('hex') !== checksum) bad.push(path);
      }
    }
  };
  if (existsSync(root)) walk(root);
  return bad;
}

const leftovers = (dir: string) => readdirSync(dir).filter((f) => f.includes('.staging-') || f.includes('.previous-'));

describe('a run killed with SIGKILL', () => {
  const dir = twoGroupStudy(STUDY, 6, 300);
  const reference = join(dir, 'reference');
  runToEnd(dir, reference);

  for (const point of ['features:3', 'permutations:10', 'commit']) {
    it(`at ${point} leaves no output folder, and a rerun equals an uninterrupted run`, async () => {
      const out = join(dir, `killed-${point.replace(':', '-')}`);
      await killAt(dir, out, point);
      expect(existsSync(out)).toBe(false);
      runToEnd(dir, out);
      expect(numbers(out)).toEqual(numbers(reference));
      expect(leftovers(dir)).toEqual([]);
      expect(existsSync(join(dir, '.patternfold-cache'))).toBe(true);
      expect(corruptCacheEntries(dir)).toEqual([]);
    });
  }

  it('while replacing an earlier complete output keeps that output intact', async () => {
    const out = join(dir, 'replaced');
    runToEnd(dir, out);
    const before = readFileSync(join(out, 'report.html'), 'utf8');
    await killAt(dir, out, 'commit');
    expect(readFileSync(join(out, 'report.html'), 'utf8')).toBe(before);
    expect(numbers(out)).toEqual(numbers(reference));
  });
});

/** Starts `patternfold run ARGS` in `cwd`, sends SIGTERM once it reports the features stage, and returns its exit code and stderr. */
async function terminateAtFeatures(args: string[], cwd: string): Promise<{ code: number | null; err: string }> {
  const child = spawn(process.execPath, [BIN, 'run', ...args], { cwd });
  let err = '';
  let sent = false;
  child.stderr.on('data', (chunk: Buffer) => {
    err += chunk.toString();
    if (!sent && /features/.test(err)) {
      sent = true;
      child.kill('SIGTERM');
    }
  });
  const code = await new Promise<number | null>((resolve) => child.once('exit', (c) => resolve(c)));
  return { code, err };
}

describe('a run stopped with SIGTERM', () => {
  it('says that no output folder was changed and exits with 143 (128 + 15)', async () => {
    const dir = twoGroupStudy(STUDY, 6, 300);
    const out = join(dir, 'out');
    const { code, err } = await terminateAtFeatures([join(dir, 'study.yaml'), '--out', out], dir);
    expect(code).toBe(143);
    expect(err).toMatch(/interrupted \(SIGTERM\): .*no output folder was changed/);
    expect(existsSync(out)).toBe(false);
    expect(leftovers(dir)).toEqual([]);
  });

  it('without --out leaves no empty run folder behind', async () => {
    const dir = twoGroupStudy(STUDY, 6, 300);
    const { code } = await terminateAtFeatures(['study.yaml'], dir);
    expect(code).toBe(143);
    const runs = join(dir, 'reports', 'kill-test');
    expect(existsSync(runs) ? readdirSync(runs) : []).toEqual([]);
  });
});

describe('a run interrupted with Ctrl-C (SIGINT) during permutations in one thread', () => {
  it('stops within a permutation or so, not after the whole test, and exits with 130 (128 + 2)', async () => {
    const dir = twoGroupStudy(STUDY.replace('permutations: 30', 'permutations: 2000'), 6, 300);
    const out = join(dir, 'out');
    const child = spawn(process.execPath, [BIN, 'run', join(dir, 'study.yaml'), '--out', out, '--jobs', '1'], { cwd: dir });
    let err = '';
    let sent = false;
    child.stderr.on('data', (chunk: Buffer) => {
      err += chunk.toString();
      if (!sent && /permutations: 10\//.test(err)) {
        sent = true;
        child.kill('SIGINT');
      }
    });
    const code = await new Promise<number | null>((resolve) => child.once('exit', (c) => resolve(c)));
    expect(code).toBe(130);
    expect(err).toMatch(/interrupted \(SIGINT\)/);
    // progress lines come at 10, 100, 1000 permutations: a loop that ignored the signal until
    // the end of the test would have printed the 1000 line first
    expect(err).not.toMatch(/permutations: 1000\//);
    expect(existsSync(out)).toBe(false);
    expect(leftovers(dir)).toEqual([]);
  }, 60000);
});
