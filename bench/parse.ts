/**
 * Benchmark of the text-table reader: parseDelimited (the fast reader, falling back to the
 * general one) against parseDelimitedGeneral (the general reader: line strings, cell strings,
 * a regular expression and Number() per cell, the only reader before the fast one). Tables
 * from a seeded stream, decoded from UTF-8 bytes as readSeries does:
 *   - 10^6 lines of one column, `x.toFixed(4)`;
 *   - a 3-column comma CSV with a header (`time,value,flag`), column 2 chosen by name;
 *   - a semicolon table with decimal commas (`t;v`, `-0,1234`), column 2;
 *   - the rerun benchmark's shape: 200 tables of 20,000 lines.
 * For each it prints samples per second of both readers as the best of several runs, the
 * ratio, the fast reader's time over a loop that only reads every char code of the same
 * text (the floor of any reader working on the string), and whether the two series are
 * identical bit for bit (Object.is per value).
 *
 * Target: >= 10 x the general reader on these shapes (aim 15-30 M samples/s). Figures vary
 * with the machine's load, printed first.
 *
 * Run: node --import tsx bench/parse.ts [--lines 1000000] [--runs 5]
 */
import { loadavg } from 'node:os';
import { parseDelimited, parseDelimitedGeneral } from '../src/signals/delimited.ts';
import { createRng } from '../src/shared/random.ts';
import type { Series, SignalSelection } from '../src/signals/types.ts';
import { argument } from './arguments.ts';
import { bestSeconds } from './best-seconds.ts';

export interface ParseBenchRow {
  table: string;
  samples: number;
  generalPerSecond: number;
  fastPerSecond: number;
  /** General reader's time / fast reader's time. */
  ratio: number;
  /** Fast reader's time / time of a loop reading every char code of the text. */
  ratioToCharLoop: number;
  identical: boolean;
}

interface Shape {
  table: string;
  texts: string[];
  selection: SignalSelection;
}


/** Reads every char code of the texts: the floor of any reader that works on the string. */
function charCodeLoop(texts: readonly string[]): number {
  let sum = 0;
  for (const text of texts) for (let i = 0; i < text.length; i++) sum = (sum + text.charCodeAt(i)) | 0;
  return sum;
}

/** The text as readSeries sees it: encoded to UTF-8 and decoded again (a flat string). */
function asDecoded(text: string): string {
  return new TextDecoder().decode(new TextEncoder().encode(text));
}

function tableText(lines: number, seed: number, row: (x: number, i: number) => string, header = ''): string {
  const rng = createRng(seed);
  const out = new Array<string>(lines);
  for (let i = 0; i < lines; i++) out[i] = row(rng.normal(), i);
  return asDecoded(header + out.join('\n') + '\n');
}

function shapes(lines: number): Shape[] {
  const all = { start: 0, length: null };
  return [
    { table: `one column, toFixed(4), ${lines} lines`, texts: [tableText(lines, 1, (x) => x.toFixed(4))], selection: { column: 1, ...all } },
    {
      table: `comma CSV, 3 columns + header, column 2`,
      texts: [tableText(lines, 2, (x, i) => `${(i / 256).toFixed(6)},${x.toFixed(4)},${i % 2}`, 'time,value,flag\n')],
      selection: { column: 'value', ...all },
    },
    {
      table: `semicolon, decimal commas, column 2`,
      texts: [tableText(lines, 3, (x, i) => `${i};${x.toFixed(4).replace('.', ',')}`, 't;v\n')],
      selection: { column: 2, ...all },
    },
    {
      table: `rerun shape: 200 tables x 20,000 lines`,
      texts: Array.from({ length: 200 }, (_, k) => tableText(20000, 100 + k, (x) => x.toFixed(4))),
      selection: { column: 1, ...all },
    },
  ];
}

function readAll(read: typeof parseDelimited, shape: Shape): Series[] {
  return shape.texts.map((text, k) => read(text, shape.selection, `t${k}.csv`));
}

function sameSeries(a: readonly Series[], b: readonly Series[]): boolean {
  return a.every((s, k) => s.values.length === b[k].values.length && s.values.every((v, i) => Object.is(v, b[k].values[i])) && s.missing === b[k].missing && s.channel === b[k].channel);
}

export async function benchParse(options: { lines?: number; runs?: number } = {}): Promise<ParseBenchRow[]> {
  const lines = options.lines ?? argument('--lines', 1e6);
  const runs = options.runs ?? argument('--runs', 5);
  console.log(`text-table reader benchmark: best of ${runs} runs (general reader: best of ${Math.min(runs, 3)}), Node ${process.version}, load average ${loadavg()[0].toFixed(2)}`);
  const rows: ParseBenchRow[] = [];
  for (const shape of shapes(lines)) {
    const fastOut = readAll(parseDelimited, shape);
    const generalOut = readAll(parseDelimitedGeneral, shape);
    const samples = fastOut.reduce((n, s) => n + s.values.length, 0);
    const fast = bestSeconds(runs, () => readAll(parseDelimited, shape));
    const general = bestSeconds(Math.min(runs, 3), () => readAll(parseDelimitedGeneral, shape));
    const floor = bestSeconds(runs, () => charCodeLoop(shape.texts));
    const row = {
      table: shape.table,
      samples,
      generalPerSecond: samples / general,
      fastPerSecond: samples / fast,
      ratio: general / fast,
      ratioToCharLoop: fast / floor,
      identical: sameSeries(fastOut, generalOut),
    };
    rows.push(row);
    console.log(
      `  ${row.table.padEnd(40)} general ${(row.generalPerSecond / 1e6).toFixed(2).padStart(5)} M/s   fast ${(row.fastPerSecond / 1e6).toFixed(1).padStart(5)} M/s   ${row.ratio.toFixed(1).padStart(5)} x faster   ${row.ratioToCharLoop.toFixed(1)} x the char-code loop   identical: ${row.identical ? 'yes' : 'NO'}`,
    );
  }
  return rows;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await benchParse();
}
