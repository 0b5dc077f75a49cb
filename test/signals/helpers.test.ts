import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { detectDelimiter, fieldAt, splitFields, type Delimiter } from '../../src/signals/delimiter.ts';
import { quoteFound } from '../../src/signals/quote-found.ts';
import { readSampleCell } from '../../src/signals/sample-cell.ts';
import { selectSeries } from '../../src/signals/selection.ts';

describe('doc-comment examples of the internal helpers', () => {
  it('quoteFound', () => {
    expect(quoteFound('a\tb"')).toBe('"a\\tb\\""');
    expect(quoteFound('')).toBe('""');
    expect(quoteFound('\u0000\r\n\\')).toBe('"\\x00\\r\\n\\\\"');
    expect(quoteFound('é'.repeat(41))).toBe(`"${'é'.repeat(40)}…"`);
  });

  it('splitFields', () => {
    expect(splitFields('"a,b", 2 ,3', ',')).toEqual(['a,b', '2', '3']);
    expect(splitFields('  1 \t 2  ', 'whitespace')).toEqual(['1', '2']);
    expect(splitFields('   ', 'whitespace')).toEqual(['']);
    expect(splitFields('1,,3,', ',')).toEqual(['1', '', '3', '']);
  });

  it('detectDelimiter', () => {
    expect(detectDelimiter(['t;x', '0;1,5'])).toBe(';');
    expect(detectDelimiter(['a\tb c', '1\t2'])).toBe('\t');
    expect(detectDelimiter(['a, b', '1, 2'])).toBe(',');
    expect(detectDelimiter(['1 2', '3 4'])).toBe('whitespace');
    expect(detectDelimiter(['a,b,c', '1,2'])).toBe(','); // ragged rows
    expect(detectDelimiter(['heart rate', '61'])).toBe('none');
    expect(detectDelimiter([])).toBe('none');
  });

  it('readSampleCell', () => {
    expect(readSampleCell('2,25', true)).toEqual({ kind: 'number', value: 2.25, decimalMark: ',' });
    expect(readSampleCell('2,25', false)).toEqual({ kind: 'text' });
    expect(readSampleCell('-.5e1', false)).toEqual({ kind: 'number', value: -5, decimalMark: '.' });
    expect(readSampleCell('12', false)).toEqual({ kind: 'number', value: 12, decimalMark: null });
    expect(readSampleCell('null', false)).toEqual({ kind: 'missing' });
    expect(readSampleCell('NULL', false)).toEqual({ kind: 'text' });
    expect(readSampleCell('-INF', false)).toEqual({ kind: 'infinite' });
  });

  it('selectSeries', () => {
    const s = selectSeries({ samples: Float64Array.of(1, NaN, 4, 6), format: 'text', channel: 'x', sampleRate: null }, { column: 1, start: 1, length: 2 }, 'a.csv');
    expect(Array.from(s.values)).toEqual([NaN, 4]);
    expect(s).toMatchObject({ missing: 1, totalSamples: 4, channel: 'x' });
  });
});

describe('fieldAt', () => {
  it('doc-comment example', () => {
    expect(fieldAt('0, 1.5 ,9', ',', 1)).toBe('1.5');
    expect(fieldAt('0,1', ',', 2)).toBeUndefined();
  });

  it('equals splitFields(line)[index] for every delimiter (oracle: the array form)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.constantFrom('1', '-2.5', ' ', ',', ';', '\t', '"', 'a', ''), { maxLength: 20 }).map((parts) => parts.join('')),
        fc.constantFrom<Delimiter>(',', ';', '\t', 'whitespace', 'none'),
        fc.integer({ min: 0, max: 6 }),
        (line, delimiter, index) => {
          expect(fieldAt(line, delimiter, index)).toBe(splitFields(line, delimiter)[index]);
        },
      ),
      { numRuns: 2000 },
    );
  });
});
