import { InputError } from '../shared/errors.ts';
import type { EdfHeader, EdfSignalHeader } from './edf-header.ts';
import { quoteFound } from './quote-found.ts';

/** Separators of a time-stamped annotation list (TAL) in EDF+ (Kemp & Olivan 2003). */
const ONSET_END = 0x14;
const DURATION_START = 0x15;
const ONSET = /^[+-]\d+(?:\.\d*)?$/;

/**
 * Start time of every data record of an EDF+ file, in seconds from the file's start date
 * and time. EDF+ (Kemp & Olivan 2003, Clin. Neurophysiol. 114, 1755) puts, at the start of
 * each record's "EDF Annotations" signal, a time-keeping TAL `+<onset>\x14\x14\x00` whose
 * onset is the record's start time; only that first onset is read here.
 *
 * Complexity O(records × annotation bytes up to the first 0x14).
 *
 * @throws InputError naming the file and the record when a record does not start with an onset.
 * @returns one onset per data record (an empty array for a file without records).
 * @example recordOnsets(bytes, header, annotationSignal, 'r.edf') // e.g. [0, 1, 5] for a gap after record 2
 */
export function recordOnsets(bytes: Uint8Array, header: EdfHeader, annotations: EdfSignalHeader, fileLabel: string): Float64Array {
  const onsets = new Float64Array(header.dataRecords);
  const width = 2 * annotations.samplesPerRecord;
  for (let r = 0; r < header.dataRecords; r++) {
    const from = header.headerBytes + r * header.recordBytes + annotations.offsetInRecord;
    const text = firstOnsetText(bytes, from, from + width);
    if (!ONSET.test(text)) {
      throw new InputError(`${fileLabel}: data record ${r + 1} has no time-keeping annotation (found ${quoteFound(text)} at the start of "${annotations.label}") — EDF+D needs one onset per record; repair the file with the recording software`);
    }
    onsets[r] = Number(text);
  }
  return onsets;
}

function firstOnsetText(bytes: Uint8Array, from: number, to: number): string {
  let s = '';
  for (let i = from; i < to; i++) {
    const b = bytes[i];
    if (b === ONSET_END || b === DURATION_START || b === 0) break;
    s += String.fromCharCode(b);
  }
  return s;
}
