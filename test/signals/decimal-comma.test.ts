/**
 * The decimal-comma caution: a one-column table written with decimal commas cannot be told
 * from a two-column table of whole numbers, so patternfold reads it as two columns and says
 * so. The cases are the shapes of our rule (src/signals/decimal-comma.ts) [D].
 */
import { describe, expect, it } from 'vitest';
import { decimalCommaCaution } from '../../src/signals/decimal-comma.ts';
import { parseDelimited } from '../../src/signals/delimited.ts';

const ALL = { column: 1, start: 0, length: null };

describe('decimalCommaCaution', () => {
  it('cautions for one column of decimal-comma numbers, signs, CRLF and comments included', () => {
    expect(decimalCommaCaution('1,5\n2,25\n0,125\n')).toMatch(/decimal commas/);
    expect(decimalCommaCaution('# exported\r\n-1,5\r\n2,0\r\n\r\n+0,75\r\n')).toMatch(/save it with decimal points/);
    expect(decimalCommaCaution('0,3818\n0,9205\n0,2853\n')).not.toBeNull(); // whole parts all 0: no index
  });

  it('stays silent for an index or clock column beside whole-number values, decimal points, headers, more columns or short files', () => {
    expect(decimalCommaCaution('0,512\n1,515\n2,498\n3,501\n')).toBeNull(); // first column steps by 1
    expect(decimalCommaCaution('10,7\n20,9\n30,8\n')).toBeNull(); // steps by 10 (a clock in ms)
    expect(decimalCommaCaution('1.5\n2.25\n0.125\n')).toBeNull();
    expect(decimalCommaCaution('t,v\n1,5\n2,25\n0,125\n')).toBeNull();
    expect(decimalCommaCaution('1,5,3\n2,25,4\n0,125,5\n')).toBeNull();
    expect(decimalCommaCaution('1;5\n2;25\n0;125\n')).toBeNull();
    expect(decimalCommaCaution('1,5\n2,25\n')).toBeNull();
  });

  it('reaches the series read from such a file, which holds the whole parts of the first column', () => {
    const s = parseDelimited('1,5\n2,25\n0,125\n', ALL, 'x.csv');
    expect(Array.from(s.values)).toEqual([1, 2, 0]);
    expect(s.caution).toMatch(/pairs of whole numbers/);
    expect(parseDelimited('1.5\n2.25\n0.125\n', ALL, 'x.csv').caution).toBeNull();
  });
});
