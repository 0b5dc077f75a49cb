/**
 * The commented study file written by `patternfold init`. Every key is shown with its
 * default; only `name` and `groups` (or `subjects`) are required.
 */
export function studyTemplate(name: string): string {
  return `# patternfold study file. Paths are relative to this file.
# Only name and groups (or subjects) are required; every other value below is the default.
# yaml-language-server: $schema=https://patternfold.invalid/study.schema.json
name: ${JSON.stringify(name)}
seed: 1                      # every random draw derives from this integer

# Two groups: group name -> glob (or list of globs) of recordings, one subject per file.
groups:
  reference: recordings/reference/*.csv
  comparison: recordings/comparison/*.csv
# Or a manifest table with columns subject, group, file (+ covariate columns):
# subjects: subjects.csv
# groups: [reference, comparison]   # optional with a manifest: the two names, reference first

signal:
  column: 1                  # text: 1-based column or header name; EDF: signal number or label
  start: 0                   # samples skipped at the start of each recording
  length: null               # samples kept after start (null: all)

grid:                        # every (order, delay, scale) combination is one cell
  order: [3, 4, 5]           # pattern orders m, 2 to 9
  delay: [1, 2]              # delays tau, in samples
  scale: [1, 2, 4]           # coarse-graining scales s

features:
  ties: appearance           # appearance | jitter | symbols
  jitter_repeats: 10         # draws averaged when ties is jitter
  scale_form: coarse         # coarse | composite
  min_windows_per_pattern: 5 # cells with fewer valid windows per possible pattern are flagged

evaluation:
  folds: 5                   # stratified, grouped by subject
  repeats: 10                # repeated with different seeded splits
  permutations: 999          # label permutations of the whole pipeline (0: none)
  classifier: forest         # forest | logistic
  trees: 100
  l2: 1                      # penalty of the logistic regression
  stop_early: false          # Besag & Clifford (1991) sequential stopping

report:
  pseudonyms: false          # replace subject ids by stable pseudonyms in the report folder
`;
}
