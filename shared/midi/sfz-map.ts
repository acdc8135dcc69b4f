import type { FieldError } from '../result';
import type { KeyPitch } from './frequency-word';
import { unreachableKeysWarning } from './unreachable-keys';
import { singleLine } from '../text/plain-text';

/**
 * An SFZ sampler map: one region per mapped key that shifts one placeholder sample, recorded at
 * middle C, to the key's pitch. A region plays the sample moved by (key - pitch_keycenter)
 * semitones plus `tune` cents; `tune` holds whole cents, so each key sounds within half a cent of
 * the tuning.
 */

const sampleKey = 60;
const sampleName = 'middle-c.wav';
const keyOfA4 = 69;
const hzOfA4 = 440;
/** The widest fine tune SFZ 1.0 takes, in cents. */
const widestTuneCents = 100;

interface SfzRegion {
  key: number;
  pitchKeycenter: number;
  tuneCents: number;
  clamped: boolean;
}

/**
 * The region of one key: the pitch centre that leaves the smallest fine tune, rounded once to whole
 * cents. When the centre would leave 0-127 the tune makes up what it can; a key beyond that is
 * clamped and flagged.
 */
function regionOf(key: number, hz: number): SfzRegion {
  const centsFromSample = 1200 * Math.log2(hz / hzOfA4) - 100 * (sampleKey - keyOfA4);
  const idealCentre = key - Math.round(centsFromSample / 100);
  const pitchKeycenter = Math.min(127, Math.max(0, idealCentre));
  const wantedTune = Math.round(centsFromSample - 100 * (key - pitchKeycenter));
  const tuneCents = Math.min(widestTuneCents, Math.max(-widestTuneCents, wantedTune));
  return { key, pitchKeycenter, tuneCents, clamped: tuneCents !== wantedTune };
}

export interface SfzMap {
  text: string;
  warnings: FieldError[];
}

/**
 * The map of every mapped key, with comments saying what to replace and how precise the tuning is.
 */
export function sfzMap(keys: readonly KeyPitch[], about: { name: string }): SfzMap {
  const placed = keys.flatMap(({ key, hz }) => (hz === null ? [] : [regionOf(key, hz)]));
  const comment = (line: string) => `// ${singleLine(line)}`;
  const lines = [
    comment(`Keyloom sampler map: ${about.name}`),
    comment(`Replace ${sampleName} with your own sample of middle C`),
    comment('(key 60, 261.6256 Hz at A4 = 440 Hz); each region moves it to its key:'),
    comment('(key - pitch_keycenter) semitones plus tune cents.'),
    comment(
      'Precision: tune holds whole cents, so every key sounds within 0.5 cent of the tuning.',
    ),
    '',
    '<group>',
    `sample=${sampleName} pitch_keytrack=100`,
    '',
    ...placed.map(
      ({ key, pitchKeycenter, tuneCents }) =>
        `<region> lokey=${key} hikey=${key} pitch_keycenter=${pitchKeycenter} tune=${tuneCents}`,
    ),
  ];
  const warnings = unreachableKeysWarning(
    placed.filter((region) => region.clamped).map((region) => region.key),
    'lie further from middle C than a sampler map can move one sample; their regions were clamped',
  );
  return { text: `${lines.join('\n')}\n`, warnings };
}
