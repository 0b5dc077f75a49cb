/**
 * CSV text of a list of flat records, through arquero (RFC 4180 quoting). Numbers are written
 * in JavaScript's shortest round-trip form; null becomes an empty cell.
 */
import { from, toArrowIPC, toCSV } from 'arquero';

export function toCsvText(rows: object[], columns?: string[]): string {
  if (rows.length === 0) return (columns ?? []).join(',') + '\n';
  const table = from(rows as Record<string, unknown>[]);
  const csv = toCSV(columns ? table.select(columns) : table);
  return csv.endsWith('\n') ? csv : csv + '\n';
}

/** Arrow IPC file bytes of a list of flat records (for Python's pyarrow and R's arrow). */
export function toArrowBytes(rows: object[]): Uint8Array {
  return toArrowIPC(from(rows as Record<string, unknown>[]), { format: 'file' }) as Uint8Array;
}
