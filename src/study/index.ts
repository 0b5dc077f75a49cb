export { loadStudy, type LoadOptions } from './load.ts';
export { STUDY_SCHEMA } from './schema.ts';
export { studyTemplate } from './template.ts';
export { subjectIdOf } from './recordings.ts';
export { closest, editDistance } from './suggest.ts';
export type { Recording, SignalSettings, FeatureSettings, EvaluationOptions, Study } from './types.ts';
