/**
 * Pseudonyms for the report folder (`report.pseudonyms: true`). Subject ids are replaced by
 * S001, S002, ... in an order drawn from the study seed, so the same study file and cohort
 * give the same pseudonyms on every run; a subject's recordings keep their #k suffix. File
 * names in the report folder become `<pseudonym><extensions>`. The key (pseudonym -> subject
 * id and file) is written only beside the output folder, never inside it.
 */
import { basename } from 'node:path';
import { createRng, deriveSeed, shuffleInPlace } from '../shared/random.ts';
import type { Recording, Study } from '../study/index.ts';

export interface PseudonymKeyRow {
  pseudonym: string;
  subject: string;
  recording: string;
  file: string;
}

/** The study with pseudonymous ids and file names, and the key to reverse them. */
export function pseudonymiseStudy(study: Study): { study: Study; key: PseudonymKeyRow[] } {
  const subjects = [...new Set(study.recordings.map((r) => r.subject))].sort();
  shuffleInPlace(subjects, createRng(deriveSeed(study.seed, 'pseudonyms')));
  const width = Math.max(3, String(subjects.length).length);
  const alias = new Map(subjects.map((s, i) => [s, `S${String(i + 1).padStart(width, '0')}`]));
  const key: PseudonymKeyRow[] = [];
  const recordings: Recording[] = study.recordings.map((r) => {
    const pseudonym = alias.get(r.subject)!;
    const suffix = r.id.startsWith(r.subject) ? r.id.slice(r.subject.length) : '';
    const extension = /(\.[a-z0-9]+)?(\.gz)?$/i.exec(basename(r.relPath))?.[0] ?? '';
    const id = pseudonym + suffix;
    key.push({ pseudonym: id, subject: r.subject, recording: r.id, file: r.relPath });
    return { ...r, id, subject: pseudonym, relPath: id.replace('#', '-') + extension };
  });
  const renamed = (note: string) => study.recordings.reduce((text, r, i) => text.split(r.relPath).join(recordings[i].relPath), note);
  return { study: { ...study, recordings, notes: study.notes.map(renamed) }, key };
}
