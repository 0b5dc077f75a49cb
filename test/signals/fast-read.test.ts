// The fast text-table reader (fast-column.ts, plain-decimal.ts) against two references
// outside it: the general reader (parseDelimitedGeneral: split, trim, a regular expression
// per cell, Number(); the only reader before the fast one) and V8's Number() (ECMA-262
// StringToNumber, which the standard requires to round correctly up to 20 significant
// digits [M]). Values are compared with Object.is, so NaN equals NaN and -0 differs from 0.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/shared/errors.ts';
import { parseDelimited, parseDelimitedGeneral } from '../../src/signals/delimited.ts';
import { readColumnFast } from '../../src/signals/fast-column.ts';
import { lineKind } from '../../src/signals/line-kind.ts';
import { describeDelimiter, tableLayout } from '../../src/signals/table-layout.ts';
import { scanPlainDecimal, type DecimalScan } from '../../src/signals/plain-decimal.ts';
import type { Series, SignalSelection } from '../../src/signals/types.ts';

const slot = (): DecimalScan => ({ value: 0, mark: 0 });

/** The value scanPlainDecimal reads from the whole of `text`, or 'general' when it leaves the text to Number(). */
function scanned(text: string, commaMark = false): number | 'general' {
  const out = slot();
  const end = scanPlainDecimal(text, 0, commaMark, out);
  return end === text.length ? out.value : 'general';
}

const digits = (min: number, max: number): fc.Arbitrary<string> =>
  fc.string({ unit: fc.constantFrom('0', '1', '2', '3', '4', '5', '6', '7', '8', '9'), minLength: min, maxLength: max });

/** Numbers in the grammar of readSampleCell, in many spellings: signs, '.5', '5.', exponents, long significands. */
const spelledNumber = (exponentDigits: number): fc.Arbitrary<string> => fc
  .tuple(fc.constantFrom('', '+', '-'), digits(0, 20), fc.constantFrom('', '.'), digits(0, 20), fc.constantFrom('', 'e', 'E'), fc.constantFrom('', '+', '-'), digits(1, exponentDigits))
  .map(([sign, whole, mark, fraction, e, expSign, exp]) => {
    const body = mark === '' ? whole || '0' : whole === '' && fraction === '' ? '0.' : `${whole}.${fraction}`;
    return `${sign}${body}${e === '' ? '' : `${e}${expSign}${exp}`}`;
  });

/** Numbers as programs write them: Number#toString, toFixed, toExponential, toPrecision of any double. */
const writtenNumber: fc.Arbitrary<string> = fc
  .tuple(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 1, max: 20 }))
  .map(([x, how, k]) => {
    if (how === 0) return String(x);
    if (how === 1) return Math.abs(x) < 1e21 ? x.toFixed(k) : String(x);
    if (how === 2) return x.toExponential(k);
    return x.toPrecision(k);
  });

describe('scanPlainDecimal: Clinger (1990) fast path, checked against Number()', () => {
  it('every number it converts is the double Number() gives, -0 included', () => {
    fc.assert(
      fc.property(fc.oneof(spelledNumber(3), writtenNumber), (text) => {
        const got = scanned(text);
        if (got !== 'general') expect(Object.is(got, Number(text)), `${text}: ${got} vs ${Number(text)}`).toBe(true);
      }),
      { numRuns: 5000 },
    );
  });

  it('converts every significand below 2^53 with a power of ten within 10^±22 itself (the exact case) [D]', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: Number.MAX_SAFE_INTEGER }), fc.integer({ min: -22, max: 22 }), fc.boolean(), (s, k, negative) => {
        // s * 10^k written as digits with a decimal point k places in, or an exponent.
        const text = `${negative ? '-' : ''}${s}e${k}`;
        expect(Object.is(scanned(text), Number(text))).toBe(true);
      }),
    );
  });

  it('leaves longer significands and larger powers to Number()', () => {
    expect(scanned('9007199254740993')).toBe('general'); // 2^53 + 1: not exact as a double
    expect(scanned('9007199254740991')).toBe(9007199254740991); // 2^53 - 1
    expect(scanned('1e23')).toBe('general');
    expect(scanned('1e-23')).toBe('general');
    expect(scanned('1e22')).toBe(1e22);
  });

  it('known values: 0.1, -0, a zero with any exponent, decimal commas', () => {
    // 0.1 is the binary64 double 0x3FB999999999999A: CPython's float.hex(0.1) prints
    // 0x1.999999999999ap-4 and struct.pack('>d', 0.1) 3fb999999999999a [S] (run for this test);
    // checked through its bits rather than through Number().
    const bits = new DataView(new ArrayBuffer(8));
    bits.setFloat64(0, scanned('0.1') as number);
    expect(bits.getBigUint64(0).toString(16)).toBe('3fb999999999999a');
    // '-0.0000' is the double 8000000000000000 (-0): CPython struct.pack('>d', float('-0.0000')) [S];
    // ECMA-262 StringToNumber gives -0 for a '-' literal of value 0 [M].
    expect(Object.is(scanned('-0.0000'), -0)).toBe(true);
    expect(Object.is(scanned('-0e999999'), -0)).toBe(true);
    expect(scanned('0e999999')).toBe(0);
    expect(scanned('1,25', true)).toBe(1.25);
    expect(scanned('1,25', false)).toBe('general');
    const out = slot();
    expect(scanPlainDecimal('-1.25;7', 0, false, out)).toBe(5); // the doc-comment example
    expect(out).toEqual({ value: -1.25, mark: 0x2e });
  });

  it('rejects what is not a plain decimal number', () => {
    for (const text of ['', '+', '-', '.', 'e5', '.e5', '1e', '1e+', 'inf', 'NaN', ',5']) {
      expect(scanPlainDecimal(text, 0, false, slot()), text).toBe(-1);
    }
    expect(scanPlainDecimal('0x10', 0, false, slot())).toBe(1); // stops after '0'; the reader rejects the 'x' that follows
  });
});

/** What a reader did: the series, or the InputError message. */
type Outcome = { series: Series } | { error: string };

function outcomeOf(read: () => Series): Outcome {
  try {
    return { series: read() };
  } catch (error) {
    if (error instanceof InputError) return { error: error.message };
    throw error;
  }
}

/** Same values bit for bit (Object.is), same counts and names, or the same error message. */
function expectSameOutcome(fast: Outcome, general: Outcome): void {
  if ('error' in general) {
    expect(fast).toEqual(general);
    return;
  }
  expect('series' in fast, 'error' in fast ? fast.error : '').toBe(true);
  if (!('series' in fast)) return;
  const a = fast.series;
  const b = general.series;
  expect({ ...a, values: null }).toEqual({ ...b, values: null });
  expect(a.values.length).toBe(b.values.length);
  for (let i = 0; i < a.values.length; i++) {
    if (!Object.is(a.values[i], b.values[i])) expect(`${i}: ${a.values[i]}`).toBe(`${i}: ${b.values[i]}`);
  }
}

type DelimiterChoice = ',' | ';' | '\t' | 'whitespace';

interface TableSpec {
  delimiter: DelimiterChoice;
  decimalComma: boolean;
  width: number;
  header: string[] | null;
  rows: string[][];
  extras: { at: number; line: string }[];
  eols: string[];
  finalEol: boolean;
  bom: boolean;
  selection: SignalSelection;
}

const missingToken = fc.constantFrom('', 'NaN', 'nan', 'NA', 'na', 'null');
/** Cells that make the row or file an error, or that only the general rules read. */
const oddCell = fc.constantFrom('abc', 'inf', '-Infinity', '1e400', '1.2.3', '0x10', '"1.5"', '" 2 "', '"1,5"', '"7;8"', '"9\t1"', '"3"""', '"x', '\u00a0', '\u3000', '\u00a01.5', '1.5\u00a0', '1,5', '1 5', 'NULL', '#3', '\v4');
/** A table cell; `odd` lets in cells that are errors or that only the general rules read. */
const cell = (odd: boolean): fc.Arbitrary<string> =>
  fc.oneof(
    { weight: 30, arbitrary: fc.oneof(spelledNumber(2), writtenNumber) },
    { weight: 10, arbitrary: fc.integer({ min: -99999, max: 99999 }).map((v) => (v / 1e4).toFixed(4)) },
    { weight: 3, arbitrary: missingToken },
    { weight: odd ? 1 : 0, arbitrary: oddCell },
  );
const headerName = fc.constantFrom('time', 'v', 'ECG', 'ecg', 'resp rate', '"a,b"', '', 'x1');
const extraLine = fc.constantFrom('', '  ', '\t', '# note', '  # 1,2,3', '#', '\u00a0');

const tableSpec: fc.Arbitrary<TableSpec> = fc
  .record({
    delimiter: fc.constantFrom<DelimiterChoice>(',', ';', '\t', 'whitespace'),
    decimalComma: fc.boolean(),
    width: fc.integer({ min: 1, max: 4 }),
    withHeader: fc.boolean(),
    rowCount: fc.integer({ min: 0, max: 25 }),
    eol: fc.constantFrom('\n', '\r\n', '\r', 'mixed'),
    finalEol: fc.boolean(),
    bom: fc.boolean(),
    odd: fc.boolean(),
    pick: fc.integer({ min: 0, max: 4 }),
    byName: fc.boolean(),
    start: fc.integer({ min: 0, max: 2 }),
    length: fc.option(fc.integer({ min: 1, max: 6 }), { nil: null, freq: 3 }),
  })
  .chain((r) =>
    fc.record({
      header: r.withHeader ? fc.array(headerName, { minLength: r.width, maxLength: r.width }) : fc.constant(null),
      rows: fc.array(fc.array(cell(r.odd), { minLength: r.width, maxLength: r.width }), { minLength: r.rowCount, maxLength: r.rowCount }),
      shortRow: fc.option(fc.integer({ min: 0, max: 30 }), { nil: null, freq: 8 }),
      extras: fc.array(fc.record({ at: fc.integer({ min: 0, max: 30 }), line: extraLine }), { maxLength: 6 }),
      eols: fc.array(fc.constantFrom('\n', '\r\n', '\r'), { minLength: 70, maxLength: 70 }),
    }).map((g): TableSpec => {
      const rows = g.rows.map((row) => row.map((c) => (r.decimalComma && (r.delimiter === ';' || r.delimiter === '\t') ? c.replace('.', ',') : c)));
      if (g.shortRow !== null && rows.length > 0) rows[g.shortRow % rows.length] = rows[g.shortRow % rows.length].slice(0, -1);
      const eols = r.eol === 'mixed' ? g.eols : g.eols.map(() => r.eol);
      const column = r.byName && g.header ? (r.pick % 2 === 0 ? g.header[r.pick % r.width] : g.header[r.pick % r.width].toUpperCase()) : r.pick + 1;
      return {
        delimiter: r.delimiter,
        decimalComma: r.decimalComma,
        width: r.width,
        header: g.header,
        rows,
        extras: g.extras,
        eols,
        finalEol: r.finalEol,
        bom: r.bom,
        selection: { column, start: r.start, length: r.length },
      };
    }),
  );

/** Writes a table: cells padded with blanks, extra blank and comment lines, the chosen line ends. */
function tableText(spec: TableSpec): string {
  const join = (cells: string[], i: number): string => {
    if (spec.delimiter === 'whitespace') return (i % 3 === 0 ? '  ' : '') + cells.join(i % 2 === 0 ? ' ' : ' \t  ');
    return cells.map((c) => (i % 4 === 1 ? ` ${c} ` : c)).join(spec.delimiter);
  };
  const lines = [...(spec.header ? [join(spec.header, 0)] : []), ...spec.rows.map((row, i) => join(row, i))];
  for (const extra of spec.extras) lines.splice(extra.at % (lines.length + 1), 0, extra.line);
  const body = lines.map((line, i) => line + (i < lines.length - 1 || spec.finalEol ? spec.eols[i % spec.eols.length] : '')).join('');
  return (spec.bom ? '\ufeff' : '') + body;
}

describe('parseDelimited (fast reader) equals parseDelimitedGeneral (general reader)', () => {
  it('random tables: every delimiter, header, missing tokens, comments, blank lines, CR/LF/CRLF, BOM, decimal commas, bad cells', () => {
    let read = 0;
    let runs = 0;
    fc.assert(
      fc.property(tableSpec, (spec) => {
        const text = tableText(spec);
        const general = outcomeOf(() => parseDelimitedGeneral(text, spec.selection, 'f.csv'));
        expectSameOutcome(
          outcomeOf(() => parseDelimited(text, spec.selection, 'f.csv')),
          general,
        );
        runs++;
        if ('series' in general) read++;
      }),
      { numRuns: 3000 },
    );
    // The generator must produce readable tables often, or the comparison says little.
    expect(read / runs).toBeGreaterThan(0.2);
  });

  it('random lines from fragments: quotes, unterminated quotes, Unicode blanks, BOM, comments, delimiters in every place', () => {
    const anyFragment = fc.constantFrom('1', '-0.5', '2e3', '.5', '7.', '-0', '00.10', ',', ';', '\t', ' ', '  ', '"', '""', '\u00a0', '\u3000', '\u2028', '\ufeff', '\v', '\f', '#', 'NA', 'x', '1,5', '\r', '\n', '\r\n');
    // Without tab, semicolon and comma the delimiter is often runs of whitespace.
    const blankFragment = fc.constantFrom('1', '-0.5', '2e3', ' ', ' ', '  ', '1 2', '3 4', '\u00a0', '\u3000', '\ufeff', '\v', '"', '#', 'NA');
    const lines = (fragment: fc.Arbitrary<string>): fc.Arbitrary<string[]> =>
      fc.array(fc.array(fragment, { minLength: 1, maxLength: 8 }).map((parts) => parts.join('')), { minLength: 1, maxLength: 12 });
    fc.assert(
      fc.property(fc.oneof(lines(anyFragment), lines(blankFragment)), fc.integer({ min: 1, max: 4 }), fc.boolean(), (lines, column, bom) => {
        const text = (bom ? '\ufeff' : '') + lines.join('\n');
        const selection = { column, start: 0, length: null };
        expectSameOutcome(outcomeOf(() => parseDelimited(text, selection, 'z.txt')), outcomeOf(() => parseDelimitedGeneral(text, selection, 'z.txt')));
      }),
      { numRuns: 5000 },
    );
  });

  it('the fast reader itself reads plain tables with comments (not leaving them all to the general reader)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.integer({ min: 0, max: 6 })), { minLength: 1, maxLength: 50 }),
        fc.constantFrom(',', ';', '\t', ' '),
        (rows, d) => {
          const row = ([x, k]: [number, number], i: number): string => `${i}${d}${x.toFixed(k)}${d}0${i % 5 === 1 ? '\n# note' : ''}`;
          const text = `# header below\nt${d}v${d}w\n${rows.map(row).join('\n')}\n\n`;
          const fast = readColumnFast(text, 'v', 'p.csv');
          expect(fast).not.toBeNull();
          const expected = rows.map(([x, k]) => Number(x.toFixed(k)));
          expect(Array.from(fast!.samples).every((v, i) => Object.is(v, expected[i]))).toBe(true);
          expect(fast!.samples.length).toBe(rows.length);
        },
      ),
    );
  });

  it('the fast reader leaves rejected files to the general reader, which names line and column', () => {
    expect(readColumnFast('v\n1\nx\n', 1, 'b.txt')).toBeNull();
    expect(readColumnFast('v;w\n1,5;0\n2.5;0\n', 'v', 'mix.csv')).toBeNull();
    expect(readColumnFast('a,b\n1,2\n3\n', 2, 'r.csv')).toBeNull();
    expect(readColumnFast('a,b\n', 2, 'h.csv')).toBeNull();
    expect(readColumnFast('# only\n\n', 1, 'e.csv')).toBeNull();
    expect(() => parseDelimited('v\n1\nx\n', { column: 1, start: 0, length: null }, 'b.txt')).toThrow(
      'b.txt:3: column 1 ("v") holds "x", which is not a number',
    );
  });

  it('a double quote before the chosen field sends the line to the general rules (RFC 4180 quoting hides delimiters)', () => {
    // Past the first 100 lines, which choose the delimiter, so these lines reach the row reader.
    const lead = (d: string): string => `a${d}b${d}c\n${`1${d}2${d}3\n`.repeat(100)}`;
    const cases = [`${lead(',')}"x,1.5\n`, `${lead(';')}"x;y";3;4\n`, `${lead('\t')}"p\tq\t"\t5\t6\n`, `${lead(',')}"1,2",3,4\n`, `${lead(',')}7,"8,9\n`];
    for (const text of cases) {
      for (const column of [2, 3]) {
        const selection = { column, start: 0, length: null };
        expectSameOutcome(outcomeOf(() => parseDelimited(text, selection, 'q.csv')), outcomeOf(() => parseDelimitedGeneral(text, selection, 'q.csv')));
      }
    }
    expect(() => parseDelimited(cases[0], { column: 2, start: 0, length: null }, 'q.csv')).toThrow(
      'q.csv:102: the row has 1 field, so column 2 ("b") is missing',
    );
  });

  it('cells only the general rules read (quotes, other blanks, long significands) keep their general values', () => {
    const text = 'a,b\n0,"1.5"\n1,\u00a02\u00a0\n2,0.1000000000000000055511151231257827\n3,NA\n4, -0.0000 \n';
    const fast = readColumnFast(text, 'b', 'q.csv');
    expect(fast).not.toBeNull();
    expect(Array.from(fast!.samples)).toEqual([1.5, 2, 0.1, NaN, -0]);
    expect(Object.is(fast!.samples[4], -0)).toBe(true);
  });

  it('doc-comment example of readColumnFast', () => {
    const got = readColumnFast('t,v\n0,1.5\n1,\n', 'v', 'a.csv');
    expect(got && Array.from(got.samples)).toEqual([1.5, NaN]);
    expect(got).toMatchObject({ format: 'text', channel: 'v', sampleRate: null });
  });

  it('doc-comment example of parseDelimitedGeneral', () => {
    const s = parseDelimitedGeneral('v\n1\n\n3\n', { column: 1, start: 0, length: null }, 'a.txt');
    expect(Array.from(s.values)).toEqual([1, NaN, 3]);
    expect(s).toMatchObject({ missing: 1, channel: 'v' });
  });

  it('doc-comment examples of tableLayout, describeDelimiter and lineKind', () => {
    expect(tableLayout(['t;x', '0;1,5'], 'x', 'a.csv')).toEqual({ delimiter: ';', allowDecimalComma: true, header: ['t', 'x'], column: { index: 1, name: 'x' } });
    expect(describeDelimiter(';')).toBe('fields split on semicolon');
    expect(lineKind('  # note', 0, 8)).toBe('comment');
    expect(lineKind('\u00a0\t', 0, 2)).toBe('blank');
    expect(lineKind('x # note', 0, 8)).toBe('content');
  });
});
