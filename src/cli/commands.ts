/**
 * Every command and option of the command line, declared once as data. Parsing (parse.ts),
 * help text (help.ts) and running (main.ts) all read these declarations.
 */
export interface OptionSpec {
  name: string;
  short?: string;
  type: 'string' | 'boolean';
  multiple?: boolean;
  /** Placeholder shown in help for string options. */
  value?: string;
  description: string;
  /** Default as shown in help. */
  default?: string;
}

export interface CommandSpec {
  name: string;
  summary: string;
  positionals: { name: string; required: boolean; description: string }[];
  options: OptionSpec[];
  examples: string[];
}

const SET: OptionSpec = {
  name: 'set',
  type: 'string',
  multiple: true,
  value: 'KEY=VALUE',
  description: 'override one study setting for this run, e.g. --set grid.scale=1,2,8 (repeatable)',
};
const OUT: OptionSpec = {
  name: 'out',
  short: 'o',
  type: 'string',
  value: 'DIR',
  description: 'output folder (replaced atomically when the run completes)',
  default: 'reports/<study name>/<time>-<hash>',
};
const HELP: OptionSpec = { name: 'help', short: 'h', type: 'boolean', description: 'show this help' };
const FORCE: OptionSpec = {
  name: 'force',
  type: 'boolean',
  description: 'start even when check estimates the run as unreasonably long or the grid as unsupported by the recordings',
};
const QUIET: OptionSpec = { name: 'quiet', short: 'q', type: 'boolean', description: 'print only errors and the final summary (no progress)' };
const JOBS: OptionSpec = {
  name: 'jobs',
  short: 'j',
  type: 'string',
  value: 'N',
  description: 'worker threads for features and permutations; results are identical for any N',
  default: 'the number of cores for large stages; small ones stay in this thread',
};
const CACHE: OptionSpec = {
  name: 'cache',
  type: 'string',
  value: 'DIR',
  description: 'feature cache folder (reruns compute only cells not in it)',
  default: '.patternfold-cache beside the study file',
};
const NO_CACHE: OptionSpec = { name: 'no-cache', type: 'boolean', description: 'neither read nor write the feature cache' };
const SHARD: OptionSpec = {
  name: 'shard',
  type: 'string',
  value: 'K/N',
  description: 'compute only part K of N of the (recording x cell) work into the cache, write no output folder (for clusters)',
};

export const COMMANDS: CommandSpec[] = [
  {
    name: 'init',
    summary: 'write a commented study file to start from',
    positionals: [{ name: 'FILE', required: false, description: 'where to write it (default study.yaml)' }],
    options: [
      { name: 'name', type: 'string', value: 'NAME', description: 'the study name to put in the file', default: 'my-study' },
      { name: 'force', type: 'boolean', description: 'overwrite FILE if it exists' },
      HELP,
    ],
    examples: ['patternfold init studies/fatigue.yaml --name fresh-vs-fatigued'],
  },
  {
    name: 'check',
    summary: 'validate a study and read every recording, without computing features',
    positionals: [{ name: 'STUDY', required: true, description: 'the study file (YAML)' }],
    options: [SET, HELP],
    examples: ['patternfold check studies/demo.yaml', 'patternfold check studies/demo.yaml --set evaluation.folds=3'],
  },
  {
    name: 'features',
    summary: 'compute the feature table only (features.csv, quality.csv, results.json)',
    positionals: [{ name: 'STUDY', required: true, description: 'the study file (YAML)' }],
    options: [OUT, SET, JOBS, CACHE, NO_CACHE, SHARD, QUIET, HELP],
    examples: [
      'patternfold features studies/demo.yaml --out reports/demo-features',
      'patternfold features studies/demo.yaml --shard 3/8 --cache /shared/pf-cache   # one of eight cluster jobs',
    ],
  },
  {
    name: 'run',
    summary: 'run the whole study: features, statistics, report',
    positionals: [{ name: 'STUDY', required: true, description: 'the study file (YAML)' }],
    options: [OUT, SET, JOBS, CACHE, NO_CACHE, QUIET, FORCE, HELP],
    examples: ['patternfold run studies/demo.yaml --out reports/demo', 'patternfold run studies/demo.yaml --set grid.scale=1,2,8 --set evaluation.permutations=199'],
  },
  {
    name: 'compare',
    summary: 'show what changed between two runs: settings, inputs, headline and per-cell results',
    positionals: [
      { name: 'RUN_A', required: true, description: 'the earlier run folder (or its results.json)' },
      { name: 'RUN_B', required: true, description: 'the later run folder (or its results.json)' },
    ],
    options: [HELP],
    examples: ['patternfold compare reports/demo/20261201-101500Z-1a2b3c4d reports/demo/20261202-091000Z-5e6f7a8b'],
  },
  {
    name: 'cache',
    summary: 'show the size of the feature cache, prune old entries or clear it',
    positionals: [{ name: 'STUDY', required: false, description: 'a study file, to use the cache beside it' }],
    options: [
      { name: 'cache', type: 'string', value: 'DIR', description: 'the cache folder', default: '.patternfold-cache beside STUDY, else in the current folder' },
      { name: 'prune-older-than', type: 'string', value: 'DAYS', description: 'remove entries not used in the last DAYS days' },
      { name: 'clear', type: 'boolean', description: 'remove every entry' },
      HELP,
    ],
    examples: ['patternfold cache studies/demo.yaml', 'patternfold cache --cache /shared/pf-cache --prune-older-than 30'],
  },
  {
    name: 'schema',
    summary: 'print the JSON Schema of study files (for editor completion)',
    positionals: [],
    options: [{ name: 'out', short: 'o', type: 'string', value: 'FILE', description: 'write it to FILE instead of standard output' }, HELP],
    examples: ['patternfold schema --out study.schema.json'],
  },
];
