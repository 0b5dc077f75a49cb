import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadStudy } from '../../src/study/index.ts';
import { inputErrorMessage } from '../helpers/errors.ts';
import { makeFolder, twoGroupStudy } from '../helpers/tmp.ts';

const MINIMAL = 'name: t\ngroups:\n  a: a/*.csv\n  b: b/*.csv\n';

const messageOf = inputErrorMessage;

describe('loadStudy', () => {
  it('fills every default from the schema for the shortest study file (a name and two globs)', () => {
    const dir = twoGroupStudy(MINIMAL);
    const study = loadStudy(join(dir, 'study.yaml'));
    expect(study.groups).toEqual(['a', 'b']);
    expect(study.recordings.map((r) => r.id)).toEqual(['a0', 'a1', 'a2', 'b0', 'b1', 'b2']);
    expect(study.grid).toEqual({ order: [3, 4, 5], delay: [1, 2], scale: [1, 2, 4] });
    expect(study.evaluation).toMatchObject({ folds: 5, repeats: 10, permutations: 999, classifier: 'forest' });
    expect(study.signal).toEqual({ column: 1, start: 0, length: null });
    expect(study.features.ties).toBe('appearance');
    expect(study.seed).toBe(1);
  });

  it('applies --set overrides with list values split on commas', () => {
    const dir = twoGroupStudy(MINIMAL);
    const study = loadStudy(join(dir, 'study.yaml'), { overrides: ['grid.scale=1,2,8', 'evaluation.folds=3', 'features.ties=jitter'] });
    expect(study.grid.scale).toEqual([1, 2, 8]);
    expect(study.evaluation.folds).toBe(3);
    expect(study.features.ties).toBe('jitter');
  });

  it('names file, line, column and key path for an unknown key, with a suggestion', () => {
    const dir = twoGroupStudy(MINIMAL + 'grid:\n  order: [3]\n  scales: [1, 2]\n');
    const msg = messageOf(() => loadStudy(join(dir, 'study.yaml')));
    expect(msg).toMatch(/study\.yaml:7:3: unknown key 'scales' at grid\.scales — did you mean 'scale'\?$/);
  });

  it('reports an out-of-range order with the value found', () => {
    const dir = twoGroupStudy(MINIMAL + 'grid:\n  order: [3, 12]\n');
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/study\.yaml:6:14: grid\.order\[1\] must be <= 9, found 12/);
  });

  it('reports a wrong type', () => {
    const dir = twoGroupStudy(MINIMAL + 'evaluation:\n  folds: five\n');
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/study\.yaml:6:10: evaluation\.folds must be an integer, found 'five'/);
  });

  it('suggests the closest value of an enumeration', () => {
    const dir = twoGroupStudy(MINIMAL + 'features:\n  ties: jiter\n');
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/features\.ties must be one of appearance, jitter, symbols, found 'jiter' — did you mean 'jitter'\?/);
  });

  it('reports malformed YAML with its line', () => {
    const dir = twoGroupStudy('name: t\ngroups:\n  a: [a/*.csv\n  b: b/*.csv\n');
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/study\.yaml:\d+:\d+: the study file is not valid YAML/);
  });

  it('reports an empty glob with the line of the group', () => {
    const dir = twoGroupStudy('name: t\ngroups:\n  a: a/*.csv\n  b: nowhere/*.csv\n');
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/study\.yaml:4:6: groups\.b pattern 'nowhere\/\*\.csv' matches no file/);
  });

  it('rejects a study with one group', () => {
    const dir = twoGroupStudy('name: t\ngroups:\n  a: a/*.csv\n');
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/groups must name exactly two groups, found 1/);
  });

  it('rejects two recordings with the same subject id', () => {
    const dir = makeFolder({ 'study.yaml': MINIMAL, 'a/s1.csv': '1\n2\n', 'b/s1.csv': '1\n2\n' });
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/two recordings have the subject id 's1': a\/s1\.csv \(a\) and b\/s1\.csv \(b\)/);
  });

  it('reads a subjects manifest with covariates and several recordings per subject', () => {
    const dir = makeFolder({
      'study.yaml': 'name: t\nsubjects: subjects.csv\ngroups: [control, patient]\n',
      'subjects.csv': 'subject,group,file,age\np1,control,d/1.csv,30\np1,control,d/2.csv,30\np2,patient,d/3.csv,41\n',
      'd/1.csv': '1\n',
      'd/2.csv': '1\n',
      'd/3.csv': '1\n',
    });
    const study = loadStudy(join(dir, 'study.yaml'));
    expect(study.recordings.map((r) => [r.id, r.subject, r.group, r.covariates.age])).toEqual([
      ['p1#1', 'p1', 'control', '30'],
      ['p1#2', 'p1', 'control', '30'],
      ['p2', 'p2', 'patient', '41'],
    ]);
  });

  it('rejects a manifest subject in a group the study does not list, naming the manifest line', () => {
    const dir = makeFolder({
      'study.yaml': 'name: t\nsubjects: subjects.csv\ngroups: [control, patient]\n',
      'subjects.csv': 'subject,group,file\np1,control,1.csv\np2,patinet,2.csv\n',
      '1.csv': '1\n',
      '2.csv': '1\n',
    });
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/subjects\.csv:3: subject 'p2' is in group 'patinet', which the study does not list/);
  });

  it('rejects a manifest without a required column', () => {
    const dir = makeFolder({ 'study.yaml': 'name: t\nsubjects: subjects.csv\n', 'subjects.csv': 'subject,file\np1,1.csv\n' });
    expect(messageOf(() => loadStudy(join(dir, 'study.yaml')))).toMatch(/subjects\.csv:1: the manifest has no column 'group'/);
  });

  it('notes recordings outside the study folder without refusing them', () => {
    const dir = makeFolder({ 'studies/s.yaml': 'name: t\ngroups:\n  a: ../a/*.csv\n  b: ../b/*.csv\n', 'a/x.csv': '1\n', 'b/y.csv': '1\n' });
    const study = loadStudy(join(dir, 'studies/s.yaml'));
    expect(study.notes[0]).toMatch(/2 recording\(s\) lie outside the study file's folder/);
  });

  it('names a missing study file', () => {
    expect(messageOf(() => loadStudy('/nonexistent/study.yaml'))).toBe(
      "/nonexistent/study.yaml: cannot read the study file: no such file — check the path, or create one with 'patternfold init'",
    );
  });
});

describe('schema/study.schema.json', () => {
  it('is the schema the loader validates against (regenerate with npm run schema)', async () => {
    const { readFileSync } = await import('node:fs');
    const { STUDY_SCHEMA } = await import('../../src/study/index.ts');
    const committed = JSON.parse(readFileSync(join(import.meta.dirname, '..', '..', 'schema', 'study.schema.json'), 'utf8'));
    expect(committed).toEqual(JSON.parse(JSON.stringify(STUDY_SCHEMA)));
  });
});
