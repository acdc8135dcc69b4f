import { midiToFreq } from '@tonaljs/midi';
import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { presetDocumentFile } from '../export/preset-export';
import { scaleSpecs } from '../tuning/scale.testing';
import { previewTable } from '../tuning/preview';
import { parsePresetDocument, type PresetDocument, type ResolvedPreset } from './preset-document';

/** The product's example preset document, every field written out. */
const designExample: PresetDocument = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Fifths from F',
  notes: 'free text',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 },
  mapping: {
    rootKey: 60,
    rootHz: 261.6255653,
    concertA: 440,
    keysPerPeriod: 12,
    layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
  },
  output: {
    deviceId: 127,
    program: 0,
    bank: 0,
    tuningName: 'FIFTHS F',
    bendRange: 2,
    memberChannels: [2, 16],
  },
};

const smallest = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Nineteen',
  scale: { kind: 'equal', divisions: 19 },
  mapping: { rootKey: 60 },
};

function resolved(input: unknown): ResolvedPreset {
  const result = parsePresetDocument(input);
  if (!result.ok) throw new Error(result.errors.map((error) => error.message).join('\n'));
  return result.value;
}

function faults(input: unknown): string[] {
  const result = parsePresetDocument(input);
  if (result.ok) throw new Error('the document was accepted');
  return result.errors.map((error) => error.message);
}

describe('parsePresetDocument', () => {
  it('reads the example document as written', () => {
    // Resolving adds only what the document leaves unsaid: here, that it names no anchor key.
    expect(resolved(designExample)).toEqual({
      ...designExample,
      mapping: { ...designExample.mapping, anchor: null },
    });
  });

  it('reads a document it resolved again as the same document', () => {
    for (const input of [designExample, smallest]) {
      const once = resolved(input);
      expect(resolved(JSON.parse(JSON.stringify(once)))).toEqual(once);
    }
  });

  it('fills in every default', () => {
    const preset = resolved(smallest);
    expect(preset.notes).toBe('');
    expect(preset.scale).toEqual({ kind: 'equal', divisions: 19, period: '2/1' });
    // MIDI convention (key 60 = 261.6255653006 Hz with A4 = 440 Hz)
    expect(preset.mapping.rootHz).toBeCloseTo(261.6255653006, 9);
    expect(preset.mapping).toMatchObject({ concertA: 440, keysPerPeriod: 19, layout: null });
    expect(preset.output).toEqual({
      deviceId: 127,
      program: 0,
      bank: 0,
      tuningName: 'Nineteen',
      bendRange: 2,
      memberChannels: [2, 16],
    });
  });

  it('derives the root pitch from the concert pitch', () => {
    const preset = resolved({ ...smallest, mapping: { rootKey: 69, concertA: 415 } });
    expect(preset.mapping.rootHz).toBe(415);
    const a3 = resolved({ ...smallest, mapping: { rootKey: 57, concertA: 432 } });
    expect(a3.mapping.rootHz).toBeCloseTo(216, 9);
  });

  it('makes a tuning name of 7-bit ASCII, at most 16 characters, from the name', () => {
    const named = (name: string) => resolved({ ...smallest, name }).output.tuningName;
    expect(named('Équal 19 — Légère tuning')).toBe('Equal 19 Legere');
    expect(named('  Quarter-comma meantone  ')).toBe('Quarter-comma me');
    expect(named('四分音')).toBe('Keyloom');
  });

  it('reads numbers as intervals where the syntax allows, and refuses a bare decimal', () => {
    expect(
      resolved({ ...smallest, scale: { kind: 'equal', divisions: 13, period: 3 } }).scale,
    ).toEqual({ kind: 'equal', divisions: 13, period: '3' });
    expect(faults({ ...smallest, scale: { kind: 'equal', divisions: 12, period: 1.5 } })).toEqual([
      'scale.period: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2',
    ]);
  });

  it('refuses an unknown version with one message, reading nothing else', () => {
    expect(faults({ ...smallest, version: 2, scale: 'whatever' })).toEqual([
      'version: 2 is not a version this Keyloom reads (it reads version 1)',
    ]);
    expect(faults({ ...smallest, version: '1' })).toEqual([
      'version: "1" is not a version this Keyloom reads (it reads version 1)',
    ]);
  });

  it('names the field of every missing or mistyped field', () => {
    expect(faults({ version: 1 })).toEqual([
      'format: is required',
      'name: is required',
      'scale: is required',
      'mapping: is required',
    ]);
    expect(faults('a string')).toEqual(['document: must be an object (got "a string")']);
    expect(
      faults({
        ...smallest,
        format: 'other',
        name: '   ',
        mapping: { rootKey: 128, concertA: 100, rootHz: -5 },
      }),
    ).toEqual([
      'format: must be "keyloom.preset" (got "other")',
      'name: must not be empty',
      'mapping.rootKey: must be at most 127 (got 128)',
      'mapping.rootHz: must be at least 1 (got -5)',
      'mapping.concertA: must be at least 220 (got 100)',
    ]);
  });

  it('names the field of every bad interval', () => {
    const scale = { kind: 'list', degrees: ['9/8', '5/4', '4/3', '0/2', 'x', '2/1'] };
    expect(faults({ ...smallest, scale })).toEqual([
      'scale.degrees[3]: 0/2 is not a ratio above 0',
      expect.stringMatching(/^scale\.degrees\[4\]: "x" is not an interval/),
    ]);
    expect(faults({ ...smallest, scale: { ...scale, degrees: ['9/8', '2/1'] } })).toEqual([
      'scale.degrees[1]: 2/1 is not below the period 2/1',
    ]);
    expect(
      faults({ ...smallest, scale: { kind: 'generated', generator: '1.5', up: 5, down: 1 } }),
    ).toEqual(['scale.generator: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2']);
    expect(faults({ ...smallest, scale: { kind: 'generated', generator: [], up: 5 } })).toEqual([
      'scale.generator: must be an interval such as "3/2" or "701.955c"',
    ]);
    const temper = { comma: '81/80', fraction: { quarter: true } };
    expect(
      faults({ ...smallest, scale: { kind: 'generated', generator: '3/2', up: 5, temper } }),
    ).toEqual(['scale.temper.fraction: must be a fraction such as "1/4", "-1/6" or "0.25"']);
  });

  it('names unknown kinds and unknown fields', () => {
    expect(faults({ ...smallest, scale: { kind: 'spiral' } })).toEqual([
      'scale.kind: must be one of generated, equal, list, harmonic (got "spiral")',
    ]);
    expect(faults({ ...smallest, scale: { divisions: 12 } })).toEqual(['scale.kind: is required']);
    const misspelt = { kind: 'equal', divisions: 12, generater: '3/2' };
    expect(faults({ ...smallest, colour: 'red', scale: misspelt })).toEqual([
      'scale.generater: is not a field here',
      'colour: is not a field here',
    ]);
  });

  it('checks the layout against the scale and keysPerPeriod', () => {
    const fifths = designExample;
    const withLayout = (layout: unknown) => ({ ...fifths, mapping: { ...fifths.mapping, layout } });
    expect(faults(withLayout([0, null, 7, 2, 1.5, 3, 4, 5, 6, 1, 2, 3]))).toEqual([
      'mapping.layout[4]: must be a whole number (got 1.5)',
    ]);
    expect(faults(withLayout([0, null, 7, 2, 9, 3, 4, 5, 6, 1, 2, 3]))).toEqual([
      'mapping.layout[2]: degree 7 does not exist; the scale has 7 degrees (0-6)',
      'mapping.layout[4]: degree 9 does not exist; the scale has 7 degrees (0-6)',
    ]);
    expect(faults({ ...fifths, mapping: { ...fifths.mapping, keysPerPeriod: 11 } })).toEqual([
      'mapping.layout: has 12 entries, but keysPerPeriod is 11',
    ]);
    expect(faults({ ...fifths, mapping: { rootKey: 60, keysPerPeriod: 12 } })).toEqual([
      "mapping.keysPerPeriod: 12 differs from the scale's 7 degrees; " +
        'give a layout of 12 entries to say which key plays which degree',
    ]);
    const shortLayout = resolved({ ...fifths, mapping: { rootKey: 60, layout: [0, 1, null] } });
    expect(shortLayout.mapping.keysPerPeriod).toBe(3);
  });

  it('checks the output settings', () => {
    expect(
      faults({
        ...smallest,
        output: {
          deviceId: 128,
          program: -1,
          tuningName: 'Sept-tonal ☼',
          bendRange: 97,
          memberChannels: [9, 2],
        },
      }),
    ).toEqual([
      'output.deviceId: must be at most 127 (got 128)',
      'output.program: must be at least 0 (got -1)',
      'output.tuningName: must hold only plain ASCII letters, digits, spaces and punctuation',
      'output.bendRange: must be at most 96 (got 97)',
      'output.memberChannels: runs from 9 down to 2; write the lower channel first',
    ]);
    expect(faults({ ...smallest, output: { tuningName: 'A name far too long' } })).toEqual([
      'output.tuningName: must have at most 16 characters',
    ]);
  });

  it('never throws, and names a field in every fault, whatever it is given', () => {
    const documentLike = fc.record(
      {
        format: fc.oneof(fc.constant('keyloom.preset'), fc.string()),
        version: fc.oneof(fc.constant(1), fc.anything()),
        name: fc.oneof(fc.string(), fc.anything()),
        scale: fc.oneof(
          fc.record(
            { kind: fc.constantFrom('generated', 'equal', 'list', 'harmonic') },
            { requiredKeys: [] },
          ),
          fc.anything(),
        ),
        mapping: fc.oneof(fc.record({ rootKey: fc.integer() }), fc.anything()),
      },
      { requiredKeys: [] },
    );
    fc.assert(
      fc.property(fc.oneof(documentLike, fc.anything()), (input) => {
        const result = parsePresetDocument(input);
        if (result.ok) return;
        expect(result.errors.length).toBeGreaterThan(0);
        for (const error of result.errors) {
          expect(error.message.startsWith(`${error.path}: `)).toBe(true);
        }
      }),
    );
  });
});

describe('the anchor: the key that sounds the pitch a musician tunes to', () => {
  const meantone = (mapping: object) => ({
    format: 'keyloom.preset',
    version: 1,
    name: 'Quarter-comma from E-flat',
    scale: {
      kind: 'generated',
      generator: '3/2',
      up: 8,
      down: 3,
      temper: { comma: '81/80', fraction: '1/4' },
    },
    mapping: { rootKey: 60, ...mapping },
  });

  it('makes A sound 415 Hz in quarter-comma meantone, the root following', () => {
    const anchored = parsePresetDocument(meantone({ anchor: { key: 69, hz: 415 } }));
    if (!anchored.ok) throw new Error(anchored.errors[0].message);
    // With A4 anchored at 415 Hz on key 69, C4 = 248.2279 Hz: arithmetic, 415 / 5^(3/4) * 2 (REFERENCE values).
    expect(anchored.value.mapping.rootHz).toBeCloseTo(248.2279, 4);
    expect(anchored.value.mapping.rootHz).toBeCloseTo((415 / 5 ** 0.75) * 2, 9);
    const a = previewTable(anchored.value).keys[69];
    expect(a.hz).toBeCloseTo(415, 9);

    // Without the anchor, concert A = 415 only moves the equal-tempered reference: A sounds 412.547 Hz.
    const referenceOnly = parsePresetDocument(meantone({ concertA: 415 }));
    if (!referenceOnly.ok) throw new Error('refused');
    expect(previewTable(referenceOnly.value).keys[69].hz).toBeCloseTo(412.547, 3);
  });

  it('is refused beside rootHz, and on a key that plays no degree', () => {
    const both = parsePresetDocument(meantone({ rootHz: 250, anchor: { key: 69, hz: 415 } }));
    expect(both.ok ? [] : both.errors.map((e) => e.path)).toEqual(['mapping.anchor']);
    const unmapped = parsePresetDocument({
      ...meantone({
        anchor: { key: 61, hz: 277 },
        layout: [0, null, 2, 4, 5, 7, 8, 9, 10, 11, 1, 3],
      }),
    });
    expect(unmapped.ok ? '' : unmapped.errors[0].message).toBe(
      'mapping.anchor.key: 61 plays no degree in this layout: anchor a key that does',
    );
  });

  it('keeps its key at its pitch to 1e-9 relative for every kind of scale and layout', () => {
    fc.assert(
      fc.property(
        scaleSpecs,
        fc.integer({ min: 0, max: 127 }),
        fc.integer({ min: 0, max: 127 }),
        fc.double({ min: 20, max: 4000, noNaN: true }),
        fc.option(
          fc.array(fc.option(fc.nat({ max: 3 }), { nil: null, freq: 4 }), {
            minLength: 1,
            maxLength: 24,
          }),
          { nil: undefined },
        ),
        (scale, rootKey, key, hz, layout) => {
          const parsed = parsePresetDocument({
            format: 'keyloom.preset',
            version: 1,
            name: 'Anchored',
            scale,
            mapping: { rootKey, layout, anchor: { key, hz } },
          });
          if (!parsed.ok) {
            // Refused only for a reason of its own: an unmapped anchor key, a layout naming a missing degree, or a
            // root pushed out of the audible range.
            expect(parsed.errors[0].path).toMatch(/^mapping\.(anchor\.(key|hz)|layout\[\d+\])$/);
            return;
          }
          const sounded = previewTable(parsed.value).keys[key].hz!;
          expect(Math.abs(sounded / hz - 1)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('anchored at A4 = 440 in twelve equal divisions, plays the MIDI key-frequency rule on every key', () => {
    const parsed = parsePresetDocument({
      format: 'keyloom.preset',
      version: 1,
      name: '12',
      scale: { kind: 'equal', divisions: 12 },
      mapping: { rootKey: 60, anchor: { key: 69, hz: 440 } },
    });
    if (!parsed.ok) throw new Error('refused');
    // An independent library for key to frequency: @tonaljs/midi midiToFreq, 440 * 2^((n - 69) /
    // 12).
    previewTable(parsed.value).keys.forEach((key) =>
      expect(key.hz! / midiToFreq(key.key)).toBeCloseTo(1, 12),
    );
  });

  it('travels in the preset file as written, and reads back to the same tuning', () => {
    const anchored = parsePresetDocument(meantone({ anchor: { key: 69, hz: 415 } }));
    if (!anchored.ok) throw new Error('refused');
    const file = JSON.parse(presetDocumentFile(anchored.value));
    expect(file.mapping.anchor).toEqual({ key: 69, hz: 415 });
    expect(file.mapping.rootHz).toBeUndefined();
    const again = parsePresetDocument(file);
    expect(again.ok && again.value.mapping.rootHz).toBe(anchored.value.mapping.rootHz);
  });
});
