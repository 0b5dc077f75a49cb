import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { formatDuration, formatInterval, formatNumber, formatP, shellQuote } from '../../src/report/format.ts';

describe('shellQuote', () => {
  const args = ['run', 'study.yaml', "it's here", 'a b', '$HOME', '`id`', '"q"', '', 'x;y', 'back\\slash', 'ü'];
  it('round-trips through /bin/sh: the shell splits the quoted line back into the same argv (IEEE Std 1003.1, 2.2.2)', () => {
    const line = args.map(shellQuote).join(' ');
    const out = execFileSync('/bin/sh', ['-c', `printf '%s\\0' ${line}`]).toString('utf8');
    expect(out.split('\0').slice(0, -1)).toEqual(args);
  });
  it('leaves safe words bare', () => {
    expect(shellQuote('--out')).toBe('--out');
    expect(shellQuote('reports/demo')).toBe('reports/demo');
  });
});

describe('number formatting', () => {
  it('prints missing values as a dash, never 0', () => {
    for (const v of [null, undefined, NaN, Infinity]) {
      expect(formatNumber(v)).toBe('—');
      expect(formatP(v)).toBe('—');
    }
    expect(formatInterval({ low: null, high: 0.8, level: 0.95, method: '' })).toBe('—');
  });
  it('uses a true minus sign and no negative zero', () => {
    expect(formatNumber(-0.5, 2)).toBe('−0.50');
    expect(formatNumber(-0.0001, 2)).toBe('0.00');
  });
  it('prints p with two significant digits and a floor', () => {
    expect(formatP(0.0123)).toBe('0.012');
    expect(formatP(0.31)).toBe('0.31');
    expect(formatP(0.00001)).toBe('< 0.0001');
    expect(formatP(0.004)).toBe('0.004');
    expect(formatP(0.001)).toBe('0.001');
  });
  it('prints durations in plain units', () => {
    expect(formatDuration(83_500)).toBe('1 min 23.5 s');
    expect(formatDuration(450)).toBe('450 ms');
  });
});
