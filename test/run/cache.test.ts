/**
 * The feature cache: reruns compute only what changed, corrupt entries are never used, and
 * cached values equal freshly computed ones bit for bit. The reference throughout is a run
 * without any cache (the grid engine itself is checked against published values in
 * test/features); computations are counted through RunOptions.onComputed, never timed.
 */
import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadStudy } from '../../src/study/index.ts';
import { runStudy } from '../../src/run/index.ts';
import { computeFeatureStage } from '../../src/run/run-study.ts';
import { bytesToSamples, cacheKey, exactJson, samplesToBytes, keyFamily, parseExactJson, pruneCache, summariseCache, clearCache, openFeatureCache } from '../../src/run/feature-cache.ts';
import fc from 'fast-check';
import type { Cell, FeatureOptions } from '../../src/features/index.ts';
import { recordingFeatures, storeOutcome, type RecordingTask } from '../../src/run/recording-features.ts';
import { seriesText, twoGroupStudy } from '../helpers/tmp.ts';

const STUDY = 'name: t\nseed: 5\ngroups:\n  a: a/*.csv\n  b: b/*.csv\ngrid: {order: [3, 4], delay: [1, 2], scale: [1, 2]}\nevaluation: {folds: 2, repeats: 1, permutations: 0}\n';
const folders: string[] = [];
afterAll(() => folders.forEach((d) => rmSync(d, { recursive: true, force: true })));

function studyFolder(text = STUDY, perGroup = 3, n = 300): string {
  const dir = twoGroupStudy(text, perGroup, n);
  folders.push(dir);
  return dir;
}

/** Runs the feature stage and returns features.csv and the computed cells per recording. */
async function features(dir: string, out: string, overrides: string[] = [], cacheDir: string | null = join(dir, 'cache')) {
  const computed = new Map<string, Cell[]>();
  const study = loadStudy(join(dir, 'study.yaml'), { overrides });
  const outcome = await runStudy(study, { out: join(dir, out), stage: 'features', commandLine: 'test', cacheDir, onComputed: (id, cells) => computed.set(id, cells) });
  const count = [...computed.values()].reduce((a, c) => a + c.length, 0);
  return { csv: readFileSync(join(dir, out, 'features.csv'), 'utf8'), quality: readFileSync(join(dir, out, 'quality.csv'), 'utf8'), computed, count, warnings: outcome.warnings };
}

describe('feature cache', () => {
  it('a rerun after adding one scale computes only the new cells, and equals an uncached run', async () => {
    const dir = studyFolder();
    const cold = await features(dir, 'cold');
    expect(cold.count).toBe(6 * 2 * 2 * 2); // 6 recordings x (order 3,4) x (delay 1,2) x (scale 1,2)
    const rerun = await features(dir, 'rerun', ['grid.scale=1,2,3']);
    expect(rerun.count).toBe(6 * 2 * 2); // only scale 3, for every recording
    for (const cells of rerun.computed.values()) expect(cells.every((c) => c.scale === 3)).toBe(true);
    const fresh = await features(dir, 'fresh', ['grid.scale=1,2,3'], null);
    expect(fresh.count).toBe(6 * 2 * 2 * 3);
    expect(rerun.csv).toBe(fresh.csv);
    expect(rerun.quality).toBe(fresh.quality);
    const again = await features(dir, 'again', ['grid.scale=1,2,3']);
    expect(again.count).toBe(0);
    expect(again.csv).toBe(fresh.csv);
  });

  it('adding one order computes only that order, under the composite scale form and the jitter tie rule too', async () => {
    const text = STUDY.replace('evaluation:', 'features: {ties: jitter, jitter_repeats: 3, scale_form: composite}\nevaluation:');
    const dir = studyFolder(text);
    await features(dir, 'cold');
    const rerun = await features(dir, 'rerun', ['grid.order=3,4,5']);
    expect(rerun.count).toBe(6 * 2 * 2);
    for (const cells of rerun.computed.values()) expect(cells.every((c) => c.order === 5)).toBe(true);
    expect(rerun.csv).toBe((await features(dir, 'fresh', ['grid.order=3,4,5'], null)).csv);
  });

  it('a changed input file recomputes only that recording', async () => {
    const dir = studyFolder();
    await features(dir, 'cold');
    writeFileSync(join(dir, 'b', 'b1.csv'), seriesText(300, 77));
    const rerun = await features(dir, 'rerun');
    expect([...rerun.computed.entries()].filter(([, c]) => c.length > 0).map(([id]) => id)).toEqual(['b1']);
    expect(rerun.computed.get('b1')).toHaveLength(8);
    expect(rerun.csv).toBe((await features(dir, 'fresh', [], null)).csv);
  });

  it('a changed setting that the features depend on recomputes everything; the evaluation settings do not', async () => {
    const dir = studyFolder();
    await features(dir, 'cold');
    expect((await features(dir, 'r1', ['evaluation.folds=3'])).count).toBe(0);
    expect((await features(dir, 'r2', ['features.min_windows_per_pattern=7'])).count).toBe(48);
    expect((await features(dir, 'r3', ['signal.start=10'])).count).toBe(48);
  });

  it('a rerun reads one pack per recording: with the cell entries gone it still computes nothing', async () => {
    const dir = studyFolder();
    const cold = await features(dir, 'cold');
    rmSync(join(dir, 'cache', 'cells'), { recursive: true });
    const again = await features(dir, 'again');
    expect(again.count).toBe(0);
    expect(again.csv).toBe(cold.csv);
  });

  it('a corrupted entry is detected, reported, recomputed and rewritten — never used', async () => {
    const dir = studyFolder();
    const cold = await features(dir, 'cold');
    const firstEntry = (kind: string) => {
      const kindDir = join(dir, 'cache', kind);
      const prefix = readdirSync(kindDir).sort()[0];
      return join(kindDir, prefix, readdirSync(join(kindDir, prefix)).sort()[0]);
    };
    // change one digit of the payload, keeping the JSON valid
    const tamper = (text: string) => text.replace(/(\d)(\d)(,)/, (_m, a: string, b: string, c: string) => `${a}${(Number(b) + 1) % 10}${c}`);
    // a corrupt pack: its cells come from their own entries, nothing is recomputed, the pack is rewritten
    const pack = firstEntry('packs');
    const packText = readFileSync(pack, 'utf8');
    writeFileSync(pack, tamper(packText));
    const afterPack = await features(dir, 'after-pack');
    expect(afterPack.count).toBe(0);
    expect(afterPack.warnings.some((w) => w.includes('is corrupt') && w.includes(pack))).toBe(true);
    expect(afterPack.csv).toBe(cold.csv);
    expect(readFileSync(pack, 'utf8')).toBe(packText);
    // a corrupt cell entry, with the packs gone: that cell is recomputed and rewritten
    rmSync(join(dir, 'cache', 'packs'), { recursive: true });
    const entry = firstEntry('cells');
    const original = readFileSync(entry, 'utf8');
    const tampered = tamper(original);
    expect(tampered).not.toBe(original);
    writeFileSync(entry, tampered);
    const rerun = await features(dir, 'rerun');
    expect(rerun.count).toBe(1);
    expect(rerun.warnings.some((w) => w.includes('is corrupt') && w.includes(entry))).toBe(true);
    expect(rerun.csv).toBe(cold.csv);
    expect(readFileSync(entry, 'utf8')).toBe(original);
    rmSync(join(dir, 'cache', 'packs'), { recursive: true });
    writeFileSync(entry, 'garbage');
    expect((await features(dir, 'r2')).count).toBe(1);
  });

  it('a corrupted series entry is reported and the file parsed instead; the entry is rewritten', async () => {
    const dir = studyFolder();
    await features(dir, 'cold');
    const seriesDir = join(dir, 'cache', 'series');
    const prefix = readdirSync(seriesDir).sort()[0];
    const entry = join(seriesDir, prefix, readdirSync(join(seriesDir, prefix)).sort()[0]);
    const original = readFileSync(entry);
    const tampered = Buffer.from(original);
    tampered[tampered.length - 3] ^= 0x01; // one bit of the last sample
    writeFileSync(entry, tampered);
    const rerun = await features(dir, 'rerun', ['grid.scale=1,2,3']);
    expect(rerun.warnings.some((w) => w.includes('is corrupt') && w.includes(entry))).toBe(true);
    expect(rerun.csv).toBe((await features(dir, 'fresh', ['grid.scale=1,2,3'], null)).csv);
    expect(readFileSync(entry).equals(original)).toBe(true);
  });

  it('summarises, prunes by last use and clears, refusing a folder that is not a cache', async () => {
    const dir = studyFolder(STUDY, 2, 200);
    await features(dir, 'cold');
    const cache = join(dir, 'cache');
    const s = summariseCache(cache);
    expect(s.entries).toEqual({ cells: 4 * 8, packs: 4, recordings: 4, series: 4 });
    expect(s.bytes).toBeGreaterThan(0);
    expect(pruneCache(cache, 1).entries).toBe(0);
    expect(pruneCache(cache, 0, new Date(Date.now() + 2 * 86400000)).entries).toBe(44);
    expect(summariseCache(cache).entries).toEqual({ cells: 0, packs: 0, recordings: 0, series: 0 });
    await features(dir, 'again');
    expect(clearCache(cache).entries).toBe(44);
    expect(() => clearCache(join(dir, 'a'))).toThrow(/is not a patternfold cache folder/);
  });

  it('stores samples exactly as little-endian binary64 (IEEE 754) and refuses a payload of part of a double', () => {
    const values = Float64Array.of(1.5, NaN, -0, 5e-324, -1.7976931348623157e308, 0.1);
    const bytes = samplesToBytes(values);
    expect(Buffer.from(bytes.subarray(0, 8)).toString('hex')).toBe('000000000000f83f'); // 1.5 = 0x3FF8000000000000 [D]
    const back = bytesToSamples(bytes)!;
    expect(Array.from(back).every((v, i) => Object.is(v, values[i]))).toBe(true);
    expect(bytesToSamples(bytes.subarray(0, 13))).toBeNull();
  });

  it('holds parsed samples for the series cache only within the budget; cells are cached either way', async () => {
    const dir = studyFolder();
    const study = loadStudy(join(dir, 'study.yaml'));
    const cacheDir = join(dir, 'cache');
    await computeFeatureStage(study, undefined, { cacheDir, pool: null, seriesBudgetBytes: 300 * 8 * 2 }); // room for two recordings of 300 samples
    expect(summariseCache(cacheDir).entries).toEqual({ cells: 6 * 8, packs: 6, recordings: 6, series: 2 });
  });

  it('a rerun that computes new cells takes the facts and the samples from the cache instead of parsing the file again', async () => {
    const dir = studyFolder();
    const options: FeatureOptions = { ties: 'appearance', jitterRepeats: 1, scaleForm: 'coarse', seed: 1, minWindowsPerPattern: 5 };
    const task = (cells: Cell[], cacheDir: string | null): RecordingTask => ({ path: join(dir, 'a', 'a1.csv'), signal: { column: 1, start: 0, length: null }, options, cells, cacheDir });
    const cacheDir = join(dir, 'cache');
    const first = await recordingFeatures(task([{ order: 3, delay: 1, scale: 1 }], cacheDir));
    expect(first.factsComputed).toBe(true);
    storeOutcome(task([{ order: 3, delay: 1, scale: 1 }], cacheDir), first, openFeatureCache(cacheDir));
    const widened = [{ order: 3, delay: 1, scale: 1 }, { order: 3, delay: 1, scale: 2 }];
    const second = await recordingFeatures(task(widened, cacheDir));
    expect(second.parsed).toBe(false);
    expect(second.factsComputed).toBe(false);
    expect(second.series).toBeNull();
    expect(second.computed).toEqual([{ order: 3, delay: 1, scale: 2 }]);
    const uncached = await recordingFeatures(task(widened, null)); // reference: parsed from the file
    expect(uncached.parsed).toBe(true);
    expect(second.facts).toEqual(uncached.facts);
    expect(exactJson(second.cells)).toBe(exactJson(uncached.cells));
  });
});

describe('cache entry encoding', () => {
  it('keeps NaN, infinities, -0 and every finite double exactly (ECMA-262 shortest round trip)', () => {
    const values = [NaN, Infinity, -Infinity, -0, 0, 0.1 + 0.2, 5e-324, 1.7976931348623157e308, -123.456];
    const back = parseExactJson<{ v: number[] }>(exactJson({ v: values })).v;
    back.forEach((v, i) => expect(Object.is(v, values[i])).toBe(true));
  });

  it('keys do not depend on the order of fields', () => {
    expect(cacheKey({ a: 1, b: { c: [1, 2], d: 'x' } })).toBe(cacheKey({ b: { d: 'x', c: [1, 2] }, a: 1 }));
    expect(cacheKey({ a: 1 })).not.toBe(cacheKey({ a: 2 }));
  });

  it('a key family gives exactly the key of the merged parts, wherever the varying part sorts', () => {
    const value = fc.oneof(fc.integer(), fc.string(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }));
    fc.assert(
      fc.property(fc.dictionary(fc.string({ minLength: 1, maxLength: 6 }), value, { maxKeys: 5 }), fc.string({ minLength: 1, maxLength: 6 }), value, (shared, name, varying) => {
        const rest = Object.fromEntries(Object.entries(shared).filter(([k]) => k !== name));
        expect(keyFamily(rest, name)(varying)).toBe(cacheKey({ ...rest, [name]: varying }));
      }),
    );
  });

  it('an entry under another key is not served (a copied or renamed entry file)', () => {
    const dir = studyFolder(STUDY, 2, 50);
    const cache = openFeatureCache(join(dir, 'c'));
    cache.write('cells', 'aa11', { x: 1 });
    writeFileSync(join(dir, 'c', 'cells', 'aa', 'aa22.entry'), readFileSync(join(dir, 'c', 'cells', 'aa', 'aa11.entry')));
    expect(cache.read('cells', 'aa11')).toEqual({ x: 1 });
    expect(cache.read('cells', 'aa22')).toBeNull();
    expect(cache.warnings).toHaveLength(1);
  });
});
