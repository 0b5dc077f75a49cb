/**
 * Files of the corpus that cannot (or should not) be committed: binary bytes, EDF files built
 * from the published layout, symbolic links, permissions, hostile file names, very long lines.
 * Each function receives the temporary copy of a case folder and changes it in place.
 */
import { chmodSync, copyFileSync, mkdirSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { dirname, join } from 'node:path';
import { buildEdf, type SignalSpec } from '../signals/edf-builder.ts';

function put(dir: string, name: string, content: string | Uint8Array): void {
  const path = join(dir, name);
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, content);
}

/** One EEG-like signal (Kemp et al. 1992 layout): 100 samples per 1 s record, a slow ramp with a wobble. */
const eeg: SignalSpec = {
  label: 'EEG Fpz-Cz',
  physicalMin: -500,
  physicalMax: 500,
  digitalMin: -32768,
  digitalMax: 32767,
  samplesPerRecord: 100,
  digital: (r, j) => Math.round(1000 * Math.sin(0.37 * (100 * r + j)) + 30 * j),
};

/** A valid two-record EDF file. */
const goodEdf = (): Uint8Array => buildEdf({ records: 2, recordDuration: 1, signals: [eeg] });

export const setups = {
  /** PNG signature and a few NUL bytes, saved under a .csv name. */
  binary(dir: string): void {
    put(dir, 'a/a2.csv', Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]));
  },
  /** The good recording saved as UTF-16 little-endian with its byte-order mark (ff fe). */
  utf16(dir: string): void {
    const text = readFileSync(join(dir, 'a/a2.csv'), 'utf8');
    put(dir, 'a/a2.csv', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]));
  },
  /** gzip magic bytes (RFC 1952) followed by the first half of a real gzip stream: cut short. */
  damagedGzip(dir: string): void {
    const whole = gzipSync(readFileSync(join(dir, 'b/b1.csv')));
    put(dir, 'b/b1.csv', whole.subarray(0, Math.floor(whole.length / 2)));
  },
  /** No read permission for anyone but root (the test then reads as user nobody). */
  unreadable(dir: string): void {
    chmodSync(join(dir, 'b/b2.csv'), 0o000);
  },
  /** a/a3.csv -> a file that does not exist. */
  brokenSymlink(dir: string): void {
    symlinkSync('../elsewhere/a3.csv', join(dir, 'a/a3.csv'));
  },
  /** b/b3.csv -> ../shared/b3.csv, a real recording outside the glob's folder. */
  symlinkToFile(dir: string): void {
    put(dir, 'shared/b3.csv', readFileSync(join(dir, 'b/b1.csv')));
    symlinkSync('../shared/b3.csv', join(dir, 'b/b3.csv'));
  },
  /** a/a3.csv -> a/a4.csv -> a/a3.csv. */
  symlinkLoop(dir: string): void {
    symlinkSync('a4.csv', join(dir, 'a/a3.csv'));
    symlinkSync('a3.csv', join(dir, 'a/a4.csv'));
  },
  /** An EDF file cut inside its signal header: 256 + 100 bytes of the 512 its one signal needs. */
  edfTruncatedHeader(dir: string): void {
    put(dir, 'a/a1.edf', goodEdf().subarray(0, 356));
    put(dir, 'a/a2.edf', goodEdf());
  },
  /** The header says 3 data records, the file holds 2 (Kemp et al. 1992: "number of data records"). */
  edfWrongRecordCount(dir: string): void {
    put(dir, 'a/a1.edf', goodEdf());
    put(dir, 'a/a2.edf', buildEdf({ records: 2, recordDuration: 1, signals: [eeg], override: { records: '3' } }));
  },
  /** Two valid EDF files whose only signal is 'EEG Fpz-Cz' (the study asks for 'EEG Cz'). */
  edfTwoFiles(dir: string): void {
    put(dir, 'a/a1.edf', goodEdf());
    put(dir, 'a/a2.edf', goodEdf());
  },
  /** a/a1.csv rewritten as one column with decimal commas (`0,3818` per line), as a spreadsheet set to a comma-decimal locale may save it. */
  decimalCommas(dir: string): void {
    const values = readFileSync(join(dir, 'a/a1.csv'), 'utf8').split('\n').filter((l) => l.trim() !== '');
    put(dir, 'a/a1.csv', values.map((v) => Number(v).toFixed(4).replace('.', ',')).join('\n') + '\n');
  },
  /** One cell of a million characters on line 5. */
  veryLongCell(dir: string): void {
    const lines = readFileSync(join(dir, 'a/a1.csv'), 'utf8').split('\n');
    lines[4] = 'x'.repeat(1_000_000);
    put(dir, 'a/a1.csv', lines.join('\n'));
  },
  /** A header row of 50 000 column names (no 'heart_rate' among them), then one data row. */
  veryLongHeader(dir: string): void {
    const names = Array.from({ length: 50_000 }, (_, i) => `channel_${i + 1}`);
    const row = Array.from({ length: 50_000 }, (_, i) => String(i % 7));
    put(dir, 'a/a1.csv', `${names.join(',')}\n${row.join(',')}\n`);
  },
  /** A recording whose name starts with 'grows-while-read' (the corpus test appends to it mid-read). */
  growsWhileRead(dir: string): void {
    copyFileSync(join(dir, 'b/b2.csv'), join(dir, 'b/grows-while-read.csv'));
  },
  /** 240 good lines (over 2 kB, past the 1024 bytes sniffed), then a Latin-1 byte (0xb5, "µ" in Latin-1) on line 200. */
  invalidUtf8Late(dir: string): void {
    const lines = readFileSync(join(dir, 'b/b2.csv'), 'utf8').trimEnd().split('\n');
    const long = [...lines, ...lines, ...lines, ...lines];
    const before = Buffer.from(long.slice(0, 199).join('\n') + '\n12.5 ', 'utf8');
    const after = Buffer.from('V\n' + long.slice(200).join('\n') + '\n', 'utf8');
    put(dir, 'b/b2.csv', Buffer.concat([before, Buffer.from([0xb5]), after]));
  },
  /** A file name with a screen-clearing escape sequence and a right-to-left override. */
  hostileFileName(dir: string): void {
    copyFileSync(join(dir, 'a/a2.csv'), join(dir, 'a/\u001b[2J\u202egpj.csv'));
  },
  /** A cell holding a colour escape sequence, a bell and a right-to-left override on line 3. */
  hostileCell(dir: string): void {
    const lines = readFileSync(join(dir, 'a/a1.csv'), 'utf8').split('\n');
    lines[2] = '\u001b[31m0.5\u0007\u202e';
    put(dir, 'a/a1.csv', lines.join('\n'));
  },
  /** A manifest whose subject ids and covariate hold escape sequences and bidirectional overrides. */
  hostileManifest(dir: string): void {
    put(
      dir,
      'subjects.csv',
      'subject,group,file,site\n' +
        'a1\u001b[31m,a,a/a1.csv,\u001b]0;pwned\u0007\n' +
        'a2,a,a/a2.csv,x\n' +
        '\u202eb1,b,b/b1.csv,y\n' +
        'b2\u0008\u0008,b,b/b2.csv,z\n',
    );
  },
};
