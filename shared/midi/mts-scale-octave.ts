import { fail, fieldError, type FieldError, type Result, succeed } from '../result';
import { centsFromEqualTempered, noteName } from '../tuning/twelve-edo';
import type { KeyPitch } from './frequency-word';
import { endOfExclusive, systemExclusive } from './midi-bytes';
import {
  type DecodedTuning,
  type EncodedMessages,
  framingFault,
  keyCount,
  mtsForm,
  tuningSubId,
  universalNonRealTime,
  universalRealTime,
} from './mts-message';

/**
 * Scale/octave tuning: one offset from equal temperament per note name C to B, the same in every
 * octave, on the chosen channels. 1-byte form `F0 7F|7E dev 08 08 ff gg hh ss x12 F7` (whole cents
 * -64..+63), 2-byte form `F0 7F|7E dev 08 09 ff gg hh (ss tt)x12 F7` (-100..+99.988 cents in steps
 * of 100/8192).
 */

const pitchClasses = 12;
const octaveCents = 1200;
const concertA = 440;

/**
 * The offsets of a tuning that repeats every 12 keys and every 2/1: C first, null where no key is
 * mapped.
 */
export type OctaveOffsets = (number | null)[];

/**
 * The offset of each note name, or a refusal saying why the tuning cannot be written this way:
 * scale/octave tuning repeats one octave of 12 keys, so the layout must have 12 keys per period and
 * the period must be 2/1.
 */
export function octaveOffsets(
  keys: readonly KeyPitch[],
  layout: { keysPerPeriod: number; periodCents: number },
): Result<OctaveOffsets> {
  const faults: FieldError[] = [];
  if (layout.keysPerPeriod !== pitchClasses) {
    faults.push(
      fieldError(
        'mapping.keysPerPeriod',
        `this layout repeats every ${layout.keysPerPeriod} keys, and scale/octave tuning needs 12 keys an ` +
          'octave: send a bulk dump or single-note changes instead',
      ),
    );
  }
  if (Math.abs(layout.periodCents - octaveCents) > 1e-9) {
    faults.push(
      fieldError(
        'scale.period',
        `this scale repeats every ${layout.periodCents.toFixed(3)} cents, and scale/octave tuning needs an ` +
          'octave (2/1, 1200 cents): send a bulk dump or single-note changes instead',
      ),
    );
  }
  if (faults.length > 0) return fail(faults);
  const offsets: OctaveOffsets = new Array(pitchClasses).fill(null);
  for (const { key, hz } of keys) {
    if (hz !== null && offsets[key % pitchClasses] === null) {
      offsets[key % pitchClasses] = centsFromEqualTempered(hz, key, concertA);
    }
  }
  return succeed(offsets);
}

/**
 * The channel bitmap `ff gg hh`: ff bits 0-1 channels 15-16, gg bits 0-6 channels 8-14, hh bits 0-6
 * channels 1-7.
 */
function channelBitmap(channels: readonly number[]): [number, number, number] {
  let bits = 0;
  for (const channel of channels) if (channel >= 1 && channel <= 16) bits |= 1 << (channel - 1);
  return [(bits >> 14) & 0x03, (bits >> 7) & 0x7f, bits & 0x7f];
}

function channelsOfBitmap(ff: number, gg: number, hh: number): number[] {
  const bits = ((ff & 0x03) << 14) | (gg << 7) | hh;
  const channels = Array.from({ length: 16 }, (_, index) => index + 1);
  return channels.filter((channel) => bits & (1 << (channel - 1)));
}

export interface ScaleOctaveTarget {
  deviceId: number;
  /** Channels 1-16 to retune. */
  channels: readonly number[];
  realTime: boolean;
}

const oneByteForm = {
  name: 'scale/octave tuning, 1-byte form (08 08)',
  subId: mtsForm.scaleOctave1,
  bytesPerOffset: 1,
  lowestCents: -64,
  highestCents: 63,
};
const twoByteForm = {
  name: 'scale/octave tuning, 2-byte form (08 09)',
  subId: mtsForm.scaleOctave2,
  bytesPerOffset: 2,
  lowestCents: -100,
  highestCents: 100 - 100 / 8192,
};
type OctaveForm = typeof oneByteForm | typeof twoByteForm;

/**
 * The one rounding step of each form: whole cents, or the nearest 100/8192 of a cent, as a value to
 * send.
 */
function offsetValue(form: OctaveForm, cents: number): number {
  return form === oneByteForm ? Math.round(cents) + 64 : Math.round(((cents + 100) * 8192) / 100);
}

/** Note names without octave: C, C#, ... B. */
function noteNames(classes: number[]): string {
  return classes.map((pitchClass) => noteName(12 + pitchClass).slice(0, -1)).join(', ');
}

function encodeOctave(
  form: OctaveForm,
  offsets: OctaveOffsets,
  target: ScaleOctaveTarget,
): EncodedMessages {
  const message = new Uint8Array(9 + pitchClasses * form.bytesPerOffset);
  const universal = target.realTime ? universalRealTime : universalNonRealTime;
  const channels = channelBitmap(target.channels);
  message.set([systemExclusive, universal, target.deviceId, tuningSubId, form.subId, ...channels]);
  const clamped: number[] = [];
  const unmapped: number[] = [];
  offsets.forEach((offset, pitchClass) => {
    if (offset === null) unmapped.push(pitchClass);
    const cents = Math.min(form.highestCents, Math.max(form.lowestCents, offset ?? 0));
    if (offset !== null && cents !== offset) clamped.push(pitchClass);
    const value = offsetValue(form, cents);
    if (form === oneByteForm) message[8 + pitchClass] = value;
    else message.set([value >> 7, value & 0x7f], 8 + 2 * pitchClass);
  });
  message[message.length - 1] = endOfExclusive;
  const warnings: FieldError[] = [];
  if (clamped.length > 0) {
    const range = `${form.lowestCents} to +${form.highestCents.toFixed(3)} cents`;
    warnings.push(
      fieldError(
        'mapping',
        `${noteNames(clamped)} lie further from equal temperament than the ${range} ` +
          `of the ${form.name}; sent as the nearest end`,
      ),
    );
  }
  if (unmapped.length > 0) {
    const fault = `${noteNames(unmapped)} have no mapped key; sent in equal temperament`;
    warnings.push(fieldError('mapping', fault));
  }
  return { messages: [message], warnings };
}

/** The 1-byte form (08 08): offsets in whole cents, -64 to +63. */
export function encodeScaleOctave1(
  offsets: OctaveOffsets,
  target: ScaleOctaveTarget,
): EncodedMessages {
  return encodeOctave(oneByteForm, offsets, target);
}

/** The 2-byte form (08 09): offsets from -100 to +99.988 cents in steps of 0.0122 cents. */
export function encodeScaleOctave2(
  offsets: OctaveOffsets,
  target: ScaleOctaveTarget,
): EncodedMessages {
  return encodeOctave(twoByteForm, offsets, target);
}

/**
 * Reads either scale/octave form into a 128-key table, each key its equal-tempered pitch (A4 = 440
 * Hz) moved by its offset.
 */
export function decodeScaleOctave(message: Uint8Array): Result<DecodedTuning> {
  const form = message[4] === mtsForm.scaleOctave2 ? twoByteForm : oneByteForm;
  const framing = framingFault(message, 9 + pitchClasses * form.bytesPerOffset, form.name);
  if (framing) return fail([framing]);
  const offsetsCents = Array.from({ length: pitchClasses }, (_, pitchClass) =>
    form === oneByteForm
      ? message[8 + pitchClass] - 64
      : (((message[8 + 2 * pitchClass] << 7) | message[9 + 2 * pitchClass]) - 8192) * (100 / 8192),
  );
  const keys = Array.from({ length: keyCount }, (_, key) => ({
    key,
    hz: concertA * 2 ** ((key - 69) / 12 + offsetsCents[key % pitchClasses] / octaveCents),
  }));
  return succeed({
    kind: form === oneByteForm ? 'scale-octave-1' : 'scale-octave-2',
    deviceId: message[2],
    realTime: message[1] === universalRealTime,
    bank: null,
    program: null,
    name: null,
    channels: channelsOfBitmap(message[5], message[6], message[7]),
    keys,
  });
}
