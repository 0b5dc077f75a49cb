/**
 * Number and label formatting for the page. Missing values (null, NaN, ±Infinity) print as "—".
 */
import type { Interval, ReportCell } from './types.ts';

/** The mark shown for a value that could not be computed. */
export const MISSING = '—';

/** True for a finite number; null, NaN and infinities are missing. */
export function isPresent(v: number | null | undefined): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

/**
 * Fixed-point text with `digits` decimals and a true minus sign; "—" when missing.
 * @example formatNumber(-0.5, 2) // '−0.50'
 */
export function formatNumber(v: number | null | undefined, digits = 3): string {
  if (!isPresent(v)) return MISSING;
  const s = v.toFixed(digits);
  return s.startsWith('-') ? (Number(s) === 0 ? s.slice(1) : `−${s.slice(1)}`) : s;
}

/**
 * A p- or q-value: two decimals from 0.1 up, two significant digits below (trailing zeros
 * dropped), "< 0.0001" below 1e-4; "—" when missing.
 * @example formatP(0.0123) // '0.012' ; formatP(0.004) // '0.004' ; formatP(0.31) // '0.31'
 */
export function formatP(p: number | null | undefined): string {
  if (!isPresent(p)) return MISSING;
  if (p < 1e-4) return '< 0.0001';
  if (p >= 0.1) return p.toFixed(2);
  return String(Number(p.toPrecision(2)));
}

/**
 * "low to high" with the level, e.g. "95% interval 0.61 to 0.80"; "—" when an end is missing.
 * @example formatInterval({ low: 0.61, high: 0.8, level: 0.95, method: '' }, 2) // '95% interval 0.61 to 0.80'
 */
export function formatInterval(iv: Interval | undefined, digits = 2): string {
  if (!iv || !isPresent(iv.low) || !isPresent(iv.high)) return MISSING;
  return `${formatPercent(iv.level)} interval ${formatNumber(iv.low, digits)} to ${formatNumber(iv.high, digits)}`;
}

/** @example formatPercent(0.953) // '95%' ; formatPercent(0.0123, 1) // '1.2%' */
export function formatPercent(v: number | null | undefined, digits = 0): string {
  if (!isPresent(v)) return MISSING;
  return `${(v * 100).toFixed(digits)}%`;
}

/** @example formatCell({ order: 4, delay: 2, scale: 1 }) // 'm4 τ2 s1' */
export function formatCell(c: ReportCell): string {
  return `m${c.order} τ${c.delay} s${c.scale}`;
}

/**
 * Duration in plain units.
 * @example formatDuration(83_500) // '1 min 23.5 s'
 */
export function formatDuration(ms: number): string {
  if (!isPresent(ms) || ms < 0) return MISSING;
  if (ms < 1000) return `${Math.round(ms)} ms`;
  const s = ms / 1000;
  if (s < 60) return `${s.toFixed(1)} s`;
  const min = Math.floor(s / 60);
  const rest = s - 60 * min;
  if (min < 60) return `${min} min ${rest.toFixed(1)} s`;
  return `${Math.floor(min / 60)} h ${min % 60} min`;
}

/**
 * One argv entry quoted for a POSIX shell (IEEE Std 1003.1, Shell Command Language 2.2.2):
 * left bare when it holds only safe characters, single-quoted otherwise.
 * @example shellQuote("it's") // `'it'\\''s'`
 */
export function shellQuote(arg: string): string {
  if (arg !== '' && /^[A-Za-z0-9_@%+=:,./-]+$/.test(arg)) return arg;
  return `'${arg.replace(/'/g, `'\\''`)}'`;
}
