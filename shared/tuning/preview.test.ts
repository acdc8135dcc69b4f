import { describe, expect, it } from 'vitest';
import { parsePresetDocument, type ResolvedPreset } from '../preset/preset-document';
import { previewTable } from './preview';
import { stack } from './scale.testing';

function preset(scale: unknown, mapping: unknown = { rootKey: 60 }): ResolvedPreset {
  const document = { format: 'keyloom.preset', version: 1, name: 'Test', scale, mapping };
  const parsed = parsePresetDocument(document);
  if (!parsed.ok) throw new Error(parsed.errors.map((error) => error.message).join('\n'));
  return parsed.value;
}

describe('previewTable', () => {
  it('answers with JSON that survives a round trip, ratios as text', () => {
    const table = previewTable(preset(stack('3/2', '2/1', 52, 0)));
    const roundTrip = JSON.parse(JSON.stringify(table));
    expect(roundTrip).toEqual(table);
    // arithmetic, 3^53 / 2^84
    expect(table.analysis.stack?.comma.ratio).toBe(
      '19383245667680019896796723/19342813113834066795298816',
    );
    expect(table.degrees[0]).toMatchObject({ ratio: '1/1', cents: 0, stackPosition: 0 });
  });

  it('gives the 128-key table with cents from the root', () => {
    const table = previewTable(preset({ kind: 'equal', divisions: 12, period: '2/1' }));
    expect(table.keys).toHaveLength(128);
    // MIDI convention (key 0 = 8.1757989156 Hz)
    expect(table.keys[0]).toEqual({
      key: 0,
      degree: 0,
      hz: expect.closeTo(8.1757989156, 9),
      cents: expect.closeTo(-6000, 9),
      centsFrom12: expect.closeTo(0, 9),
      outOfMtsRange: false,
    });
    expect(table.analysis.stepPattern).toEqual({
      sizes: [{ ratio: null, cents: expect.closeTo(100, 9), letter: 'L', count: 12 }],
      pattern: 'LLLLLLLLLLLL',
      isMos: false,
    });
    expect(table.analysis.stack).toBeNull();
    expect(table.analysis.intervalMatrix).toHaveLength(12);
    expect(table.warnings).toEqual([]);
  });

  it('shows the fifths from F as the first journey (designing a scale) needs them', () => {
    const table = previewTable(
      preset(stack('3/2', '2/1', 5, 1), {
        rootKey: 60,
        rootHz: 261.6255653,
        layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
      }),
    );
    // arithmetic (pure fifths stacked from C: D 9/8, E 81/64 ... B 243/128)
    expect(table.degrees.map((degree) => degree.ratio)).toEqual([
      '1/1',
      '9/8',
      '81/64',
      '4/3',
      '3/2',
      '27/16',
      '243/128',
    ]);
    expect(table.analysis.stepPattern.pattern).toBe('LLsLLLs');
    expect(table.analysis.stack?.comma.ratio).toBe('2187/2048');
    expect(table.analysis.stack?.wolf).toMatchObject({ from: 6, to: 3, ratio: '1024/729' });
    // arithmetic (G 3/2 above equal-tempered C4 = 392.4383 Hz)
    expect(table.keys[67]).toMatchObject({ degree: 4, hz: expect.closeTo(392.4383, 4) });
    expect(table.keys[61]).toMatchObject({ degree: null, hz: null, cents: null });
  });

  it('names a single key MTS cannot express', () => {
    const table = previewTable(
      preset({ kind: 'equal', divisions: 12, period: '2/1' }, { rootKey: 127, rootHz: 13300 }),
    );
    expect(table.warnings).toEqual([
      {
        path: 'mapping',
        message:
          'mapping: key 127 lies outside the pitches MTS can express (8.1758 to 13289.6566 Hz)',
      },
    ]);
  });

  it('warns about coinciding degrees and keys MTS cannot express', () => {
    const table = previewTable(preset(stack('7\\12', '2/1', 12, 0), { rootKey: 0, rootHz: 4 }));
    expect(table.warnings).toEqual([
      { path: 'scale', message: 'scale: generator +12 coincides with the tonic at 0c' },
      {
        path: 'mapping',
        message: expect.stringMatching(
          /^mapping: keys 0-\d+ lie outside the pitches MTS can express \(8\.1758 to 13289\.6566/,
        ),
      },
    ]);
    expect(table.keys[0].outOfMtsRange).toBe(true);
    expect(table.keys[0].hz).toBe(4);
  });
});
