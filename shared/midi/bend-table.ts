import type { FieldError } from '../result';
import type { KeyPitch } from './frequency-word';
import { bendClampWarning, bendForPitch, bendStepCents } from './pitch-bend';
import { unreachableKeysWarning } from './unreachable-keys';

/**
 * A pitch-bend table: for every mapped key, the channel to play it on, the equal-tempered note to
 * send, the 14-bit bend for the bend range, and the error left in cents. For instruments without
 * MTS.
 */

export interface BendRow {
  key: number;
  hz: number;
  channel: number;
  note: number;
  bendValue14: number;
  residualCents: number;
}

/**
 * How channels are given out. When the distinct bends fit on the member channels, each bend value
 * keeps a channel of its own and the bends can be set once ("fixed"); otherwise keys take the
 * channels in turn, and the bend must be sent before each note ("rotating").
 */
export type ChannelAssignment = 'fixed' | 'rotating';

export interface BendTable {
  bendRangeSemitones: number;
  channelAssignment: ChannelAssignment;
  rows: BendRow[];
  warnings: FieldError[];
}

export function bendTable(
  keys: readonly KeyPitch[],
  output: { bendRange: number; memberChannels: readonly [number, number] },
): BendTable {
  const [first, last] = output.memberChannels;
  const channels = Array.from({ length: last - first + 1 }, (_, index) => first + index);
  const bent = keys
    .filter((entry): entry is { key: number; hz: number } => entry.hz !== null)
    .map((entry) => ({ ...entry, ...bendForPitch(entry.hz, output.bendRange) }));
  const channelOfBend = new Map<number, number>();
  for (const { bendValue14 } of bent) {
    if (!channelOfBend.has(bendValue14)) {
      channelOfBend.set(bendValue14, channels[channelOfBend.size % channels.length]);
    }
  }
  const channelAssignment: ChannelAssignment =
    channelOfBend.size <= channels.length ? 'fixed' : 'rotating';
  const rows = bent.map(({ key, hz, note, bendValue14, residualCents }, index) => ({
    key,
    hz,
    channel:
      channelAssignment === 'fixed'
        ? (channelOfBend.get(bendValue14) ?? first)
        : channels[index % channels.length],
    note,
    bendValue14,
    residualCents,
  }));
  const warnings = unreachableKeysWarning(
    bent.filter((entry) => entry.clamped).map((entry) => entry.key),
    `${bendClampWarning(output.bendRange)} (see residual cents)`,
  );
  return { bendRangeSemitones: output.bendRange, channelAssignment, rows, warnings };
}

/** The table as CSV, one row per mapped key. */
export function bendTableCsv(table: BendTable): string {
  const header = 'key,hz,channel,note,bend,residual_cents';
  const lines = table.rows.map((row) =>
    [
      row.key,
      row.hz.toFixed(6),
      row.channel,
      row.note,
      row.bendValue14,
      row.residualCents.toFixed(6),
    ].join(','),
  );
  return `${[header, ...lines].join('\r\n')}\r\n`;
}

/**
 * The table as JSON, with the bend range, the size of one bend step and how channels are given out.
 */
export function bendTableJson(table: BendTable): string {
  return `${JSON.stringify(
    {
      bendRangeSemitones: table.bendRangeSemitones,
      bendStepCents: bendStepCents(table.bendRangeSemitones),
      channelAssignment: table.channelAssignment,
      keys: table.rows.map((row) => ({
        key: row.key,
        hz: row.hz,
        channel: row.channel,
        note: row.note,
        bend: row.bendValue14,
        residualCents: row.residualCents,
      })),
    },
    null,
    2,
  )}\n`;
}
