import { describe, expect, it } from 'vitest';
import { parsePresetDocument, type ResolvedPreset } from '../preset/preset-document';
import { renderExport } from '../export/export-catalogue';
import { presetForInstrument } from './preset-for-instrument';

function preset(): ResolvedPreset {
  const parsed = parsePresetDocument({
    format: 'keyloom.preset',
    version: 1,
    name: 'Gear Test',
    scale: { kind: 'equal', divisions: 19, period: '2/1' },
    mapping: { rootKey: 60 },
    output: {
      deviceId: 3,
      program: 7,
      bank: 1,
      tuningName: 'AUTHOR',
      bendRange: 12,
      memberChannels: [2, 16],
      samples: [{ file: 'piano-c4.wav', key: 60 }],
    },
  });
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return parsed.value;
}

const gear = {
  deviceId: 16,
  program: 5,
  bank: 0,
  bendRange: 48,
  memberChannels: [2, 9] as [number, number],
};

describe('presetForInstrument', () => {
  it('takes the device, program, bank, bend range and member channels from the instrument', () => {
    const original = preset();
    const mine = presetForInstrument(original, gear);
    expect(mine.output).toEqual({
      ...gear,
      tuningName: 'AUTHOR',
      samples: [{ file: 'piano-c4.wav', key: 60 }],
    });
    expect(mine.scale).toBe(original.scale);
    expect(mine.mapping).toBe(original.mapping);
  });

  it('leaves the preset it was given as it was', () => {
    const original = preset();
    const before = structuredClone(original);
    presetForInstrument(original, gear);
    expect(original).toEqual(before);
  });

  it("changes the bulk dump the preset exports to the instrument's device and program", () => {
    const rendered = renderExport(presetForInstrument(preset(), gear), 'mts-bulk');
    if (!rendered.ok) throw new Error(rendered.errors[0].message);
    // MIDI Tuning Standard, bulk tuning dump: F0 7E <device ID> 08 01 <tuning program> ...
    expect([...rendered.value.bytes.slice(0, 6)]).toEqual([0xf0, 0x7e, 16, 0x08, 0x01, 5]);
  });
});
