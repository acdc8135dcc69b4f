// A preset as one player's instrument takes it: the instrument's settings stand in for the preset's
// `output` block (the author's suggestion), while the tuning itself, its tuning name and its
// samples stay the preset's.
import type { InstrumentSettings } from './instruments';
import type { ResolvedPreset } from '../preset/preset-document';

/** The settings of an instrument that override a preset's output block. */
export type InstrumentOutput = Pick<
  InstrumentSettings,
  'deviceId' | 'program' | 'bank' | 'bendRange' | 'memberChannels'
>;

/** A copy of the preset with the instrument's output settings; the preset given stays as it was. */
export function presetForInstrument(
  preset: ResolvedPreset,
  instrument: InstrumentOutput,
): ResolvedPreset {
  const { deviceId, program, bank, bendRange, memberChannels } = instrument;
  const [first, last] = memberChannels;
  return {
    ...preset,
    output: { ...preset.output, deviceId, program, bank, bendRange, memberChannels: [first, last] },
  };
}
