import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/shared/errors.ts';
import { parseEdf, parseEdfHeader, parseRecording } from '../../src/signals/index.ts';
import { buildEdf, timeKeeping, type EdfSpec, type SignalSpec } from './edf-builder.ts';
import { dataResolution } from '../../src/features/index.ts';

const ALL = { column: 1, start: 0, length: null } as const;

/** Physical value by the EDF scaling rule, Kemp et al. (1992) [S]: pmin + (d − dmin)(pmax − pmin)/(dmax − dmin). */
function physical(d: number, s: { pmin: number; pmax: number; dmin: number; dmax: number }): number {
  return s.pmin + ((d - s.dmin) * (s.pmax - s.pmin)) / (s.dmax - s.dmin);
}

function errorOf(run: () => unknown): InputError {
  try {
    run();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error('expected an InputError');
}

const eeg = (digital: (r: number, j: number) => number, extra: Partial<SignalSpec> = {}): SignalSpec => ({
  label: 'EEG Fpz-Cz',
  physicalMin: -500,
  physicalMax: 500,
  digitalMin: -32768,
  digitalMax: 32767,
  samplesPerRecord: 4,
  digital,
  ...extra,
});

describe('parseEdf: samples and scaling', () => {
  it('hand-computed physical values, one signal, several records', () => {
    // Range 0..1000 digital -> 0..100 physical: gain exactly 0.1, so physical = d/10 [D closed form].
    const spec: EdfSpec = {
      records: 3,
      recordDuration: 2,
      signals: [{ label: 'temp', physicalMin: 0, physicalMax: 100, digitalMin: 0, digitalMax: 1000, samplesPerRecord: 2, digital: (r, j) => [[0, 250], [500, 1000], [-10, 1]][r][j] }],
    };
    const s = parseEdf(buildEdf(spec), ALL, 'a.edf');
    expect(Array.from(s.values)).toEqual([0, 25, 50, 100, -1, 0.1]);
    expect(s.format).toBe('edf');
    expect(s.channel).toBe('temp');
    expect(s.sampleRate).toBe(1); // 2 samples per 2 s record [D]
    expect(s.totalSamples).toBe(6);
    expect(s.missing).toBe(0);
  });

  it('16-bit little-endian two\'s complement over the full range, checked by the scaling formula [S Kemp 1992; M byte order]', () => {
    const digits = [-32768, -32767, -1, 0, 1, 255, 256, 32767, -256, 12345, -12345, 7];
    const bytes = buildEdf({ records: 3, recordDuration: 1, signals: [eeg((r, j) => digits[4 * r + j])] });
    // Raw bytes of -1 and -32768 as written by the layout [D]: ff ff and 00 80.
    const dataStart = 256 + 256;
    expect(Array.from(bytes.subarray(dataStart, dataStart + 4))).toEqual([0x00, 0x80, 0x01, 0x80]);
    const s = parseEdf(bytes, ALL, 'b.edf');
    const range = { pmin: -500, pmax: 500, dmin: -32768, dmax: 32767 };
    digits.forEach((d, i) => expect(s.values[i]).toBeCloseTo(physical(d, range), 12));
    expect(s.values[0]).toBe(-500); // d = dmin gives pmin exactly [D]
    expect(s.values[7]).toBeCloseTo(500, 12); // d = dmax gives pmax [D]
    expect(s.sampleRate).toBe(4);
  });

  it('inverted physical range (pmax < pmin) follows the same formula [D]', () => {
    const s = parseEdf(buildEdf({ records: 1, recordDuration: 1, signals: [{ label: 'x', physicalMin: 10, physicalMax: -10, digitalMin: -100, digitalMax: 100, samplesPerRecord: 3, digital: (_r, j) => [-100, 0, 50][j] }] }), ALL, 'c.edf');
    expect(Array.from(s.values)).toEqual([10, 0, -5]);
  });

  it('several signals with different samples per record: record layout signal 1 then signal 2 [S Kemp 1992]', () => {
    const spec: EdfSpec = {
      records: 2,
      recordDuration: 0.5,
      signals: [
        eeg((r, j) => 100 * r + j),
        { label: 'Resp', physicalMin: 0, physicalMax: 10, digitalMin: 0, digitalMax: 10, samplesPerRecord: 2, digital: (r, j) => 7 + 2 * r + j },
      ],
    };
    const bytes = buildEdf(spec);
    const resp = parseEdf(bytes, { column: 2, start: 0, length: null }, 'd.edf');
    expect(Array.from(resp.values)).toEqual([7, 8, 9, 10]);
    expect(resp.sampleRate).toBe(4); // 2 samples / 0.5 s [D]
    const byLabel = parseEdf(bytes, { column: '  resp ', start: 0, length: null }, 'd.edf');
    expect(Array.from(byLabel.values)).toEqual([7, 8, 9, 10]);
    expect(byLabel.channel).toBe('Resp');
    const first = parseEdf(bytes, { column: 'eeg fpz-cz', start: 0, length: null }, 'd.edf');
    const range = { pmin: -500, pmax: 500, dmin: -32768, dmax: 32767 };
    expect(Array.from(first.values)).toEqual([0, 1, 2, 3, 100, 101, 102, 103].map((d) => physical(d, range)));
    expect(first.sampleRate).toBe(8);
  });

  it('start/length select across record boundaries', () => {
    const bytes = buildEdf({ records: 3, recordDuration: 1, signals: [{ label: 'n', physicalMin: 0, physicalMax: 100, digitalMin: 0, digitalMax: 100, samplesPerRecord: 4, digital: (r, j) => 4 * r + j }] });
    const s = parseEdf(bytes, { column: 'n', start: 3, length: 6 }, 'e.edf');
    expect(Array.from(s.values)).toEqual([3, 4, 5, 6, 7, 8]);
    expect(s.totalSamples).toBe(12);
    expect(dataResolution(s.values)).toBe(1);
  });

  it('parseRecording recognises EDF by its version field', () => {
    const bytes = buildEdf({ records: 1, recordDuration: 1, signals: [eeg(() => 0)] });
    expect(parseRecording(bytes, ALL, 'f.edf').format).toBe('edf');
  });
});

describe('parseEdf: EDF+ and the annotation signal', () => {
  const annotations = (onsets: string[]): SignalSpec => ({
    label: 'EDF Annotations',
    physicalMin: -1,
    physicalMax: 1,
    digitalMin: -32768,
    digitalMax: 32767,
    samplesPerRecord: 8,
    annotations: (r) => timeKeeping(onsets[r]),
  });
  const plus = (reserved: string, onsets: string[]): Uint8Array =>
    buildEdf({
      reserved,
      records: onsets.length,
      recordDuration: 1,
      signals: [annotations(onsets), { label: 'ECG', physicalMin: 0, physicalMax: 1000, digitalMin: 0, digitalMax: 1000, samplesPerRecord: 4, digital: (r, j) => 10 * r + j }],
    });

  it('EDF+C: the annotation signal is skipped in numbering; format edf+', () => {
    const s = parseEdf(plus('EDF+C', ['+0', '+1', '+2']), ALL, 'p.edf');
    expect(s.format).toBe('edf+');
    expect(s.channel).toBe('ECG');
    expect(Array.from(s.values)).toEqual([0, 1, 2, 3, 10, 11, 12, 13, 20, 21, 22, 23]);
  });

  it('selecting the annotation signal by label is an error; numbers past the ordinary signals list the labels', () => {
    const bytes = plus('EDF+C', ['+0']);
    expect(errorOf(() => parseEdf(bytes, { column: 'edf annotations', start: 0, length: null }, 'p.edf')).message).toBe(
      'p.edf: "EDF Annotations" holds annotations (text), not samples — choose a signal; available signals: 1 "ECG"',
    );
    expect(errorOf(() => parseEdf(bytes, { column: 2, start: 0, length: null }, 'p.edf')).message).toBe(
      'p.edf: there is no signal number 2 (the file has 1, not counting "EDF Annotations") — available signals: 1 "ECG"',
    );
  });

  it('EDF+D: records that follow on are joined; a gap of whole samples becomes NaN (our rule)', () => {
    const joined = parseEdf(plus('EDF+D', ['+0', '+1.0', '+2']), ALL, 'd.edf');
    expect(joined.missing).toBe(0);
    expect(joined.values.length).toBe(12);
    // Gap: record 3 starts at 3.5 s, record 2 ended at 2 s -> 1.5 s at 4 Hz = 6 samples [D].
    const gapped = parseEdf(plus('EDF+D', ['+0', '+1', '+3.5']), ALL, 'd.edf');
    expect(Array.from(gapped.values)).toEqual([0, 1, 2, 3, 10, 11, 12, 13, NaN, NaN, NaN, NaN, NaN, NaN, 20, 21, 22, 23]);
    expect(gapped.missing).toBe(6);
    expect(gapped.totalSamples).toBe(18);
  });

  it('EDF+D: a gap that is not whole samples, or overlapping records, is an error', () => {
    expect(errorOf(() => parseEdf(plus('EDF+D', ['+0', '+1.1']), ALL, 'd.edf')).message).toBe(
      'd.edf: EDF+D gap of 0.1 s before data record 2 is 0.400 sample periods, not a whole number, so it cannot be filled with missing samples — split the recording at the gap',
    );
    expect(errorOf(() => parseEdf(plus('EDF+D', ['+0', '+0.5']), ALL, 'd.edf')).message).toMatch(
      /^d\.edf: EDF\+D data record 2 starts 0\.5 s before record 1 ends \(records overlap or are out of order\)/,
    );
  });

  it('EDF+D: a record without a time-keeping onset is an error', () => {
    const bytes = buildEdf({
      reserved: 'EDF+D',
      records: 2,
      recordDuration: 1,
      signals: [{ ...annotations([]), annotations: (r) => (r === 0 ? timeKeeping('+0') : 'oops\x14\x14\x00') }, eeg(() => 0)],
    });
    expect(errorOf(() => parseEdf(bytes, ALL, 'd.edf')).message).toBe(
      'd.edf: data record 2 has no time-keeping annotation (found "oops" at the start of "EDF Annotations") — EDF+D needs one onset per record; repair the file with the recording software',
    );
  });
});

describe('parseEdf: header errors name the field', () => {
  const good: EdfSpec = { records: 2, recordDuration: 1, signals: [eeg(() => 0)] };

  it('truncated main header and truncated signal headers', () => {
    const bytes = buildEdf(good);
    expect(errorOf(() => parseEdf(bytes.subarray(0, 200), ALL, 't.edf')).message).toBe(
      't.edf: truncated header — the file has 200 bytes, but the EDF main header alone takes 256; the file is cut short or not EDF',
    );
    expect(errorOf(() => parseEdf(bytes.subarray(0, 300), ALL, 't.edf')).message).toBe(
      't.edf: truncated header — 1 signals need 512 header bytes, but the file has 300; the file is cut short',
    );
  });

  it('header bytes field different from 256 + 256·ns', () => {
    expect(errorOf(() => parseEdf(buildEdf({ ...good, override: { headerBytes: '768' } }), ALL, 'h.edf')).message).toBe(
      'h.edf: header field "header bytes" says 768, but 256 + 256 × 1 signals = 512 — the header is damaged; repair that field',
    );
  });

  it('number of data records -1 (unknown)', () => {
    expect(errorOf(() => parseEdf(buildEdf({ ...good, override: { records: '-1' } }), ALL, 'u.edf')).message).toBe(
      'u.edf: header field "number of data records" is -1 (unknown: the recording was not closed properly) — the file holds 2; write 2 into that field',
    );
  });

  it('wrong record count: more records stated than held, and a partial record', () => {
    expect(errorOf(() => parseEdf(buildEdf({ ...good, records: 3, recordsWritten: 2 }), ALL, 'w.edf')).message).toBe(
      'w.edf: wrong record count: header says 3, file holds 2 (header field "number of data records", 8 bytes per record) — the file is cut short or the header is wrong',
    );
    expect(errorOf(() => parseEdf(buildEdf({ ...good, trailingBytes: 3 }), ALL, 'w.edf')).message).toBe(
      'w.edf: wrong record count: header says 2, file holds 2 plus 3 bytes of a partial record (header field "number of data records", 8 bytes per record) — the file is cut short or the header is wrong',
    );
  });

  it('non-numeric header fields', () => {
    expect(errorOf(() => parseEdf(buildEdf({ ...good, override: { signals: 'ab' } }), ALL, 'n.edf')).message).toBe(
      'n.edf: header field "number of signals" holds "ab", not a whole number — the header is damaged or the file is not EDF',
    );
    expect(errorOf(() => parseEdf(buildEdf({ ...good, recordDuration: 'one' }), ALL, 'n.edf')).message).toBe(
      'n.edf: header field "record duration" holds "one", not a number — the header is damaged or the file is not EDF',
    );
    expect(errorOf(() => parseEdf(buildEdf({ ...good, signals: [eeg(() => 0, { physicalMin: '-5OO' })] }), ALL, 'n.edf')).message).toBe(
      'n.edf: signal 1 ("EEG Fpz-Cz") header field "physical minimum" holds "-5OO", not a number — the header is damaged or the file is not EDF',
    );
    expect(errorOf(() => parseEdf(buildEdf({ ...good, signals: [eeg(() => 0, { digitalMax: '3.5' })] }), ALL, 'n.edf')).message).toBe(
      'n.edf: signal 1 ("EEG Fpz-Cz") header field "digital maximum" holds "3.5", not a whole number — the header is damaged or the file is not EDF',
    );
  });

  it('digital maximum equal to digital minimum', () => {
    expect(errorOf(() => parseEdf(buildEdf({ ...good, signals: [eeg(() => 0, { digitalMin: 5, digitalMax: 5 })] }), ALL, 'z.edf')).message).toBe(
      'z.edf: signal "EEG Fpz-Cz" has header field "digital maximum" equal to "digital minimum" (5), so its values cannot be scaled — the header is damaged; repair those fields',
    );
  });

  it('a label that is not there lists the labels', () => {
    const bytes = buildEdf({ ...good, signals: [eeg(() => 0), eeg(() => 0, { label: 'EOG' })] });
    expect(errorOf(() => parseEdf(bytes, { column: 'EMG', start: 0, length: null }, 'l.edf')).message).toBe(
      'l.edf: no signal labelled "EMG" — available signals: 1 "EEG Fpz-Cz", 2 "EOG"',
    );
  });

  it('a label on two signals asks for a number', () => {
    const bytes = buildEdf({ ...good, signals: [eeg(() => 0), eeg(() => 0)] });
    expect(errorOf(() => parseEdf(bytes, { column: 'EEG Fpz-Cz', start: 0, length: null }, 'l.edf')).message).toBe(
      'l.edf: the label "EEG Fpz-Cz" names signals 1 and 2 — choose one by number',
    );
  });

  it('not EDF at all', () => {
    expect(errorOf(() => parseEdf(new TextEncoder().encode('1,2,3\n'), ALL, 'x.csv')).message).toBe(
      'x.csv: not an EDF file — the first 8 bytes are not the version field "0" padded with spaces',
    );
  });

  it('parseEdfHeader reads the fields at their published offsets', () => {
    const h = parseEdfHeader(buildEdf({ ...good, reserved: 'EDF+C', recordDuration: '0.25' }), 'h.edf');
    expect(h.headerBytes).toBe(512);
    expect(h.reserved).toBe('EDF+C');
    expect(h.dataRecords).toBe(2);
    expect(h.recordDuration).toBe(0.25);
    expect(h.recordBytes).toBe(8);
    expect(h.signals[0]).toMatchObject({ label: 'EEG Fpz-Cz', physicalMin: -500, physicalMax: 500, digitalMin: -32768, digitalMax: 32767, samplesPerRecord: 4, offsetInRecord: 0, isAnnotations: false });
  });
});
