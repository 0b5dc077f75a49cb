/**
 * The bad-input corpus (issue 7 item 1; issue 2 "Bad input"): one row per case folder under
 * test/corpus/cases/. The test copies test/corpus/good/ (four well-formed recordings) into a
 * temporary folder, lays the case folder over it, runs any `setup`, runs the command through
 * `main()` and checks the outcome against the row.
 *
 * Rules checked for every row (corpus.test.ts): the exit code; every word of `words` in the
 * message (stderr for a failure; stdout and stderr for a success); a failure prints exactly one
 * line, naming the file, with the fix word `fix`; a failure of `features` leaves no --out
 * folder and no staging folder; `check` writes nothing; no raw control character,
 * escape sequence or bidirectional mark reaches stdout or stderr.
 */
import { setups } from './setup.ts';

export interface CorpusCase {
  /** Folder name under test/corpus/cases/. */
  id: string;
  /** What the case checks, in one line. */
  checks: string;
  command: 'check' | 'features';
  /** The study path given to the command, relative to the case copy (default study.yaml). */
  study?: string;
  /** Extra arguments after the study path (e.g. --set). */
  args?: string[];
  exit: 0 | 2;
  /** Words the message must contain (file name, line, key, found value). */
  words: string[];
  /** For failures: the word that tells the user what to do. */
  fix?: string;
  /** Words that must not appear. */
  absent?: string[];
  /** Creates files that are not committed (binary, EDF bytes, links, permissions). */
  setup?: (dir: string) => void;
  /** Run as an unprivileged user (root reads every file, so permission cases need it). */
  unprivileged?: boolean;
  /** Further checks on a successful `features` run: the output folder. */
  outputs?: 'pe-all' | 'wpe-a1-large' | 'pe-a1-large' | 'pe-a1-large-scale2' | 'constant-a2' | 'null-b2' | 'null-b1' | 'covariate-age' | 'symlink-b3';
  /** A known gap: what must change, and where; the case is reported as todo until then. */
  todo?: string;
}

export const CASES: CorpusCase[] = [
  // ---- the study file -------------------------------------------------------------------------
  { id: '01-yaml-unclosed-bracket', checks: 'YAML syntax error: a flow sequence never closed', command: 'check', exit: 2, words: ['study.yaml:', 'not valid YAML'], fix: 'check' },
  { id: '02-yaml-tab-indent', checks: 'YAML syntax error: tabs used for indentation', command: 'check', exit: 2, words: ['study.yaml:3', 'not valid YAML', 'tab'], fix: 'spaces' },
  { id: '03-yaml-duplicate-key', checks: 'the same key twice in one mapping', command: 'check', exit: 2, words: ['study.yaml:6', 'not valid YAML', "key 'grid' appears twice"], fix: 'remove' },
  { id: '04-study-not-mapping', checks: 'a study file that is a list, not a mapping of keys', command: 'check', exit: 2, words: ['study.yaml', 'mapping'], fix: 'patternfold init' },
  { id: '05-study-empty', checks: 'a study file with only a comment', command: 'check', exit: 2, words: ['study.yaml', "'name'"], fix: 'add' },
  { id: '06-missing-name', checks: 'required key name missing', command: 'check', exit: 2, words: ['study.yaml:1', "missing key 'name'"], fix: 'add' },
  { id: '07-wrong-type-folds', checks: 'wrong type: folds given as a word', command: 'check', exit: 2, words: ['study.yaml:6:10', 'evaluation.folds', 'integer', "'five'"], fix: 'write' },
  { id: '08-wrong-type-order-string', checks: 'wrong type: order given as one string instead of a list', command: 'check', exit: 2, words: ['study.yaml:6', 'grid.order', 'array', "'3,4'"], fix: 'write' },
  { id: '09-key-in-wrong-section', checks: 'unknown top-level key that belongs to a section', command: 'check', exit: 2, words: ['study.yaml:5', "'permutations'", 'evaluation'], fix: 'move' },
  { id: '10-misspelt-key', checks: 'misspelt key with a did-you-mean', command: 'check', exit: 2, words: ['study.yaml:7:3', 'grid.scales', "did you mean 'scale'"], fix: 'did you mean' },
  { id: '11-order-1', checks: 'order 1 is below the smallest order', command: 'check', exit: 2, words: ['study.yaml:6', 'grid.order[0]', '>= 2', 'found 1'], fix: 'use' },
  { id: '12-order-12', checks: 'order 12 is above the largest order (12! patterns)', command: 'check', exit: 2, words: ['study.yaml:6', 'grid.order[1]', '<= 9', 'found 12'], fix: 'use' },
  { id: '13-delay-0', checks: 'delay 0', command: 'check', exit: 2, words: ['study.yaml:6', 'grid.delay[0]', '>= 1', 'found 0'], fix: 'use' },
  { id: '14-scale-0', checks: 'scale 0', command: 'check', exit: 2, words: ['study.yaml:6', 'grid.scale[0]', '>= 1', 'found 0'], fix: 'use' },
  { id: '15-permutations-negative', checks: 'negative permutations', command: 'check', exit: 2, words: ['study.yaml:6', 'evaluation.permutations', '>= 0', 'found -5'], fix: 'use' },
  {
    id: '16-folds-over-group-check',
    checks: 'folds (3) larger than a group (2): check passes and warns',
    command: 'check',
    exit: 0,
    words: ["group 'a' has 2 subject(s), fewer than evaluation.folds = 3", 'use at most 2 folds'],
  },
  {
    id: '17-folds-over-group-features',
    checks: 'folds larger than a group do not concern the feature table: features runs, and repeats the warning',
    command: 'features',
    exit: 0,
    words: ['fewer than evaluation.folds = 3', 'features.csv'],
  },
  { id: '18-three-groups', checks: 'three groups where exactly two are compared', command: 'check', exit: 2, words: ['study.yaml:3', 'exactly two groups', 'found 3'], fix: 'remove' },
  {
    id: '19-set-override-out-of-range',
    checks: 'an out-of-range value given with --set is named as the --set argument',
    command: 'check',
    args: ['--set', 'grid.order=3,12'],
    exit: 2,
    words: ['--set grid.order=3,12', 'grid.order[1]', '<= 9', 'found 12'],
    fix: 'use',
  },

  // ---- files and folders ----------------------------------------------------------------------
  { id: '20-empty-glob', checks: 'a glob that matches no file', command: 'check', exit: 2, words: ['study.yaml:4', 'groups.b', "'recordings/b/*.csv'", 'matches no file'], fix: 'check the path' },
  { id: '21-glob-matches-only-folders', checks: 'a glob that matches only a folder named like a recording', command: 'check', exit: 2, words: ['study.yaml:4', 'groups.b', 'b9.csv', 'folder'], fix: 'check the path' },
  { id: '22-missing-study-file', checks: 'the study file does not exist', command: 'check', study: 'absent.yaml', exit: 2, words: ['absent.yaml', 'no such file'], fix: 'patternfold init' },
  { id: '23-study-is-folder', checks: 'a folder given where the study file is expected', command: 'check', study: '.', exit: 2, words: ['is a folder'], fix: 'give the study file' },
  {
    id: '24-unreadable-recording',
    checks: 'a recording without read permission',
    command: 'check',
    exit: 2,
    setup: setups.unreadable,
    unprivileged: true,
    words: ['b2.csv', 'permission denied'],
    fix: 'check the path and its permissions',
  },
  { id: '25-empty-recording', checks: 'a recording of 0 bytes', command: 'features', exit: 2, words: ['a1.csv', 'the file is empty'], fix: 'give' },
  { id: '26-comment-only-recording', checks: 'a recording holding only comments and blank lines', command: 'features', exit: 2, words: ['a1.csv', 'only comments'], fix: 'give' },
  { id: '27-header-only-recording', checks: 'a recording with a header row and no data', command: 'check', exit: 2, words: ['b2.csv', 'header row (line 1)', 'no data rows'], fix: 'add' },
  { id: '28-binary-recording', checks: 'a binary file (PNG bytes) under a .csv name', command: 'check', exit: 2, setup: setups.binary, words: ['a2.csv', 'binary file'], fix: 'give a text table' },
  { id: '29-utf16-recording', checks: 'UTF-16 text', command: 'check', exit: 2, setup: setups.utf16, words: ['a2.csv', 'UTF-16'], fix: 'save the file as UTF-8' },
  { id: '30-damaged-gzip', checks: 'gzip data cut short', command: 'check', exit: 2, setup: setups.damagedGzip, words: ['b1.csv', 'damaged gzip'], fix: 'compress it again' },
  { id: '31-manifest-file-is-folder', checks: 'a manifest row naming a folder', command: 'check', exit: 2, words: ['subjects.csv:5', 'b9.csv', 'is a folder'], fix: 'name the file' },
  { id: '32-broken-symlink', checks: 'a symbolic link to a file that does not exist', command: 'check', exit: 2, setup: setups.brokenSymlink, words: ['study.yaml:3', 'a/a3.csv', 'symbolic link to ../elsewhere/a3.csv', 'does not exist'], fix: 'fix or remove the link' },
  {
    id: '33-symlink-followed',
    checks: 'symbolic links are followed: the linked recording is read like a file',
    command: 'features',
    exit: 0,
    setup: setups.symlinkToFile,
    words: ['features.csv'],
    outputs: 'symlink-b3',
  },

  // ---- cells ----------------------------------------------------------------------------------
  { id: '34-non-numeric-cell', checks: 'a non-numeric cell: file and row named', command: 'features', exit: 2, words: ['a1.csv:17', '"n/a?"', 'not a number'], fix: 'correct it' },
  {
    id: '35-decimal-comma-semicolon',
    checks: 'decimal commas with semicolon-separated fields WORK and read like decimal points',
    command: 'features',
    exit: 0,
    words: ['features.csv'],
    outputs: 'pe-all',
  },
  {
    id: '36-decimal-comma-in-comma-table',
    checks: 'decimal commas inside a comma-separated table are named as such',
    command: 'features',
    exit: 2,
    words: ['a1.csv:2', '"0,381810"', 'decimal comma'],
    fix: 'semicolons',
  },
  { id: '37-mixed-decimal-marks', checks: 'one column mixing decimal points and decimal commas', command: 'features', exit: 2, words: ['a1.csv:30', 'mixes decimal marks', 'line 1', 'line 30'], fix: 'use one decimal mark' },
  { id: '38-infinity-cell', checks: 'an infinite value', command: 'features', exit: 2, words: ['b1.csv:9', '"-Infinity"', 'infinite'], fix: 'replace it' },
  { id: '39-overflow-cell', checks: 'a number beyond the largest double (2.5e308) reads as infinite', command: 'features', exit: 2, words: ['b2.csv:12', '"2.5e308"', 'infinite'], fix: 'replace it' },
  {
    id: '40-near-max-double',
    checks: 'values up to 1.7e308 WORK at scale 1: patterns only compare values (PE equals that of the unscaled series)',
    command: 'features',
    exit: 0,
    words: ['features.csv'],
    outputs: 'pe-a1-large',
  },
  {
    id: '41-near-max-double-coarse',
    checks: 'values near 1.7e308 at scale 2: block means must not overflow to Infinity (false ties)',
    command: 'features',
    exit: 0,
    words: ['features.csv'],
    outputs: 'pe-a1-large-scale2',
  },
  {
    id: '42-all-nan-recording-check',
    checks: 'a recording of NaN only: check passes and warns (missing, constant or empty)',
    command: 'check',
    exit: 0,
    words: ["recording 'b2' has 60 missing sample(s)", "recording 'b2' is constant or empty"],
  },
  {
    id: '43-all-nan-recording-features',
    checks: 'a recording of NaN only: features runs; every feature of it is empty with a reason',
    command: 'features',
    exit: 0,
    words: ["recording 'b2' is constant or empty"],
    outputs: 'null-b2',
  },
  { id: '44-constant-recording-check', checks: 'a constant recording: check passes and warns', command: 'check', exit: 0, words: ["recording 'a2' is constant or empty"] },
  {
    id: '45-constant-recording-features',
    checks: 'a constant recording: permutation entropy 0 (one pattern), weighted PE empty with a reason, and a warning',
    command: 'features',
    exit: 0,
    words: ["recording 'a2' is constant or empty"],
    outputs: 'constant-a2',
  },
  {
    id: '46-shorter-than-one-window-check',
    checks: 'a recording of 2 samples, shorter than one window of order 3: check passes and warns',
    command: 'check',
    exit: 0,
    words: ["recording 'b1' is too short for order 3", '2 samples give 0 windows'],
  },
  {
    id: '47-shorter-than-one-window-features',
    checks: 'a recording shorter than one window: features runs; its features are empty with a reason',
    command: 'features',
    exit: 0,
    words: ["recording 'b1' is too short"],
    outputs: 'null-b1',
  },
  {
    id: '48-bom-crlf-recording',
    checks: 'a UTF-8 byte-order mark, CRLF line ends and a header row WORK (PE as the plain file)',
    command: 'features',
    exit: 0,
    words: ['features.csv'],
    outputs: 'pe-all',
  },
  {
    id: '49-bom-crlf-study-and-manifest',
    checks: 'a study file and a manifest with a byte-order mark and CRLF WORK; the first column name is clean',
    command: 'features',
    exit: 0,
    words: ['features.csv'],
    outputs: 'covariate-age',
  },

  // ---- subjects and manifests -----------------------------------------------------------------
  { id: '50-duplicate-subject-across-groups', checks: 'the same subject id (file name) in both groups', command: 'check', exit: 2, words: ['study.yaml:4', "subject id 'a1'", 'a/a1.csv', 'b/a1.csv'], fix: 'rename' },
  { id: '51-duplicate-id-csv-and-gz', checks: 'a2.csv and a2.csv.gz give the same subject id', command: 'check', exit: 2, words: ['study.yaml:3', "subject id 'a2'", 'a/a2.csv.gz'], fix: 'rename' },
  { id: '52-manifest-missing-column', checks: "a manifest without the column 'file'", command: 'check', exit: 2, words: ['subjects.csv:1', "no column 'file'", 'found: subject, group, path'], fix: 'the header must name' },
  { id: '53-manifest-group-not-in-study', checks: 'a manifest row in a group the study does not list', command: 'check', exit: 2, words: ['subjects.csv:5', "'B'", 'groups: a, b'], fix: 'fix the manifest' },
  { id: '54-manifest-short-row', checks: 'a manifest row with a cell missing', command: 'check', exit: 2, words: ['subjects.csv:3', 'expected 4 cells', 'found 3'], fix: 'check the delimiters' },
  { id: '55-manifest-subject-in-two-groups', checks: 'one subject in two groups', command: 'check', exit: 2, words: ['subjects.csv:5', "subject 'a2'", 'two groups'], fix: 'belongs to one group' },

  // ---- EDF ------------------------------------------------------------------------------------
  { id: '56-edf-truncated-header', checks: 'EDF file cut inside its signal header', command: 'check', exit: 2, setup: setups.edfTruncatedHeader, words: ['a1.edf', 'truncated header', '512', '356'], fix: 'cut short' },
  { id: '57-edf-wrong-record-count', checks: 'EDF header says 3 data records, the file holds 2', command: 'check', exit: 2, setup: setups.edfWrongRecordCount, words: ['a2.edf', 'wrong record count', 'header says 3, file holds 2'], fix: 'the header is wrong' },
  { id: '58-edf-label-missing', checks: 'an EDF signal label that is not in the file', command: 'check', exit: 2, setup: setups.edfTwoFiles, words: ['a1.edf', '"EEG Cz"', 'EEG Fpz-Cz'], fix: 'available signals' },

  // ---- paths, links, long lines, changing files -----------------------------------------------
  {
    id: '59-path-outside-study-folder',
    checks: 'globs that leave the study folder are allowed, and check says so in a note, not a warning',
    command: 'check',
    study: 'study/study.yaml',
    exit: 0,
    words: ['no warnings.', '1 note(s):', "4 recording(s) lie outside the study file's folder", '../a/a1.csv', 'keep the folders together'],
  },
  { id: '60-very-long-bad-cell', checks: 'a cell of a million characters: the message quotes 40 of them', command: 'features', exit: 2, setup: setups.veryLongCell, words: ['a1.csv:5', 'x'.repeat(40) + '…', 'not a number'], fix: 'correct it' },
  { id: '61-very-long-header', checks: 'a header of 50 000 names: the message lists 20 of them', command: 'check', exit: 2, setup: setups.veryLongHeader, words: ['a1.csv', '"heart_rate"', '"channel_20"', '(50000 in all)'], absent: ['channel_21"'], fix: 'available columns' },
  {
    id: '62-file-changes-while-read',
    checks: 'a recording that grows while it is read (size before and after differ)',
    command: 'features',
    exit: 2,
    setup: setups.growsWhileRead,
    words: ['grows-while-read.csv', 'changed while it was being read'],
    fix: 'wait until',
  },

  // ---- hostile strings ------------------------------------------------------------------------
  { id: '63-hostile-group-names', checks: 'group names with an ANSI colour sequence, a bell and a right-to-left override', command: 'check', exit: 0, words: ['\\u001b[31mred\\u001b[0m', '\\u202eevil\\u0007'] },
  { id: '64-hostile-file-name', checks: 'a file name with a screen-clearing sequence and a right-to-left override', command: 'check', exit: 0, setup: setups.hostileFileName, words: ['\\u001b[2J\\u202egpj'] },
  { id: '65-hostile-cell', checks: 'a cell with escape sequences: quoted with escapes in the error', command: 'features', exit: 2, setup: setups.hostileCell, words: ['a1.csv:3', 'not a number', '\\x1b[31m0.5\\x07'], fix: 'correct it' },
  { id: '66-hostile-manifest-subject', checks: 'manifest subject ids with escapes, backspaces and overrides', command: 'check', exit: 0, setup: setups.hostileManifest, words: ['a1\\u001b[31m', '\\u202eb1', 'b2\\u0008\\u0008'] },
  { id: '67-hostile-unknown-key', checks: 'an unknown key that is an OSC title sequence', command: 'check', exit: 2, words: ['study.yaml:7', 'unknown key', '\\u001b]0;pwned\\u0007'], fix: 'allowed keys' },
  {
    id: '73-hostile-group-names-features',
    checks: 'hostile group names through features: the warnings (folds 3 > 2 subjects) stay escaped',
    command: 'features',
    exit: 0,
    words: ["group '\\u001b[31mred\\u001b[0m' has 2 subject(s)", "group '\\u202eevil\\u0007' has 2 subject(s)", 'features.csv'],
  },
  { id: '74-very-long-group-name', checks: 'a group name of 210 characters is refused, quoted short', command: 'check', exit: 2, words: ['study.yaml:3', 'group name', 'is 210 characters long', '…'], fix: 'use a name of at most 100 characters' },
  { id: '75-very-long-subject-id', checks: 'a manifest subject id of 150 characters is refused, quoted short', command: 'check', exit: 2, words: ['subjects.csv:3', 'subject id', 'is 150 characters long'], fix: 'use a name of at most 100 characters' },

  {
    id: '76-decimal-commas-one-column',
    checks: 'one column written with decimal commas reads as two integer columns: check warns and says how to save it',
    command: 'check',
    exit: 0,
    setup: setups.decimalCommas,
    words: ["recording 'a1'", 'pairs of whole numbers separated by a comma', 'decimal commas', 'save it with decimal points'],
    absent: ["recording 'a2' holds only pairs"],
  },

  // ---- selection --------------------------------------------------------------------------------
  { id: '68-start-past-end', checks: 'signal.start beyond the end of a recording', command: 'check', exit: 2, words: ['a1.csv', 'start 100 skips past the end', '60 samples'], fix: 'use a start below 60' },
  { id: '69-symlink-loop', checks: 'two symbolic links pointing at each other', command: 'check', exit: 2, setup: setups.symlinkLoop, words: ['study.yaml:3', 'a/a3.csv', 'symbolic link to a4.csv', 'loop'], fix: 'fix or remove the link' },
  {
    id: '70-near-max-double-weighted',
    checks: 'weighted PE of values near 1.7e308 equals that of the unscaled series (weights scale by c^2)',
    command: 'features',
    exit: 0,
    words: ['features.csv'],
    outputs: 'wpe-a1-large',
  },
  {
    id: '71-failure-keeps-previous-output',
    checks: 'a failing features run leaves the output folder of an earlier run exactly as it was',
    command: 'features',
    exit: 2,
    words: ['b1.csv:23', '"12:30"', 'not a number'],
    fix: 'correct it',
  },
  {
    id: '72-invalid-utf8-late',
    checks: 'a non-UTF-8 byte far into a text file (past the 1024 bytes sniffed): file and line named',
    command: 'check',
    exit: 2,
    setup: setups.invalidUtf8Late,
    words: ['b2.csv:200', 'not UTF-8'],
    fix: 'save the file as UTF-8',
  },
];
