import type { FieldError } from '../result';
import type { KeyPitch } from './frequency-word';
import { unreachableKeysWarning } from './unreachable-keys';
import { singleLine } from '../text/plain-text';

/**
 * An SFZ sampler map: one region per mapped key that shifts the nearest of the player's samples (each recorded at
 * its key's equal-tempered pitch; by default one placeholder of middle C) to the key's pitch. A region plays its
 * sample moved by (key - pitch_keycenter) semitones plus `tune` cents; `tune` holds whole cents, so each key sounds
 * within half a cent of the tuning.
 */

/** A sample and the key whose equal-tempered pitch it was recorded at. */
export interface SfzSample {
  file: string;
  key: number;
}

const placeholder: SfzSample = { file: 'middle-c.wav', key: 60 };
const keyOfA4 = 69;
const hzOfA4 = 440;
/** The widest fine tune SFZ 1.0 takes, in cents. */
const widestTuneCents = 100;

interface SfzRegion {
  key: number;
  sample: string;
  pitchKeycenter: number;
  tuneCents: number;
  clamped: boolean;
}

/**
 * The region of one key: the pitch centre that leaves the smallest fine tune, rounded once to whole
 * cents. When the centre would leave 0-127 the tune makes up what it can; a key beyond that is
 * clamped and flagged.
 */
function regionOf(key: number, hz: number, samples: readonly SfzSample[]): SfzRegion {
  const centsFromA4 = 1200 * Math.log2(hz / hzOfA4);
  // The sample recorded nearest the key's pitch: the least stretch, the most natural sound.
  const sample = samples.reduce((best, candidate) =>
    Math.abs(centsFromA4 - 100 * (candidate.key - keyOfA4)) <
    Math.abs(centsFromA4 - 100 * (best.key - keyOfA4))
      ? candidate
      : best,
  );
  const centsFromSample = centsFromA4 - 100 * (sample.key - keyOfA4);
  const idealCentre = key - Math.round(centsFromSample / 100);
  const pitchKeycenter = Math.min(127, Math.max(0, idealCentre));
  const wantedTune = Math.round(centsFromSample - 100 * (key - pitchKeycenter));
  const tuneCents = Math.min(widestTuneCents, Math.max(-widestTuneCents, wantedTune));
  return { key, sample: sample.file, pitchKeycenter, tuneCents, clamped: tuneCents !== wantedTune };
}

export interface SfzMap {
  text: string;
  warnings: FieldError[];
}

/**
 * The map of every mapped key, with comments saying what to replace and how precise the tuning is.
 */
export function sfzMap(
  keys: readonly KeyPitch[],
  about: { name: string; samples?: readonly SfzSample[] },
): SfzMap {
  const samples = about.samples?.length ? about.samples : [placeholder];
  const placed = keys.flatMap(({ key, hz }) => (hz === null ? [] : [regionOf(key, hz, samples)]));
  const comment = (line: string) => `// ${singleLine(line)}`;
  const named = about.samples?.length
    ? [
        comment(
          `Samples, each recorded at its key's equal-tempered pitch (A4 = 440 Hz): ${samples.map((s) => `${s.file} at key ${s.key}`).join(', ')}.`,
        ),
        comment(
          'Each key plays the sample nearest its pitch, moved by (key - pitch_keycenter) semitones plus tune cents.',
        ),
      ]
    : [
        comment(`Replace ${placeholder.file} with your own sample of middle C`),
        comment('(key 60, 261.6256 Hz at A4 = 440 Hz); each region moves it to its key:'),
        comment('(key - pitch_keycenter) semitones plus tune cents.'),
      ];
  const lines = [
    comment(`Keyloom sampler map: ${about.name}`),
    ...named,
    comment(
      'Precision: tune holds whole cents, so every key sounds within 0.5 cent of the tuning.',
    ),
    '',
    '<group>',
    // One sample serves the whole group; several are named region by region.
    samples.length === 1 ? `sample=${samples[0].file} pitch_keytrack=100` : 'pitch_keytrack=100',
    '',
    ...placed.map(({ key, sample, pitchKeycenter, tuneCents }) => {
      const own = samples.length === 1 ? '' : `sample=${sample} `;
      return `<region> ${own}lokey=${key} hikey=${key} pitch_keycenter=${pitchKeycenter} tune=${tuneCents}`;
    }),
  ];
  const warnings = unreachableKeysWarning(
    placed.filter((region) => region.clamped).map((region) => region.key),
    'lie further from their sample than a sampler map can move it; their regions were clamped',
  );
  return { text: `${lines.join('\n')}\n`, warnings };
}
