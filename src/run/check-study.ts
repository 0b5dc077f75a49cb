/**
 * `patternfold check`: validates a study and reads every recording without computing
 * features, then describes the cohort and lists warnings.
 */
import type { Study } from '../study/index.ts';
import { forEachRecording, type RecordingInfo } from './read-cohort.ts';
import { studyWarnings, subjectsPerGroup } from './warnings.ts';

export interface CheckReport {
  study: Study;
  recordings: RecordingInfo[];
  subjectsPerGroup: Record<string, number>;
  warnings: string[];
  /** About the study as written, not the data (e.g. recordings outside the study folder). */
  notes: string[];
}

/** Reads every recording of the study (samples are released as soon as they are described). */
export async function checkStudy(study: Study, onProgress?: (done: number, total: number) => void): Promise<CheckReport> {
  const read = await forEachRecording(study, () => undefined, onProgress);
  const recordings = read.map((r) => r.info);
  return { study, recordings, subjectsPerGroup: subjectsPerGroup(study), warnings: studyWarnings(study, recordings), notes: [...study.notes] };
}
