/**
 * Contract of the intake stage: which part of a recording to read ({@link SignalSelection})
 * and what comes back ({@link Series}).
 */

/** Which channel of a recording and which run of samples in it. */
export interface SignalSelection {
  /**
   * Text tables: the 1-based column number, or the header name (trimmed, exact match first,
   * then a unique case-insensitive match). EDF/EDF+: the 1-based signal number counted
   * without the "EDF Annotations" signal, or the label (trimmed, case-insensitive).
   */
  column: number | string;
  /** Samples to skip at the start of the channel (an integer >= 0). Default 0. */
  start: number;
  /** Samples to keep after `start` (an integer >= 1), or null for all the rest. */
  length: number | null;
}

/** The file formats the intake stage reads. */
export type SignalFormat = 'text' | 'edf' | 'edf+';

/** One channel of one recording, as read. */
export interface Series {
  /** The selected samples; missing samples are NaN, never dropped (dropping joins non-adjacent samples). */
  values: Float64Array;
  /** Number of NaN in `values`. */
  missing: number;
  /** Samples in the channel before the start/length selection (EDF+D gaps included as NaN). */
  totalSamples: number;
  format: SignalFormat;
  /** Header name, EDF label, or `column N` for a table without header. */
  channel: string;
  /** EDF: samples per data record / record duration (Hz); text tables: null. */
  sampleRate: number | null;
  /**
   * A caution about how the file was read that the data alone cannot settle, in plain words
   * (e.g. a table that may be one column written with decimal commas); null when none.
   */
  caution: string | null;
  /**
   * The file as read by `readSeries`: its size and the SHA-256 (FIPS 180-4, lowercase hex) of
   * exactly the bytes parsed, so a fingerprint never describes other bytes than the samples.
   * Absent when the series was parsed from bytes in memory.
   */
  source?: { bytes: number; sha256: string };
}
