import { InputError } from '../shared/errors.ts';
import { parseEdfHeader, type EdfHeader, type EdfSignalHeader } from './edf-header.ts';
import { recordOnsets } from './edf-record-onsets.ts';
import { quoteFound } from './quote-found.ts';
import { selectSeries } from './selection.ts';
import { sniffFormat } from './sniff.ts';
import type { Series, SignalSelection } from './types.ts';

/** Largest channel, gaps included, that EDF+D gap filling will build (2^28 samples, 2 GiB of doubles). */
const MAX_FILLED_SAMPLES = 2 ** 28;
/** A gap smaller than this many sample periods counts as none (onsets are written with limited digits). */
const GAP_TOLERANCE = 1e-3;

/**
 * Reads one signal of an EDF or EDF+ file (bytes in memory, no I/O) as a series of
 * physical values (Kemp et al. 1992, Electroencephalogr. Clin. Neurophysiol. 82, 391;
 * Kemp & Olivan 2003, Clin. Neurophysiol. 114, 1755).
 *
 * Samples are 16-bit little-endian two's-complement integers d, stored record by record
 * (all samples of signal 1, then signal 2, ...), and scaled to
 * physical = pmin + (d − dmin)·(pmax − pmin)/(dmax − dmin).
 * The signal is chosen by its 1-based number counted without the "EDF Annotations"
 * signal, or by its label (trimmed, case-insensitive exact match).
 *
 * EDF+D (discontinuous) — our choice: the start time of every record is read from the
 * time-keeping annotation; records that follow on without a gap are joined, and a gap
 * of a whole number of sample periods is filled with that many NaN samples (counted as
 * missing, so no two samples that were apart in time become neighbours). A gap that is
 * not a whole number of samples, or records that overlap or run backwards, are an
 * InputError. EDF+C and plain EDF records are joined in file order.
 *
 * Complexity O(records × samples per record) for the chosen signal.
 *
 * @throws InputError naming the file and the header field: all header errors of
 *   {@link parseEdfHeader}; dmax == dmin; a label or number that is not there (the
 *   labels available are listed); the annotation signal selected; selection out of range.
 * @example parseEdf(bytes, { column: 'EEG Fpz-Cz', start: 0, length: null }, 'r.edf')
 *   // { format: 'edf+', channel: 'EEG Fpz-Cz', sampleRate: 100, ... }
 */
export function parseEdf(bytes: Uint8Array, selection: SignalSelection, fileLabel: string): Series {
  if (sniffFormat(bytes) !== 'edf') {
    throw new InputError(`${fileLabel}: not an EDF file — the first 8 bytes are not the version field "0" padded with spaces`);
  }
  const header = parseEdfHeader(bytes, fileLabel);
  const isPlus = header.reserved.startsWith('EDF+C') || header.reserved.startsWith('EDF+D');
  const signal = chooseSignal(header.signals, selection.column, fileLabel);
  let samples = physicalSamples(bytes, header, signal, fileLabel);
  if (header.reserved.startsWith('EDF+D')) samples = fillRecordGaps(samples, bytes, header, signal, fileLabel);
  const sampleRate = header.recordDuration > 0 ? signal.samplesPerRecord / header.recordDuration : null;
  return selectSeries({ samples, format: isPlus ? 'edf+' : 'edf', channel: signal.label, sampleRate }, selection, fileLabel);
}

function listSignals(signals: readonly EdfSignalHeader[]): string {
  const shown = signals.filter((s) => !s.isAnnotations).map((s, i) => `${i + 1} ${quoteFound(s.label)}`);
  return `available signals: ${shown.join(', ')}`;
}

function chooseSignal(signals: readonly EdfSignalHeader[], wanted: number | string, fileLabel: string): EdfSignalHeader {
  const ordinary = signals.filter((s) => !s.isAnnotations);
  if (ordinary.length === 0) throw new InputError(`${fileLabel}: the file holds only the "EDF Annotations" signal, no samples — choose a recording with signals`);
  if (typeof wanted === 'number') {
    if (!Number.isSafeInteger(wanted) || wanted < 1 || wanted > ordinary.length) {
      throw new InputError(`${fileLabel}: there is no signal number ${String(wanted)} (the file has ${ordinary.length}, not counting "EDF Annotations") — ${listSignals(signals)}`);
    }
    return ordinary[wanted - 1];
  }
  const label = wanted.trim().toLowerCase();
  const matches = signals.filter((s) => s.label.toLowerCase() === label);
  if (matches.length === 0) throw new InputError(`${fileLabel}: no signal labelled ${quoteFound(wanted.trim())} — ${listSignals(signals)}`);
  if (matches[0].isAnnotations) {
    throw new InputError(`${fileLabel}: "EDF Annotations" holds annotations (text), not samples — choose a signal; ${listSignals(signals)}`);
  }
  if (matches.length > 1) {
    const numbers = matches.map((s) => ordinary.indexOf(s) + 1).join(' and ');
    throw new InputError(`${fileLabel}: the label ${quoteFound(wanted.trim())} names signals ${numbers} — choose one by number`);
  }
  return matches[0];
}

/** Decodes the chosen signal over all records and scales digital to physical values. */
function physicalSamples(bytes: Uint8Array, header: EdfHeader, signal: EdfSignalHeader, fileLabel: string): Float64Array {
  const { physicalMin: pmin, physicalMax: pmax, digitalMin: dmin, digitalMax: dmax } = signal;
  if (dmax === dmin) {
    throw new InputError(`${fileLabel}: signal ${quoteFound(signal.label)} has header field "digital maximum" equal to "digital minimum" (${dmin}), so its values cannot be scaled — the header is damaged; repair those fields`);
  }
  const gain = (pmax - pmin) / (dmax - dmin);
  const spr = signal.samplesPerRecord;
  const out = new Float64Array(header.dataRecords * spr);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let r = 0; r < header.dataRecords; r++) {
    const base = header.headerBytes + r * header.recordBytes + signal.offsetInRecord;
    for (let j = 0; j < spr; j++) out[r * spr + j] = pmin + (view.getInt16(base + 2 * j, true) - dmin) * gain;
  }
  return out;
}

/** EDF+D: inserts NaN for the time between records, from the records' onsets. */
function fillRecordGaps(samples: Float64Array, bytes: Uint8Array, header: EdfHeader, signal: EdfSignalHeader, fileLabel: string): Float64Array {
  const annotations = header.signals.find((s) => s.isAnnotations);
  if (!annotations) throw new InputError(`${fileLabel}: EDF+D (discontinuous) file without an "EDF Annotations" signal, so record times are unknown — repair the file with the recording software`);
  if (header.recordDuration <= 0) throw new InputError(`${fileLabel}: EDF+D file with header field "record duration" ${header.recordDuration} — records need a positive duration to be placed in time`);
  const onsets = recordOnsets(bytes, header, annotations, fileLabel);
  const spr = signal.samplesPerRecord;
  const period = header.recordDuration / spr;
  const gaps = new Float64Array(onsets.length);
  for (let r = 1; r < onsets.length; r++) gaps[r] = gapInSamples(onsets[r] - onsets[r - 1] - header.recordDuration, period, r, fileLabel);
  const filled = samples.length + gaps.reduce((a, b) => a + b, 0);
  if (filled > MAX_FILLED_SAMPLES) throw new InputError(`${fileLabel}: EDF+D gaps would make ${filled} samples (more than ${MAX_FILLED_SAMPLES}) — split the recording into its continuous parts`);
  const out = new Float64Array(filled).fill(NaN);
  let at = 0;
  for (let r = 0; r < onsets.length; r++) {
    at += gaps[r];
    out.set(samples.subarray(r * spr, (r + 1) * spr), at);
    at += spr;
  }
  return out;
}

function gapInSamples(gapSeconds: number, period: number, record: number, fileLabel: string): number {
  const gap = gapSeconds / period;
  if (Math.abs(gap) < GAP_TOLERANCE) return 0;
  if (gap < 0) {
    throw new InputError(`${fileLabel}: EDF+D data record ${record + 1} starts ${seconds(-gapSeconds)} s before record ${record} ends (records overlap or are out of order) — patternfold reads records in time order only; repair the file`);
  }
  const whole = Math.round(gap);
  if (Math.abs(gap - whole) > GAP_TOLERANCE) {
    throw new InputError(`${fileLabel}: EDF+D gap of ${seconds(gapSeconds)} s before data record ${record + 1} is ${gap.toFixed(3)} sample periods, not a whole number, so it cannot be filled with missing samples — split the recording at the gap`);
  }
  return whole;
}

/** Seconds for a message, without binary-fraction noise (0.1, not 0.10000000000000009). */
function seconds(x: number): string {
  return String(Number(x.toPrecision(9)));
}
