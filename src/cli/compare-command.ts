/** `patternfold compare RUN_A RUN_B`: what changed between two runs, as plain text. */
import { compareRuns, readRunRecord, type Movement } from '../run/index.ts';
import type { ParsedCommand } from './parse.ts';
import { formatTable, safeText, type Io } from './terminal.ts';

const number = (v: number | null) => (v === null ? '-' : Number.isInteger(v) ? String(v) : v.toFixed(3));
const signed = (v: number | null) => (v === null ? '-' : v === 0 ? '0' : `${v > 0 ? '+' : ''}${Number.isInteger(v) ? v : v.toFixed(3)}`);
const movementRow = (m: Movement, name = m.name) => [safeText(name), number(m.a), number(m.b), signed(m.change)];

export function runCompareCommand(cmd: ParsedCommand, io: Io): number {
  const [pathA, pathB] = cmd.positionals;
  const a = readRunRecord(pathA);
  const b = readRunRecord(pathB);
  const c = compareRuns(a, b);
  io.out(`A: ${safeText(pathA)} (${safeText(a.run?.started ?? '?')})`);
  io.out(`B: ${safeText(pathB)} (${safeText(b.run?.started ?? '?')})\n`);
  if (c.settings.length === 0) io.out('settings: no change');
  else {
    io.out(`settings: ${c.settings.length} change(s)`);
    io.out(formatTable([['setting', 'A', 'B'], ...c.settings.map((s) => [safeText(s.path), safeText(s.a), safeText(s.b)])]).replace(/^/gm, '  '));
  }
  const { added, removed, changed } = c.recordings;
  const list = (ids: string[]) => ids.slice(0, 10).map(safeText).join(', ') + (ids.length > 10 ? `, … (${ids.length})` : '');
  if (added.length + removed.length + changed.length === 0) io.out('recordings: same files, same content');
  else {
    if (added.length) io.out(`recordings added: ${list(added)}`);
    if (removed.length) io.out(`recordings removed: ${list(removed)}`);
    if (changed.length) io.out(`recordings with other content (SHA-256): ${list(changed)}`);
  }
  if (!a.evaluation && !b.evaluation) {
    io.out('\nno statistics in either run (features only)');
    return 0;
  }
  io.out('\nheadline');
  io.out(formatTable([['', 'A', 'B', 'B - A'], ...c.headline.map((m) => movementRow(m))]).replace(/^/gm, '  '));
  if (c.cells.length > 0) {
    io.out('\ngrid cells (order/delay/scale)');
    const rows = [['cell', 'AUC A', 'AUC B', 'change', 'adj. p A', 'adj. p B']];
    for (const cell of c.cells) {
      rows.push([`${cell.order}/${cell.delay}/${cell.scale}`, number(cell.auc.a), number(cell.auc.b), signed(cell.auc.change), number(cell.pAdjusted.a), number(cell.pAdjusted.b)]);
    }
    io.out(formatTable(rows).replace(/^/gm, '  '));
  }
  const u = c.univariate;
  io.out(`\nunivariate: ${u.significantA} -> ${u.significantB} feature x cell columns with q < 0.05`);
  if (u.largestMoves.length > 0) {
    io.out(formatTable([["largest moves of Hedges' g", 'A', 'B', 'B - A'], ...u.largestMoves.map((m) => movementRow(m, m.column))]).replace(/^/gm, '  '));
  }
  return 0;
}
