import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { makeFolder, twoGroupStudy } from '../helpers/tmp.ts';
import { runCli } from '../helpers/cli.ts';

const BIN = join(import.meta.dirname, '..', '..', 'bin', 'patternfold.js');

const cli = runCli;

const MINIMAL = 'name: t\ngroups:\n  a: a/*.csv\n  b: b/*.csv\ngrid: {order: [3], delay: [1], scale: [1]}\nevaluation: {folds: 2, repeats: 1, permutations: 0}\n';

describe('command line', () => {
  it('the installed bin prints the version and exits 0 (a real process)', () => {
    const r = spawnSync(process.execPath, [BIN, '--version'], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(r.stdout.trim()).toBe(JSON.parse(readFileSync(join(import.meta.dirname, '..', '..', 'package.json'), 'utf8')).version);
  });

  it('the installed bin exits 2 with one line and no stack trace for a bad study (a real process)', () => {
    const dir = twoGroupStudy('name: t\ngroups:\n  a: a/*.csv\n  b: b/*.csv\ngrid:\n  scales: [1]\n');
    const r = spawnSync(process.execPath, [BIN, 'check', join(dir, 'study.yaml')], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/unknown key 'scales' at grid\.scales — did you mean 'scale'\?/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('--help works on every command', async () => {
    for (const command of ['init', 'check', 'features', 'run', 'schema']) {
      const r = await cli(command, '--help');
      expect(r.code).toBe(0);
      expect(r.out).toMatch(new RegExp(`^usage: patternfold ${command}`));
    }
    expect((await cli('--help')).out).toMatch(/exit codes: 0 success, 2 bad input or usage, 1 internal error/);
  });

  it('usage mistakes exit 2 with a suggestion', async () => {
    expect(await cli('rnu')).toMatchObject({ code: 2, err: expect.stringMatching(/unknown command 'rnu' — did you mean 'run'\?/) });
    expect(await cli('run', 'x.yaml', '--outt', 'd')).toMatchObject({ code: 2, err: expect.stringMatching(/unknown option --outt — did you mean --out\?/) });
    expect(await cli('check')).toMatchObject({ code: 2, err: expect.stringMatching(/check: missing STUDY/) });
    expect((await cli()).code).toBe(2);
  });

  it('init writes a template that check accepts once its globs match', async () => {
    const dir = makeFolder({});
    const file = join(dir, 'study.yaml');
    expect((await cli('init', file, '--name', 'demo')).code).toBe(0);
    expect(readFileSync(file, 'utf8')).toMatch(/^name: "demo"$/m);
    expect(await cli('init', file)).toMatchObject({ code: 2, err: expect.stringMatching(/already exists — choose another name or add --force/) });
  });

  it('check prints the cohort table and warns about a group smaller than the folds', async () => {
    const dir = twoGroupStudy(MINIMAL.replace('folds: 2', 'folds: 4'), 3, 120);
    const r = await cli('check', join(dir, 'study.yaml'));
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/recording\s+group\s+samples/);
    expect(r.out).toMatch(/^a0\s+a\s+120/m);
    expect(r.out).toMatch(/group 'a' has 3 subject\(s\), fewer than evaluation\.folds = 4/);
  });

  it('run writes features.csv in long form and results.json; --set changes the grid', async () => {
    const dir = twoGroupStudy(MINIMAL, 3, 150);
    const out = join(dir, 'out');
    const r = await cli('features', join(dir, 'study.yaml'), '--out', out, '--quiet', '--set', 'grid.order=3,4');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const csv = readFileSync(join(out, 'features.csv'), 'utf8').split('\n');
    expect(csv[0]).toBe('subject,group,order,delay,scale,feature,value,recording,reason');
    const orders = new Set(csv.slice(1).filter(Boolean).map((l) => l.split(',')[2]));
    expect([...orders].sort()).toEqual(['3', '4']);
    const results = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
    expect(results.study.overrides).toEqual(['grid.order=3,4']);
    expect(results.recordings).toHaveLength(6);
    expect(results.recordings[0].sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('bad input writes nothing to the output folder', async () => {
    const dir = makeFolder({ 'study.yaml': MINIMAL, 'a/x.csv': '1\n2\nabc\n', 'b/y.csv': '1\n2\n3\n' });
    const out = join(dir, 'out');
    const r = await cli('run', join(dir, 'study.yaml'), '--out', out, '--quiet');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/x\.csv:3/);
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(dir).filter((f) => f.includes('staging'))).toEqual([]);
  });
});

describe('pseudonyms', () => {
  it('keep subject ids and file names out of the output folder and write the key beside it', async () => {
    const dir = twoGroupStudy(MINIMAL + 'report: {pseudonyms: true}\n', 3, 150);
    const out = join(dir, 'out');
    const r = await cli('features', join(dir, 'study.yaml'), '--out', out, '--quiet');
    expect(r.code).toBe(0);
    for (const file of readdirSync(out)) {
      const text = readFileSync(join(out, file), 'utf8');
      for (const id of ['a0', 'a1', 'a2', 'b0', 'b1', 'b2']) expect(text).not.toMatch(new RegExp(`\\b${id}\\b`));
    }
    const key = readFileSync(`${out}.pseudonym-key.csv`, 'utf8').trim().split('\n');
    expect(key[0]).toBe('pseudonym,subject,recording,file');
    expect(key.slice(1).map((l) => l.split(',')[1]).sort()).toEqual(['a0', 'a1', 'a2', 'b0', 'b1', 'b2']);
    // Stable: a second run gives the same pseudonyms.
    await cli('features', join(dir, 'study.yaml'), '--out', join(dir, 'out2'), '--quiet');
    expect(readFileSync(join(dir, 'out2.pseudonym-key.csv'), 'utf8')).toBe(readFileSync(`${out}.pseudonym-key.csv`, 'utf8'));
  });
});
