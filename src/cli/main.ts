/**
 * The command line: a thin shell over the library. Parses, calls run/, prints, and maps
 * errors to exit codes in one place: 0 success, 2 bad input or usage, 1 internal error.
 */
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError } from '../shared/errors.ts';
import { loadStudy, STUDY_SCHEMA, studyTemplate, type Study } from '../study/index.ts';
import { commandHelp, mainHelp } from './help.ts';
import { findCommand, parseCommand, type ParsedCommand } from './parse.ts';
import { formatTable, processIo, safeText, type Io } from './terminal.ts';
import { cacheFolderOf, runCacheCommand } from './cache-command.ts';
import { runCompareCommand } from './compare-command.ts';
import { createProgress } from './progress.ts';
import {
  abandonActiveStaging,
  checkStudy,
  claimRunFolder,
  computeShard,
  featureWorkIsLarge,
  IN_THREAD,
  lazyPool,
  parseJobs,
  parseShard,
  releaseClaimedRunFolders,
  releaseRunFolder,
  runFolderBase,
  runStudy,
  TOOL_VERSION,
  type RunOutcome,
} from '../run/index.ts';

const percent = (x: number) => (Number.isFinite(x) ? `${(100 * x).toFixed(1)}%` : '-');


function loadFromArgs(cmd: ParsedCommand): Study {
  return loadStudy(cmd.positionals[0], { overrides: (cmd.values.set as string[] | undefined) ?? [] });
}

function runInit(cmd: ParsedCommand, io: Io): number {
  const file = cmd.positionals[0] ?? 'study.yaml';
  if (existsSync(file) && !cmd.values.force) throw new InputError(`${file}: already exists — choose another name or add --force to overwrite it`);
  mkdirSync(dirname(resolve(file)), { recursive: true });
  writeFileSync(file, studyTemplate(String(cmd.values.name ?? 'my-study')));
  io.out(`wrote ${safeText(file)}: edit the groups, then run: patternfold check ${safeText(file)}`);
  return 0;
}

async function runCheck(cmd: ParsedCommand, io: Io): Promise<number> {
  const study = loadFromArgs(cmd);
  const report = await checkStudy(study);
  const rows = [['recording', 'group', 'samples', 'missing', 'adjacent ties', 'format', 'channel']];
  for (const r of report.recordings) {
    rows.push([
      safeText(r.recording.id),
      safeText(r.recording.group),
      String(r.summary.length),
      percent(r.summary.missing / Math.max(1, r.summary.length)),
      percent(r.summary.tiedShare),
      r.format,
      safeText(r.channel),
    ]);
  }
  io.out(`study '${safeText(study.name)}' (${safeText(study.file)}) is valid.\n`);
  io.out(formatTable(rows) + '\n');
  io.out(study.groups.map((g) => `${safeText(g)}: ${report.subjectsPerGroup[g]} subject(s)`).join(', '));
  const cells = study.grid.order.length * study.grid.delay.length * study.grid.scale.length;
  io.out(`grid: order ${study.grid.order.join(',')} x delay ${study.grid.delay.join(',')} x scale ${study.grid.scale.join(',')} = ${cells} cell(s)`);
  if (report.warnings.length === 0) io.out('no warnings.');
  else io.out(`\n${report.warnings.length} warning(s):\n` + report.warnings.map((w) => `  - ${safeText(w)}`).join('\n'));
  if (report.notes.length > 0) io.out(`\n${report.notes.length} note(s):\n` + report.notes.map((n) => `  - ${safeText(n)}`).join('\n'));
  return 0;
}

/** Progress on stderr unless --quiet: a bar on a terminal, plain lines otherwise. */
function progressFor(cmd: ParsedCommand, io: Io) {
  if (cmd.values.quiet) return { onProgress: undefined, end: () => undefined };
  return createProgress({ write: io.errRaw ?? ((t) => io.err(t.replace(/\n$/, ''))), isTTY: io.errIsTTY ?? false, columns: io.errColumns });
}

/** `features --shard K/N`: one part of the feature work into the cache, no output folder. */
async function runShard(cmd: ParsedCommand, io: Io, study: Study, cacheDir: string | null): Promise<number> {
  const shard = parseShard(String(cmd.values.shard));
  if (cmd.values.out !== undefined) throw new InputError('--shard computes into the feature cache and writes no output folder, so it takes no --out — run patternfold run (or features) with the same --cache afterwards');
  const jobs = parseJobs(cmd.values.jobs as string | undefined);
  const pools = lazyPool(jobs);
  const pool = pools.get(cmd.values.jobs !== undefined || featureWorkIsLarge(study));
  const progress = progressFor(cmd, io);
  try {
    const r = await computeShard(study, shard, { ...IN_THREAD, cacheDir, pool }, (done, total) => progress.onProgress?.('features', done, total));
    progress.end();
    for (const w of r.warnings) io.err(`warning: ${safeText(w)}`);
    io.out(`shard ${shard.index}/${shard.count}: ${r.units} (recording x cell) unit(s) over ${r.recordings} recording(s): ${r.computed} computed, ${r.cached} already cached, in ${safeText(cacheDir ?? '')}`);
  } finally {
    await pools.close();
  }
  return 0;
}

async function runPipeline(cmd: ParsedCommand, io: Io, stage: 'features' | 'all', argv: string[]): Promise<number> {
  const study = loadFromArgs(cmd);
  const cacheDir = cmd.values['no-cache'] ? null : cacheFolderOf(cmd.values.cache as string | undefined, study.file);
  if (cmd.values.shard !== undefined) return runShard(cmd, io, study, cacheDir);
  const jobs = parseJobs(cmd.values.jobs as string | undefined);
  const given = cmd.values.out as string | undefined;
  const out = given ?? claimRunFolder(runFolderBase(study, new Date()));
  const quiet = Boolean(cmd.values.quiet);
  const progress = progressFor(cmd, io);
  let outcome: RunOutcome;
  try {
    outcome = await runStudy(study, {
      out,
      stage,
      force: Boolean(cmd.values.force),
      commandLine: ['patternfold', ...argv].join(' '),
      jobs,
      poolOnlyWhenLarge: cmd.values.jobs === undefined,
      cacheDir,
      onProgress: progress.onProgress,
    });
  } catch (e) {
    if (given === undefined) releaseRunFolder(out);
    throw e;
  } finally {
    progress.end();
  }
  if (!quiet && outcome.warnings.length > 0) io.err(`${outcome.warnings.length} warning(s):\n` + outcome.warnings.map((w) => `  - ${safeText(w)}`).join('\n'));
  if (!quiet && outcome.notes.length > 0) io.err(`${outcome.notes.length} note(s):\n` + outcome.notes.map((n) => `  - ${safeText(n)}`).join('\n'));
  io.out(`wrote ${outcome.files.map((f) => safeText(`${out}/${f}`)).join(', ')}`);
  if (outcome.keyFile) io.out(`pseudonym key (keep it private; it is not in the report folder): ${safeText(outcome.keyFile)}`);
  return 0;
}

function runSchema(cmd: ParsedCommand, io: Io): number {
  const text = JSON.stringify(STUDY_SCHEMA, null, 2) + '\n';
  if (cmd.values.out) {
    writeFileSync(String(cmd.values.out), text);
    io.out(`wrote ${safeText(String(cmd.values.out))}`);
  } else io.out(text);
  return 0;
}

async function dispatch(argv: string[], io: Io): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined || first === '--help' || first === '-h' || first === 'help') {
    io.out(mainHelp(TOOL_VERSION));
    return first === undefined ? 2 : 0;
  }
  if (first === '--version' || first === '-v') {
    io.out(TOOL_VERSION);
    return 0;
  }
  const cmd = parseCommand(findCommand(first), rest);
  if (cmd.values.help) {
    io.out(commandHelp(cmd.spec));
    return 0;
  }
  switch (cmd.spec.name) {
    case 'init':
      return runInit(cmd, io);
    case 'check':
      return runCheck(cmd, io);
    case 'features':
      return runPipeline(cmd, io, 'features', argv);
    case 'run':
      return runPipeline(cmd, io, 'all', argv);
    case 'schema':
      return runSchema(cmd, io);
    case 'compare':
      return runCompareCommand(cmd, io);
    case 'cache':
      return runCacheCommand(cmd, io);
    default:
      throw new Error(`command ${cmd.spec.name} is declared but has no handler`);
  }
}

/**
 * On Ctrl-C or SIGTERM: remove this run's unfinished staging folder, say what was kept, and
 * exit with 130 (SIGINT) or 143 (SIGTERM), the shell convention 128 + signal number.
 */
export function installInterruptHandlers(io: Io = processIo): void {
  for (const [signal, code] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
    process.once(signal, () => {
      const removed = abandonActiveStaging();
      releaseClaimedRunFolders();
      io.err(
        `patternfold: interrupted (${signal}): ${removed > 0 ? 'the unfinished output was removed; ' : ''}no output folder was changed (a previous complete one is kept as it was)`,
      );
      process.exit(code);
    });
  }
}

/** Runs the command line and returns the exit code. Never throws. */
export async function main(argv: string[], io: Io = processIo): Promise<number> {
  try {
    return await dispatch(argv, io);
  } catch (e) {
    if (e instanceof InputError) {
      io.err(`patternfold: ${safeText(e.message)}`);
      return 2;
    }
    const error = e as Error;
    io.err(`patternfold: internal error: ${safeText(error?.message ?? String(e))}`);
    io.err(process.env.PATTERNFOLD_DEBUG ? String(error?.stack) : 'Set PATTERNFOLD_DEBUG=1 for details, and please report it with the command you ran.');
    return 1;
  }
}
