import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { chmod, mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { InputError } from '../../src/shared/errors.ts';
import { inputErrorMessage } from '../helpers/errors.ts';
import { parseRecording, readSeries, sniffFormat } from '../../src/signals/index.ts';
import { buildEdf } from './edf-builder.ts';
import { dataResolution } from '../../src/features/index.ts';

const ALL = { column: 1, start: 0, length: null } as const;
const FIXTURES = join(import.meta.dirname, 'fixtures');
const utf8 = (s: string): Uint8Array => new TextEncoder().encode(s);

const errorOf = inputErrorMessage;

async function asyncErrorOf(run: () => Promise<unknown>): Promise<string> {
  try {
    await run();
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
  throw new Error('expected an InputError');
}

describe('parseRecording: format recognition', () => {
  it('sniffFormat by leading bytes (gzip magic RFC 1952; EDF version field, Kemp et al. 1992)', () => {
    expect(sniffFormat(Uint8Array.of(0x1f, 0x8b, 8, 0))).toBe('gzip');
    expect(sniffFormat(utf8('0       rest'))).toBe('edf');
    expect(sniffFormat(Uint8Array.of(0xff, ...utf8('BIOSEMI')))).toBe('bdf');
    expect(sniffFormat(Uint8Array.of(0xff, 0xfe, 0x31, 0))).toBe('utf16');
    expect(sniffFormat(utf8('1\n2\n'))).toBe('text');
    expect(sniffFormat(new Uint8Array(0))).toBe('text');
  });

  it('binary data: NUL bytes or invalid UTF-8 in the first KB', () => {
    const message = 'b.dat: looks like a binary file (NUL bytes or bytes that are not UTF-8 text near its start) — give a text table (UTF-8), a .gz of one, or an EDF/EDF+ file';
    expect(errorOf(() => parseRecording(Uint8Array.of(0x31, 0x0a, 0x00, 0x32), ALL, 'b.dat'))).toBe(message);
    expect(errorOf(() => parseRecording(Uint8Array.of(0x31, 0x0a, 0xc3, 0x28, 0x0a), ALL, 'b.dat'))).toBe(message);
    expect(errorOf(() => parseRecording(Uint8Array.of(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a), ALL, 'b.dat'))).toBe(message);
  });

  it('a multi-byte character cut at byte 1024 is not binary; invalid UTF-8 later is reported with its line', () => {
    const head = '#'.repeat(1023) + '°\n1\n2\n';
    expect(Array.from(parseRecording(utf8(head), ALL, 'u.txt').values)).toEqual([1, 2]);
    const lines = Array.from({ length: 300 }, (_, i) => `${i}`).join('\n') + '\n';
    const bad = new Uint8Array([...utf8(lines), 0xe9, 0x0a]);
    expect(errorOf(() => parseRecording(bad, ALL, 'late.txt'))).toBe('late.txt:301: bytes that are not UTF-8 text — save the file as UTF-8');
  });

  it('UTF-16 text and BDF get their own messages', () => {
    expect(errorOf(() => parseRecording(Uint8Array.of(0xff, 0xfe, 0x31, 0x00, 0x0a, 0x00), ALL, 'w.txt'))).toBe(
      'w.txt: UTF-16 text, which patternfold does not read — save the file as UTF-8 text',
    );
    expect(errorOf(() => parseRecording(Uint8Array.of(0xff, ...utf8('BIOSEMI'), 0x20), ALL, 'r.bdf'))).toMatch(/^r\.bdf: a BDF file \(24-bit BioSemi format\)/);
  });

  it('a UTF-8 byte-order mark (ef bb bf) before a header is not part of the first name', () => {
    const s = parseRecording(Uint8Array.of(0xef, 0xbb, 0xbf, ...utf8('time;ecg\r\n0;1,5\r\n')), { column: 'time', start: 0, length: null }, 'bom.csv');
    expect(s.channel).toBe('time');
    expect(Array.from(parseRecording(Uint8Array.of(0xef, 0xbb, 0xbf, ...utf8('time;ecg\r\n0;1,5\r\n')), { column: 'ecg', start: 0, length: null }, 'bom.csv').values)).toEqual([1.5]);
  });

  it('empty file', () => {
    expect(errorOf(() => parseRecording(new Uint8Array(0), ALL, 'e.csv'))).toBe('e.csv: no samples — the file is empty; give a table of numbers or an EDF file');
  });
});

describe('gzip (fixtures written by Python\'s csv and gzip modules, values parsed by numpy.genfromtxt)', () => {
  // scripts/fixtures/signals/make_text_fixture.py
  const expected = JSON.parse(readFileSync(join(FIXTURES, 'table.expected.json'), 'utf8')) as { columns: Record<string, (number | null)[]> };
  const want = (name: string): number[] => expected.columns[name].map((v) => (v === null ? NaN : v));

  for (const file of ['table.csv.gz', 'table-gzip-without-extension.dat']) {
    it(`${file}: every column equals numpy's parse, exactly`, async () => {
      const path = join(FIXTURES, file);
      for (const name of ['time', 'ecg (mV)', 'resp']) {
        const s = await readSeries(path, { column: name, start: 0, length: null });
        expect(Array.from(s.values)).toEqual(want(name));
        expect(s.missing).toBe(want(name).filter(Number.isNaN).length);
      }
      expect((await readSeries(path, { column: 'ecg (mV)', start: 0, length: null })).missing).toBe(5);
    });
  }

  it('damaged gzip data, and an EDF file inside gzip', async () => {
    const gz = readFileSync(join(FIXTURES, 'table.csv.gz'));
    expect(errorOf(() => parseRecording(gz.subarray(0, 40), ALL, 'cut.gz'))).toMatch(/^cut\.gz: damaged gzip data \(.+\) — the file starts like gzip/);
    const { gzipSync } = await import('node:zlib');
    const edf = buildEdf({ records: 1, recordDuration: 1, signals: [{ label: 'x', physicalMin: 0, physicalMax: 1, digitalMin: 0, digitalMax: 1, samplesPerRecord: 2, digital: (_r, j) => j }] });
    expect(Array.from(parseRecording(gzipSync(edf), ALL, 'x.edf.gz').values)).toEqual([0, 1]);
  });
});

describe('readSeries: file system errors', () => {
  let dir = '';
  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'patternfold-signals-'));
    await writeFile(join(dir, 'ok.txt'), 'v\n1\n2\n');
    await writeFile(join(dir, 'locked.txt'), 'v\n1\n', { mode: 0o000 });
    await mkdir(join(dir, 'folder'));
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it('reads a file', async () => {
    const s = await readSeries(join(dir, 'ok.txt'), { column: 'v', start: 0, length: null });
    expect(Array.from(s.values)).toEqual([1, 2]);
  });

  it('missing file: path and "no such file"', async () => {
    const path = join(dir, 'absent.csv');
    expect(await asyncErrorOf(() => readSeries(path, ALL))).toBe(`${path}: cannot read — no such file; check the path and its permissions`);
  });

  it('a directory', async () => {
    const path = join(dir, 'folder');
    expect(await asyncErrorOf(() => readSeries(path, ALL))).toBe(`${path}: is a directory — give one recording file`);
  });

  it('a device is not a recording', async () => {
    expect(await asyncErrorOf(() => readSeries('/dev/null', ALL))).toBe('/dev/null: is not a regular file (a device, pipe or socket) — give one recording file');
  });

  it('a path through a file', async () => {
    const path = join(dir, 'ok.txt', 'x');
    expect(await asyncErrorOf(() => readSeries(path, ALL))).toBe(`${path}: cannot read — a part of the path is not a directory; check the path and its permissions`);
  });

  it.skipIf(process.getuid === undefined || process.getuid() === 0)('unreadable file: "permission denied" (as an ordinary user)', async () => {
    const path = join(dir, 'locked.txt');
    expect(await asyncErrorOf(() => readSeries(path, ALL))).toBe(`${path}: cannot read — permission denied; check the path and its permissions`);
  });

  // Root reads any file, so under root the same read runs in a child process as user nobody (util-linux setpriv).
  it.skipIf(process.getuid?.() !== 0 || !existsSync('/usr/bin/setpriv'))('unreadable file: "permission denied" (root: child process as nobody)', async () => {
    await chmod(dir, 0o755);
    const path = join(dir, 'locked.txt');
    const script = `import('${pathToFileURL(join(import.meta.dirname, '../../src/signals/index.ts')).href}').then((m) => m.readSeries(${JSON.stringify(path)}, { column: 1, start: 0, length: null })).then(() => console.log('read'), (e) => console.log(e.message))`;
    const out = execFileSync('/usr/bin/setpriv', ['--reuid=65534', '--regid=65534', '--clear-groups', process.execPath, '--import', 'tsx', '-e', script], { cwd: join(import.meta.dirname, '../..'), encoding: 'utf8' });
    expect(out.trim()).toBe(`${path}: cannot read — permission denied; check the path and its permissions`);
  });
});

describe('doc-comment example', () => {
  it('parseRecording example', () => {
    const s = parseRecording(utf8('1\n2\n4\n'), ALL, 'x.txt');
    expect(Array.from(s.values)).toEqual([1, 2, 4]);
    expect(s.format).toBe('text');
    expect(dataResolution(s.values)).toBe(1);
  });
});
