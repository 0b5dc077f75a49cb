import { readFileSync } from 'node:fs';
import { expect } from 'vitest';

/** Asserts |actual − expected| <= rel·|expected| + abs (the tolerance is stated at each call). */
export function expectClose(actual: number, expected: number, rel: number, abs = 0): void {
  const tolerance = rel * Math.abs(expected) + abs;
  if (!(Math.abs(actual - expected) <= tolerance)) {
    expect.fail(`expected ${actual} to be within ${tolerance} of ${expected}`);
  }
}

export interface MannWhitneyCase {
  name: string;
  group0: number[];
  group1: number[];
  exact?: { u: number; p: number };
  asymptotic_cc: { u: number; p: number };
  asymptotic_plain: { u: number; p: number };
}

export interface MatrixExpectation {
  n0: number;
  n1: number;
  missing0: number;
  missing1: number;
  mean0: number;
  mean1: number;
  sd0: number;
  sd1: number;
  u: number;
  p: number;
  q: number;
  method: 'exact' | 'normal';
}

/** test/evaluate/univariate/fixtures/scipy_reference.json, made by scripts/fixtures/univariate/make_fixtures.py. */
export interface ScipyReference {
  scipy: string;
  mann_whitney: MannWhitneyCase[];
  benjamini_hochberg: { p: number[]; q: number[] }[];
  normal: { sf: { z: number; sf: number }[]; ppf: { p: number; z: number }[] };
  matrix: { labels: number[]; n_cols: number; values: (number | null)[]; expected: MatrixExpectation[] };
}

export function loadScipyReference(): ScipyReference {
  const url = new URL('./fixtures/scipy_reference.json', import.meta.url);
  return JSON.parse(readFileSync(url, 'utf8')) as ScipyReference;
}
