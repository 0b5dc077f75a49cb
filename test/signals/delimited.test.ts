import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { inputErrorMessage } from '../helpers/errors.ts';
import { parseDelimited } from '../../src/signals/index.ts';

const col = (column: number | string, start = 0, length: number | null = null) => ({ column, start, length });

const errorOf = inputErrorMessage;

/** NaN-aware array view for toEqual. */
const arr = (v: Float64Array): number[] => Array.from(v);

describe('parseDelimited: delimiters', () => {
  it('comma with header, by name and by number', () => {
    const text = 'time,ecg,resp\n0,1.5,9\n1,-2.25,8\n2,3e-2,7\n';
    const s = parseDelimited(text, col('ecg'), 'a.csv');
    expect(arr(s.values)).toEqual([1.5, -2.25, 0.03]);
    expect(s).toMatchObject({ format: 'text', channel: 'ecg', sampleRate: null, totalSamples: 3, missing: 0 });
    expect(arr(parseDelimited(text, col(3), 'a.csv').values)).toEqual([9, 8, 7]);
  });

  it('tab', () => {
    expect(arr(parseDelimited('a\tb\n1\t2\n3\t4\n', col('b'), 't.tsv').values)).toEqual([2, 4]);
  });

  it('semicolon', () => {
    expect(arr(parseDelimited('a;b\n1.5;2\n3;4.5\n', col(1), 's.csv').values)).toEqual([1.5, 3]);
  });

  it('runs of whitespace, leading blanks ignored', () => {
    const s = parseDelimited('   1.0    2.0\t 3.0\n  4.0 5.0   6.0  \n', col(3), 'w.txt');
    expect(arr(s.values)).toEqual([3, 6]);
    expect(s.channel).toBe('column 3');
  });

  it('one value per line', () => {
    expect(arr(parseDelimited('1\n2\n3.5\n', col(1), 'v.txt').values)).toEqual([1, 2, 3.5]);
  });

  it('a header name with spaces in a one-column file', () => {
    const s = parseDelimited('heart rate\n61\n62\n', col('heart rate'), 'hr.txt');
    expect(arr(s.values)).toEqual([61, 62]);
    expect(s.channel).toBe('heart rate');
  });

  it('quoted fields (RFC 4180): a delimiter and a doubled quote inside a header name', () => {
    const s = parseDelimited('"t","ecg, lead ""II"""\n"0","1.25"\n1,2\n', col('ecg, lead "II"'), 'q.csv');
    expect(arr(s.values)).toEqual([1.25, 2]);
  });
});

describe('parseDelimited: header detection', () => {
  it('a first row of numbers is data, columns are named by number', () => {
    const s = parseDelimited('1,2\n3,4\n', col(2), 'n.csv');
    expect(arr(s.values)).toEqual([2, 4]);
    expect(s.channel).toBe('column 2');
  });

  it('a header row is found by any non-numeric cell, even when the chosen column is numeric-looking', () => {
    const s = parseDelimited('x,2021\n1,2\n3,4\n', col(2), 'h.csv');
    expect(arr(s.values)).toEqual([2, 4]);
    expect(s.channel).toBe('2021');
  });

  it('header names match exactly first, then case-insensitively when unique', () => {
    expect(arr(parseDelimited('ECG,ecg\n1,2\n', col('ecg'), 'c.csv').values)).toEqual([2]);
    expect(arr(parseDelimited('Time,ECG\n1,2\n', col('ecg'), 'c.csv').values)).toEqual([2]);
  });
});

describe('parseDelimited: comments, line ends, byte-order mark', () => {
  it('# comments are skipped anywhere and still count for line numbers', () => {
    const text = '# exported 2024-01-01\n# units: mV\nv\n1\n# pause\n2\nx\n';
    expect(arr(parseDelimited(text.replace('x\n', '3\n'), col(1), 'c.txt').values)).toEqual([1, 2, 3]);
    expect(errorOf(() => parseDelimited(text, col(1), 'c.txt'))).toBe(
      'c.txt:7: column 1 ("v") holds "x", which is not a number — correct it, or write an empty cell, NaN, NA or null to mark a missing sample',
    );
  });

  it('CRLF and lone CR line ends', () => {
    expect(arr(parseDelimited('a,b\r\n1,2\r\n3,4\r\n', col('b'), 'crlf.csv').values)).toEqual([2, 4]);
    expect(arr(parseDelimited('a,b\r1,2\r3,4\r', col('b'), 'cr.csv').values)).toEqual([2, 4]);
  });

  it('a UTF-8 byte-order mark does not become part of the first header name', () => {
    const s = parseDelimited('\ufefftime,ecg\n0,1\n', col('time'), 'bom.csv');
    expect(s.channel).toBe('time');
    expect(arr(s.values)).toEqual([0]);
  });
});

describe('parseDelimited: missing values', () => {
  it('empty, NaN, nan, NA, na, null are NaN and counted, never dropped', () => {
    const s = parseDelimited('a,b\n1,\n2,NaN\n3,nan\n4,NA\n5,na\n6,null\n7,8\n', col('b'), 'm.csv');
    expect(arr(s.values)).toEqual([NaN, NaN, NaN, NaN, NaN, NaN, 8]);
    expect(s.missing).toBe(6);
    expect(s.totalSamples).toBe(7);
  });

  it('a blank line inside the data is a missing row; blank lines before and after the data are ignored', () => {
    const s = parseDelimited('\n\nv\n1\n\n3\n\n\n', col(1), 'b.txt');
    expect(arr(s.values)).toEqual([1, NaN, 3]);
    expect(s.missing).toBe(1);
  });

  it('Infinity, -Infinity, inf and overflowing numbers are errors naming file and line', () => {
    expect(errorOf(() => parseDelimited('v\n1\nInfinity\n', col(1), 'i.txt'))).toBe(
      'i.txt:3: column 1 ("v") holds "Infinity", an infinite value, which is not a valid sample — replace it with the measured value or mark it missing (empty, NaN, NA or null)',
    );
    expect(errorOf(() => parseDelimited('1\n-Infinity\n', col(1), 'i.txt'))).toMatch(/^i\.txt:2: column 1 holds "-Infinity", an infinite value/);
    expect(errorOf(() => parseDelimited('1;inf\n', col(2), 'i.txt'))).toMatch(/^i\.txt:1: column 2 holds "inf", an infinite value/);
    expect(errorOf(() => parseDelimited('1\n1e400\n', col(1), 'i.txt'))).toMatch(/^i\.txt:2: column 1 holds "1e400", an infinite value/);
  });
});

describe('parseDelimited: non-numeric cells', () => {
  it('names file, line, column and the text found', () => {
    expect(errorOf(() => parseDelimited('t,ecg\n0,1\n1,1.2.3\n', col('ecg'), 'data/s1.csv'))).toBe(
      'data/s1.csv:3: column 2 ("ecg") holds "1.2.3", which is not a number — correct it, or write an empty cell, NaN, NA or null to mark a missing sample',
    );
  });

  it('long text is cut to 40 characters and control characters are escaped', () => {
    const long = 'abcdefghij'.repeat(5);
    expect(errorOf(() => parseDelimited(`1\n${long}\n`, col(1), 'l.txt'))).toContain(`holds "${long.slice(0, 40)}…",`);
    expect(errorOf(() => parseDelimited('1,2\n3,a\x01b\x7f\n', col(2), 'x.csv'))).toContain('holds "a\\x01b\\x7f",');
  });

  it('hexadecimal and thousands separators are not numbers', () => {
    expect(errorOf(() => parseDelimited('1\n0x10\n', col(1), 'h.txt'))).toContain('holds "0x10"');
    expect(errorOf(() => parseDelimited('1\n1 000\n', col(1), 'h.txt'))).toContain('holds "1 000"');
  });

  it('a row too short for the chosen column', () => {
    expect(errorOf(() => parseDelimited('a,b,c\n1,2,3\n4,5\n', col('c'), 'r.csv'))).toBe(
      'r.csv:3: the row has 2 fields, so column 3 ("c") is missing — complete the row (an empty field marks a missing sample)',
    );
  });
});

describe('parseDelimited: decimal commas (our rule: accepted with semicolon or tab delimiters)', () => {
  it('1,5;2,25 reads as two columns with decimal commas', () => {
    const text = '1,5;2,25\n3;-0,5\n';
    expect(arr(parseDelimited(text, col(1), 'dc.csv').values)).toEqual([1.5, 3]);
    expect(arr(parseDelimited(text, col(2), 'dc.csv').values)).toEqual([2.25, -0.5]);
    expect(arr(parseDelimited('a\tb\n1,5\t2\n', col('a'), 'dc.tsv').values)).toEqual([1.5]);
  });

  it('mixing decimal point and decimal comma in one column is an error', () => {
    expect(errorOf(() => parseDelimited('v;w\n1,5;0\n2;0\n2.5;0\n', col('v'), 'mix.csv'))).toBe(
      'mix.csv:4: column 1 ("v") mixes decimal marks (a decimal point on line 4, a decimal comma on line 2) — use one decimal mark throughout the file',
    );
  });

  it('with a comma delimiter a comma is never a decimal mark', () => {
    expect(arr(parseDelimited('1,5\n2,25\n', col(2), 'c.csv').values)).toEqual([5, 25]);
  });
});

describe('parseDelimited: columns and selection', () => {
  it('a column past the row width lists the columns', () => {
    expect(errorOf(() => parseDelimited('time,ecg\n0,1\n', col(3), 'w.csv'))).toBe(
      'w.csv: column 3 is past the end of the rows, which have 2 fields — available columns: 1 "time", 2 "ecg" (fields split on comma)',
    );
    expect(errorOf(() => parseDelimited('0 1\n', col(4), 'w.txt'))).toBe(
      'w.txt: column 4 is past the end of the rows, which have 2 fields — available columns: 1 to 2 (no header row; fields split on whitespace)',
    );
  });

  it('an unknown header name lists the columns', () => {
    expect(errorOf(() => parseDelimited('time;ecg\n0;1\n', col('resp'), 'u.csv'))).toBe(
      'u.csv: no column named "resp" in the header row — available columns: 1 "time", 2 "ecg" (fields split on semicolon)',
    );
  });

  it('a name for a file without header', () => {
    expect(errorOf(() => parseDelimited('1\n2\n', col('ecg'), 'n.txt'))).toBe(
      'n.txt: column "ecg" is a name, but the file has no header row — give a column number; available columns: 1 to 1 (no header row; read as one value per line)',
    );
  });

  it('start and length select a run; NaN inside the run is kept', () => {
    const s = parseDelimited('v\n0\n1\n\n3\n4\n5\n', col(1, 1, 3), 's.txt');
    expect(arr(s.values)).toEqual([1, NaN, 3]);
    expect(s.missing).toBe(1);
    expect(s.totalSamples).toBe(6);
    expect(arr(parseDelimited('0\n1\n2\n', col(1, 2, null), 's.txt').values)).toEqual([2]);
  });

  it('selection out of range', () => {
    expect(errorOf(() => parseDelimited('0\n1\n2\n', col(1, 3), 's.txt'))).toBe(
      's.txt (column 1): start 3 skips past the end — the channel holds 3 samples; use a start below 3',
    );
    expect(errorOf(() => parseDelimited('0\n1\n2\n', col(1, 1, 5), 's.txt'))).toBe(
      's.txt (column 1): start 1 + length 5 asks for samples up to 6, but the channel holds 3 — lower start or length (at most 2 after this start), or leave length out to keep all',
    );
    expect(errorOf(() => parseDelimited('0\n', col(1, -1), 's.txt'))).toBe(
      's.txt (column 1): start must be a whole number >= 0, got -1 — give the samples to skip',
    );
    expect(errorOf(() => parseDelimited('0\n', col(1, 0, 0), 's.txt'))).toBe(
      's.txt (column 1): length must be a whole number >= 1 or null (all), got 0 — give the samples to keep',
    );
    expect(errorOf(() => parseDelimited('0\n', col(0), 's.txt'))).toMatch(/^s\.txt: column must be a whole number >= 1 or a header name, got 0/);
  });
});

describe('parseDelimited: empty input', () => {
  it('an empty file, comments only, or a header without data are errors', () => {
    const empty = 'e.csv: no samples — the file is empty or holds only comments and blank lines; give a table of numbers';
    expect(errorOf(() => parseDelimited('', col(1), 'e.csv'))).toBe(empty);
    expect(errorOf(() => parseDelimited('# nothing\n\n  \n', col(1), 'e.csv'))).toBe(empty);
    expect(errorOf(() => parseDelimited('\ufeff', col(1), 'e.csv'))).toBe(empty);
    expect(errorOf(() => parseDelimited('# x\ntime,ecg\n', col(1), 'e.csv'))).toBe(
      'e.csv: no samples — the file has a header row (line 2) but no data rows; add the data below it',
    );
  });
});

describe('parseDelimited: properties', () => {
  it('any finite double written by Number#toString reads back exactly (ECMA-262 round-trip of the shortest form)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { minLength: 1, maxLength: 50 }), (xs) => {
        const text = `v\n${xs.map((x) => String(x)).join('\n')}\n`;
        const got = parseDelimited(text, col('v'), 'p.txt').values;
        // String(-0) is "0" (ECMA-262 Number::toString), so -0 comes back as 0 [S].
        expect(Array.from(got)).toEqual(xs.map((x) => (Object.is(x, -0) ? 0 : x)));
      }),
    );
  });

  it('the same numbers give the same series with any delimiter, line end and comment lines', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: -1e6, max: 1e6 }), fc.option(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { nil: null })), { minLength: 1, maxLength: 30 }),
        fc.constantFrom(',', ';', '\t', '   '),
        fc.constantFrom('\n', '\r\n'),
        fc.boolean(),
        (rows, d, eol, comments) => {
          const lines = rows.map(([a, b]) => `${a}${d}${b === null ? 'NA' : String(b)}`);
          const text = ['a' + d + 'b', ...lines.flatMap((l) => (comments ? ['# note', l] : [l]))].join(eol) + eol;
          const got = parseDelimited(text, col('b'), 'p.txt');
          expect(Array.from(got.values)).toEqual(rows.map(([, b]) => (b === null ? NaN : Object.is(b, -0) ? 0 : b)));
          expect(got.missing).toBe(rows.filter(([, b]) => b === null).length);
        },
      ),
    );
  });
});

describe('doc-comment example', () => {
  it('parseDelimited example', () => {
    const s = parseDelimited('# run 1\ntime,value\n0,1.5\n1,\n2,2.5\n', { column: 'value', start: 0, length: null }, 'a.csv');
    expect(arr(s.values)).toEqual([1.5, NaN, 2.5]);
    expect(s.missing).toBe(1);
    expect(s.channel).toBe('value');
  });
});
