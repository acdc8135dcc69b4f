import { type FieldError, fieldError } from '../result';
import { bendRangeMessages, mpeConfigurationMessages } from './registered-parameters';

/**
 * MPE (MMA RP-053): a zone is a manager channel and the member channels next to it; each sounding
 * note gets a member channel of its own, so that its pitch bend bends it alone. Lower zone: manager
 * 1, members 2 upwards; upper zone: manager 16, members 15 downwards.
 */

export interface MpeZone {
  /**
   * 1 for a lower zone, 16 for an upper zone, null when the member channels leave no room for a
   * manager.
   */
  managerChannel: 1 | 16 | null;
  /** How many member channels the configuration message announces (counted from the manager). */
  memberCount: number;
  /** The member channels notes are played on (1-16, ascending). */
  memberChannels: number[];
  warnings: FieldError[];
}

/**
 * The zone that holds an inclusive range of member channels: a lower zone when channel 1 is free to
 * manage it, else an upper zone when channel 16 is free; with all 16 channels as members there is
 * no manager, and the notes are still spread one per channel (a receiver in multichannel mode plays
 * them the same way).
 */
export function mpeZoneOf(memberChannels: readonly [number, number]): MpeZone {
  const [first, last] = memberChannels;
  const channels = Array.from({ length: last - first + 1 }, (_, index) => first + index);
  if (first >= 2) {
    return { managerChannel: 1, memberCount: last - 1, memberChannels: channels, warnings: [] };
  }
  if (last <= 15) {
    return { managerChannel: 16, memberCount: 16 - first, memberChannels: channels, warnings: [] };
  }
  return {
    managerChannel: null,
    memberCount: 16,
    memberChannels: channels,
    warnings: [
      fieldError(
        'output.memberChannels',
        'takes all 16 channels, leaving none to manage an MPE zone: no zone is configured, ' +
          'and each note still gets a channel of its own',
      ),
    ],
  };
}

/**
 * What an MPE file sends first: the zone configuration (RPN 6) on the manager channel, which resets
 * the members' bend range to 48 semitones, then the bend range (RPN 0) on every member channel.
 */
export function mpeSetupMessages(zone: MpeZone, bendRangeSemitones: number): number[][] {
  const configuration =
    zone.managerChannel === null
      ? []
      : mpeConfigurationMessages(zone.managerChannel, zone.memberCount);
  const bendRanges = zone.memberChannels.flatMap((channel) =>
    bendRangeMessages(channel, bendRangeSemitones),
  );
  return [...configuration, ...bendRanges];
}

/**
 * A note given a member channel; `stolen` is the note that had to be cut off to free it, if any.
 */
export interface ChannelGrant<Note> {
  channel: number;
  stolen: Note | null;
}

/**
 * Hands out member channels one note each: a free channel that has been silent longest first (its
 * release tail has had the most time to fade), and when every channel sounds, the channel of the
 * note that started first.
 */
export class MemberChannelAllocator<Note> {
  /** Free channels, the one released longest ago first. */
  private readonly free: number[];
  /** Sounding channels with their notes, the oldest note first. */
  private readonly sounding: { channel: number; note: Note }[] = [];

  constructor(channels: readonly number[]) {
    this.free = [...channels];
  }

  /** A channel for a new note. */
  start(note: Note): ChannelGrant<Note> {
    const freeChannel = this.free.shift();
    if (freeChannel !== undefined) {
      this.sounding.push({ channel: freeChannel, note });
      return { channel: freeChannel, stolen: null };
    }
    const oldest = this.sounding.shift();
    if (!oldest) throw new Error('a channel allocator needs at least one channel');
    this.sounding.push({ channel: oldest.channel, note });
    return { channel: oldest.channel, stolen: oldest.note };
  }

  /** Gives a channel back when its note ends; a channel that is not sounding is left as it is. */
  release(channel: number): void {
    const index = this.sounding.findIndex((entry) => entry.channel === channel);
    if (index < 0) return;
    this.sounding.splice(index, 1);
    this.free.push(channel);
  }
}
