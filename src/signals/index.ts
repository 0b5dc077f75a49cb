// Intake stage: one recording file -> one series. Re-exports only.
export type { SignalSelection, Series, SignalFormat } from './types.ts';
export { readRecordingFile, readSeries, seriesOfFile, type RecordingFile } from './read.ts';
export { parseRecording } from './recording.ts';
export { parseDelimited } from './delimited.ts';
export { parseEdf } from './edf.ts';
export { parseEdfHeader, type EdfHeader, type EdfSignalHeader } from './edf-header.ts';
export { sniffFormat, type SniffedKind } from './sniff.ts';
export { MISSING_TOKENS } from './sample-cell.ts';
export { describeSeries, type SeriesSummary } from './describe.ts';
