import { InputError } from '../shared/errors.ts';
import { quoteFound } from './quote-found.ts';

/** Size of the EDF main header, and of each signal's share of the signal headers (Kemp et al. 1992). */
export const EDF_MAIN_HEADER_BYTES = 256;
export const EDF_SIGNAL_HEADER_BYTES = 256;

/** Label of the EDF+ signal that holds annotations instead of samples (Kemp & Olivan 2003). */
export const EDF_ANNOTATIONS_LABEL = 'EDF Annotations';

/** One signal's header, numbers parsed. */
export interface EdfSignalHeader {
  /** 1-based position among all signals in the file (annotations included). */
  position: number;
  /** Label, trailing/leading spaces removed. */
  label: string;
  physicalMin: number;
  physicalMax: number;
  digitalMin: number;
  digitalMax: number;
  samplesPerRecord: number;
  /** Byte offset of this signal's samples inside one data record. */
  offsetInRecord: number;
  isAnnotations: boolean;
}

/** The parsed EDF/EDF+ header. */
export interface EdfHeader {
  headerBytes: number;
  /** The 44-byte reserved field, trimmed ("EDF+C", "EDF+D" or anything for plain EDF). */
  reserved: string;
  dataRecords: number;
  recordDuration: number;
  signals: EdfSignalHeader[];
  /** Bytes of one data record: 2 × the sum of samples per record. */
  recordBytes: number;
}

/** Field layout of the main header: name, width in bytes, in file order (Kemp et al. 1992). */
const MAIN_FIELDS = [
  ['version', 8],
  ['patient', 80],
  ['recording', 80],
  ['start date', 8],
  ['start time', 8],
  ['header bytes', 8],
  ['reserved', 44],
  ['number of data records', 8],
  ['record duration', 8],
  ['number of signals', 4],
] as const;
type MainField = (typeof MAIN_FIELDS)[number][0];

/** Field layout of the signal headers: each field is stored for all signals in turn. */
const SIGNAL_FIELDS = [
  ['label', 16],
  ['transducer', 80],
  ['physical dimension', 8],
  ['physical minimum', 8],
  ['physical maximum', 8],
  ['digital minimum', 8],
  ['digital maximum', 8],
  ['prefiltering', 80],
  ['samples per record', 8],
  ['reserved', 32],
] as const;
type SignalField = (typeof SIGNAL_FIELDS)[number][0];

const WHOLE = /^[+-]?\d+$/;
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Reads `width` bytes at `offset` as ASCII (bytes above 127 kept as Latin-1), trimmed. */
function asciiField(bytes: Uint8Array, offset: number, width: number): string {
  let s = '';
  for (let i = offset; i < offset + width; i++) s += String.fromCharCode(bytes[i]);
  return s.trim();
}

/**
 * Parses the EDF/EDF+ header: the 256-byte main header and the ns × 256 bytes of signal
 * headers, all space-padded ASCII (Kemp et al. 1992, Electroencephalogr. Clin.
 * Neurophysiol. 82, 391; EDF+: Kemp & Olivan 2003, Clin. Neurophysiol. 114, 1755).
 * Checks the header against the file size, so the data records can be read without
 * further bounds checks.
 *
 * @throws InputError naming the file and the header field, for: a truncated header; a
 *   non-numeric number field; header bytes other than 256 + 256·ns; number of data
 *   records −1 (unknown) or different from what the file holds ("wrong record count:
 *   header says N, file holds M").
 * @example parseEdfHeader(bytes, 'rec.edf').signals[0].label // e.g. 'EEG Fpz-Cz'
 */
export function parseEdfHeader(bytes: Uint8Array, fileLabel: string): EdfHeader {
  if (bytes.length < EDF_MAIN_HEADER_BYTES) {
    throw new InputError(`${fileLabel}: truncated header — the file has ${bytes.length} bytes, but the EDF main header alone takes 256; the file is cut short or not EDF`);
  }
  const main = readMainFields(bytes);
  const whole = (field: MainField): number => wholeNumber(main.get(field) ?? '', `header field "${field}"`, fileLabel);
  const ns = whole('number of signals');
  if (ns < 1) throw new InputError(`${fileLabel}: header field "number of signals" is ${ns} — an EDF file needs at least one signal`);
  const expectedHeaderBytes = EDF_MAIN_HEADER_BYTES + EDF_SIGNAL_HEADER_BYTES * ns;
  if (bytes.length < expectedHeaderBytes) {
    throw new InputError(`${fileLabel}: truncated header — ${ns} signals need ${expectedHeaderBytes} header bytes, but the file has ${bytes.length}; the file is cut short`);
  }
  const headerBytes = whole('header bytes');
  if (headerBytes !== expectedHeaderBytes) {
    throw new InputError(`${fileLabel}: header field "header bytes" says ${headerBytes}, but 256 + 256 × ${ns} signals = ${expectedHeaderBytes} — the header is damaged; repair that field`);
  }
  const signals = readSignalHeaders(bytes, ns, fileLabel);
  const recordBytes = 2 * signals.reduce((sum, s) => sum + s.samplesPerRecord, 0);
  const dataRecords = checkedRecordCount(whole('number of data records'), bytes.length - headerBytes, recordBytes, fileLabel);
  const recordDuration = decimalNumber(main.get('record duration') ?? '', 'header field "record duration"', fileLabel);
  if (recordDuration < 0) throw new InputError(`${fileLabel}: header field "record duration" is ${recordDuration} — it must be >= 0 seconds`);
  return { headerBytes, reserved: main.get('reserved') ?? '', dataRecords, recordDuration, signals, recordBytes };
}

function readMainFields(bytes: Uint8Array): Map<MainField, string> {
  const fields = new Map<MainField, string>();
  let offset = 0;
  for (const [name, width] of MAIN_FIELDS) {
    fields.set(name, asciiField(bytes, offset, width));
    offset += width;
  }
  return fields;
}

function readSignalHeaders(bytes: Uint8Array, ns: number, fileLabel: string): EdfSignalHeader[] {
  const columns = new Map<SignalField, string[]>();
  let offset = EDF_MAIN_HEADER_BYTES;
  for (const [name, width] of SIGNAL_FIELDS) {
    const values: string[] = [];
    for (let k = 0; k < ns; k++) values.push(asciiField(bytes, offset + k * width, width));
    columns.set(name, values);
    offset += width * ns;
  }
  const text = (field: SignalField, k: number): string => columns.get(field)?.[k] ?? '';
  const signals: EdfSignalHeader[] = [];
  let offsetInRecord = 0;
  for (let k = 0; k < ns; k++) {
    const label = text('label', k);
    const named = (field: SignalField): string => `signal ${k + 1} (${quoteFound(label)}) header field "${field}"`;
    const samplesPerRecord = wholeNumber(text('samples per record', k), named('samples per record'), fileLabel);
    if (samplesPerRecord < 0) throw new InputError(`${fileLabel}: ${named('samples per record')} is ${samplesPerRecord} — it must be >= 0`);
    signals.push({
      position: k + 1,
      label,
      physicalMin: decimalNumber(text('physical minimum', k), named('physical minimum'), fileLabel),
      physicalMax: decimalNumber(text('physical maximum', k), named('physical maximum'), fileLabel),
      digitalMin: wholeNumber(text('digital minimum', k), named('digital minimum'), fileLabel),
      digitalMax: wholeNumber(text('digital maximum', k), named('digital maximum'), fileLabel),
      samplesPerRecord,
      offsetInRecord,
      isAnnotations: label.toLowerCase() === EDF_ANNOTATIONS_LABEL.toLowerCase(),
    });
    offsetInRecord += 2 * samplesPerRecord;
  }
  return signals;
}

function checkedRecordCount(stated: number, dataBytes: number, recordBytes: number, fileLabel: string): number {
  if (recordBytes === 0) throw new InputError(`${fileLabel}: every signal has 0 samples per record — the file holds no samples`);
  const held = Math.floor(dataBytes / recordBytes);
  const partial = dataBytes - held * recordBytes;
  if (stated === -1) {
    throw new InputError(`${fileLabel}: header field "number of data records" is -1 (unknown: the recording was not closed properly) — the file holds ${held}${partial ? ` plus ${partial} bytes of a partial record` : ''}; write ${held} into that field`);
  }
  if (stated !== held || partial !== 0) {
    throw new InputError(`${fileLabel}: wrong record count: header says ${stated}, file holds ${held}${partial ? ` plus ${partial} bytes of a partial record` : ''} (header field "number of data records", ${recordBytes} bytes per record) — the file is cut short or the header is wrong`);
  }
  return held;
}

function wholeNumber(text: string, field: string, fileLabel: string): number {
  if (!WHOLE.test(text)) throw new InputError(`${fileLabel}: ${field} holds ${quoteFound(text)}, not a whole number — the header is damaged or the file is not EDF`);
  return Number(text);
}

function decimalNumber(text: string, field: string, fileLabel: string): number {
  if (!DECIMAL.test(text)) throw new InputError(`${fileLabel}: ${field} holds ${quoteFound(text)}, not a number — the header is damaged or the file is not EDF`);
  return Number(text);
}
