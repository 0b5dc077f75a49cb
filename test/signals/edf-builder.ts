/**
 * Test helper: writes EDF/EDF+ files byte by byte from the published layout (Kemp et al.
 * 1992, Electroencephalogr. Clin. Neurophysiol. 82, 391; Kemp & Olivan 2003, Clin.
 * Neurophysiol. 114, 1755; field widths as in /work/shared/REFERENCES.md "Data formats").
 * Independent of the reader: no code shared with src/signals.
 */

export interface SignalSpec {
  label: string;
  physicalMin: number | string;
  physicalMax: number | string;
  digitalMin: number | string;
  digitalMax: number | string;
  samplesPerRecord: number | string;
  /** Digital sample j of record r (ordinary signals). */
  digital?: (record: number, j: number) => number;
  /** Annotation text of record r (the "EDF Annotations" signal), padded with NUL bytes. */
  annotations?: (record: number) => string;
}

export interface EdfSpec {
  /** The 44-byte reserved field: "EDF+C", "EDF+D" or "" for plain EDF. */
  reserved?: string;
  records: number;
  recordDuration: number | string;
  signals: SignalSpec[];
  /** Raw text for main-header fields, replacing the computed one (to build damaged files). */
  override?: Partial<Record<'headerBytes' | 'records' | 'signals' | 'version', string>>;
  /** Records actually written (default: `records`), to build files that disagree with their header. */
  recordsWritten?: number;
  /** Extra bytes appended after the last record. */
  trailingBytes?: number;
}

/** A field of `width` bytes: ASCII text padded with spaces on the right. */
export function field(text: string | number, width: number): string {
  const s = String(text);
  if (s.length > width) throw new Error(`test helper: "${s}" does not fit ${width} bytes`);
  return s.padEnd(width, ' ');
}

export function buildEdf(spec: EdfSpec): Uint8Array {
  const ns = spec.signals.length;
  const o = spec.override ?? {};
  let header = '';
  header += field(o.version ?? '0', 8);
  header += field('X X X X', 80);
  header += field('Startdate 01-JAN-2024 X X X', 80);
  header += field('01.01.24', 8);
  header += field('10.00.00', 8);
  header += field(o.headerBytes ?? 256 + 256 * ns, 8);
  header += field(spec.reserved ?? '', 44);
  header += field(o.records ?? spec.records, 8);
  header += field(spec.recordDuration, 8);
  header += field(o.signals ?? ns, 4);
  const perSignal: [(s: SignalSpec) => string | number, number][] = [
    [(s) => s.label, 16],
    [() => '', 80],
    [(s) => (s.annotations ? '' : 'uV'), 8],
    [(s) => s.physicalMin, 8],
    [(s) => s.physicalMax, 8],
    [(s) => s.digitalMin, 8],
    [(s) => s.digitalMax, 8],
    [() => '', 80],
    [(s) => s.samplesPerRecord, 8],
    [() => '', 32],
  ];
  for (const [get, width] of perSignal) for (const s of spec.signals) header += field(get(s), width);
  const headerBytes = Uint8Array.from(header, (c) => c.charCodeAt(0));
  const written = spec.recordsWritten ?? spec.records;
  const recordBytes = spec.signals.reduce((sum, s) => sum + 2 * Number(s.samplesPerRecord), 0);
  const out = new Uint8Array(headerBytes.length + written * recordBytes + (spec.trailingBytes ?? 0));
  out.set(headerBytes);
  const view = new DataView(out.buffer);
  let at = headerBytes.length;
  for (let r = 0; r < written; r++) {
    for (const s of spec.signals) {
      const n = Number(s.samplesPerRecord);
      if (s.annotations) {
        const text = s.annotations(r);
        for (let i = 0; i < text.length; i++) out[at + i] = text.charCodeAt(i);
      } else {
        for (let j = 0; j < n; j++) view.setInt16(at + 2 * j, s.digital ? s.digital(r, j) : 0, true);
      }
      at += 2 * n;
    }
  }
  return out;
}

/** Time-keeping TAL of EDF+: `+onset` 0x14 0x14 0x00 (Kemp & Olivan 2003) [M for the exact bytes]. */
export function timeKeeping(onset: string): string {
  return `${onset}\x14\x14\x00`;
}
