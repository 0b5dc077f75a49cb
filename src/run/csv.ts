/**
 * CSV text of a list of flat records, through arquero (RFC 4180 quoting). Numbers are written
 * in JavaScript's shortest round-trip form; null becomes an empty cell.
 */
import { from, toCSV } from 'arquero';

export function toCsvText(rows: object[], columns?: string[]): string {
  if (rows.length === 0) return (columns ?? []).join(',') + '\n';
  const table = from(rows as Record<string, unknown>[]);
  const csv = toCSV(columns ? table.select(columns) : table);
  return csv.endsWith('\n') ? csv : csv + '\n';
}
