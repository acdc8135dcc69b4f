// The status bytes of MIDI 1.0 messages, the meta events of Standard MIDI Files, and how many data
// bytes a channel message carries (MIDI 1.0 Detailed Specification, "Summary of MIDI Messages";
// SMF 1.0, "Meta-Events").

/** Channel messages: the status byte's high nibble; the low nibble is the channel (0-15). */
export const noteOff = 0x80;
export const noteOn = 0x90;
export const polyPressure = 0xa0;
export const controlChange = 0xb0;
export const programChange = 0xc0;
export const channelPressure = 0xd0;
export const pitchBend = 0xe0;

/** System exclusive: F0, the data, F7. Also the first status byte that is no channel message. */
export const systemExclusive = 0xf0;
export const endOfExclusive = 0xf7;

/** A meta event in a Standard MIDI File: FF, its type, a variable-length length, the data. */
export const metaEvent = 0xff;
export const textMeta = 0x01;
export const trackNameMeta = 0x03;
export const endOfTrackMeta = 0x2f;
/** Microseconds per quarter note, 3 bytes. */
export const tempoMeta = 0x51;

/** A channel message's kind: its status byte without the channel. */
export function messageKind(status: number): number {
  return status & 0xf0;
}

/** The data bytes of a channel message: one for program change and channel pressure, else two. */
export function dataLengthOf(status: number): 1 | 2 {
  const kind = messageKind(status);
  return kind === programChange || kind === channelPressure ? 1 : 2;
}
