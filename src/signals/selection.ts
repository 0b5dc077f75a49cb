import { InputError } from '../shared/errors.ts';
import type { Series, SignalFormat, SignalSelection } from './types.ts';

/** What a reader knows about a whole channel before the start/length selection. */
export interface ChannelSamples {
  samples: Float64Array;
  format: SignalFormat;
  channel: string;
  sampleRate: number | null;
  /** A caution about how the file was read (see Series.caution). */
  caution?: string | null;
}

/**
 * Cuts the selected run `samples[start, start + length)` out of a channel and describes it
 * as a {@link Series} (with its missing count). The returned values are a copy.
 *
 * Complexity O(k) for k selected samples.
 *
 * @throws InputError when start/length are not whole numbers in range, when the run reaches
 *   past the end of the channel, or when the channel holds no samples at all.
 * @example selectSeries({ samples: Float64Array.of(1, NaN, 4, 6), format: 'text', channel: 'x',
 *   sampleRate: null }, { column: 1, start: 1, length: 2 }, 'a.csv')
 *   // values [NaN, 4], missing 1, totalSamples 4
 */
export function selectSeries(channel: ChannelSamples, selection: SignalSelection, fileLabel: string): Series {
  const total = channel.samples.length;
  const where = `${fileLabel} (${channel.channel})`;
  if (total === 0) throw new InputError(`${where}: no samples — the channel is empty; check the file and the chosen column`);
  const { start, length } = checkedRange(selection, where);
  if (start >= total) {
    throw new InputError(`${where}: start ${start} skips past the end — the channel holds ${total} samples; use a start below ${total}`);
  }
  const end = length === null ? total : start + length;
  if (end > total) {
    throw new InputError(
      `${where}: start ${start} + length ${length} asks for samples up to ${end}, but the channel holds ${total} — ` +
        `lower start or length (at most ${total - start} after this start), or leave length out to keep all`,
    );
  }
  const values = channel.samples.slice(start, end);
  return {
    values,
    missing: countMissing(values),
    totalSamples: total,
    format: channel.format,
    channel: channel.channel,
    sampleRate: channel.sampleRate,
    caution: channel.caution ?? null,
  };
}

function checkedRange(selection: SignalSelection, where: string): { start: number; length: number | null } {
  const { start, length } = selection;
  if (!Number.isSafeInteger(start) || start < 0) {
    throw new InputError(`${where}: start must be a whole number >= 0, got ${String(start)} — give the samples to skip`);
  }
  if (length !== null && (!Number.isSafeInteger(length) || length < 1)) {
    throw new InputError(`${where}: length must be a whole number >= 1 or null (all), got ${String(length)} — give the samples to keep`);
  }
  return { start, length };
}

function countMissing(values: Float64Array): number {
  let n = 0;
  for (let i = 0; i < values.length; i++) if (Number.isNaN(values[i])) n++;
  return n;
}
