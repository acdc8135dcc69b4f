import { Midi } from '@tonejs/midi';
import * as fc from 'fast-check';
import { parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { decodeMtsStream } from '../midi/mts-decode';
import { parsePresetDocument, type ResolvedPreset } from '../preset/preset-document';
import { scaleSpecs } from '../tuning/scale.testing';
import { exportFormats, renderExport } from './export-catalogue';
import { tuningOfPreset } from './preset-tuning';

function presetOf(document: Record<string, unknown>): ResolvedPreset {
  const parsed = parsePresetDocument({ format: 'keyloom.preset', version: 1, ...document });
  if (!parsed.ok) throw new Error(parsed.errors.map((error) => error.message).join('\n'));
  return parsed.value;
}

/** The product's example preset document: fifths from F. */
const fifthsFromF = presetOf({
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
});
const nineteenEqual = presetOf({
  name: 'Nineteen',
  scale: { kind: 'equal', divisions: 19 },
  mapping: { rootKey: 60 },
});

function rendered(preset: ResolvedPreset, format: string) {
  const result = renderExport(preset, format);
  if (!result.ok) throw new Error(result.errors.map((error) => error.message).join('\n'));
  return result.value;
}

const text = (bytes: Uint8Array) => new TextDecoder().decode(bytes);

describe('the export catalogue', () => {
  it('offers every export format under its contract id', () => {
    expect(exportFormats.map((format) => format.id)).toEqual([
      'mts-bulk',
      'mts-bulk-bank',
      'mts-notes',
      'mts-octave-1',
      'mts-octave-2',
      'smf',
      'mpe-smf',
      'bend-csv',
      'bend-json',
      'key-csv',
      'sfz',
      'preset',
    ]);
    for (const format of exportFormats) {
      expect(format.description.length).toBeGreaterThan(20);
      expect(format.description).not.toMatch(/\n/);
    }
  });

  it('names each file after the preset, with the extension and content type of its format', () => {
    const files = exportFormats.map((format) => {
      const file = rendered(fifthsFromF, format.id);
      return [format.id, file.fileName, file.contentType];
    });
    expect(files).toEqual([
      ['mts-bulk', 'fifths-from-f.syx', 'application/octet-stream'],
      ['mts-bulk-bank', 'fifths-from-f-bank.syx', 'application/octet-stream'],
      ['mts-notes', 'fifths-from-f-notes.syx', 'application/octet-stream'],
      ['mts-octave-1', 'fifths-from-f-octave-1.syx', 'application/octet-stream'],
      ['mts-octave-2', 'fifths-from-f-octave-2.syx', 'application/octet-stream'],
      ['smf', 'fifths-from-f.mid', 'audio/midi'],
      ['mpe-smf', 'fifths-from-f-mpe.mid', 'audio/midi'],
      ['bend-csv', 'fifths-from-f-bends.csv', 'text/csv; charset=utf-8'],
      ['bend-json', 'fifths-from-f-bends.json', 'application/json; charset=utf-8'],
      ['key-csv', 'fifths-from-f-keys.csv', 'text/csv; charset=utf-8'],
      ['sfz', 'fifths-from-f.sfz', 'text/plain; charset=utf-8'],
      ['preset', 'fifths-from-f.json', 'application/json; charset=utf-8'],
    ]);
  });

  it('writes MTS files that decode to the preset tuning', () => {
    const tuning = tuningOfPreset(fifthsFromF);
    if (!tuning.ok) throw new Error('the preset did not build');
    for (const format of ['mts-bulk', 'mts-bulk-bank', 'mts-notes', 'mts-octave-2']) {
      const decoded = decodeMtsStream(rendered(fifthsFromF, format).bytes);
      if (!decoded.ok) throw new Error(decoded.errors[0].message);
      // arithmetic (MIDI convention): a just fifth above equal-tempered C4, 392.4383 Hz
      expect(decoded.value.keys[67].hz).toBeCloseTo(392.4383, 3);
      for (const entry of tuning.value.keys) {
        if (entry.hz === null) continue;
        const hz = decoded.value.keys[entry.key].hz ?? 0;
        const errorCents = Math.abs(1200 * Math.log2(hz / entry.hz));
        // MIDI Tuning specification: frequency words leave at most 0.0030517578125 cents; the
        // 2-byte scale/octave form at most half of 0.01220703125 cents
        expect(errorCents).toBeLessThanOrEqual(format === 'mts-octave-2' ? 0.0061036 : 0.0030518);
      }
    }
    const dump = rendered(fifthsFromF, 'mts-bulk').bytes;
    expect(String.fromCharCode(...dump.subarray(6, 22))).toBe('FIFTHS F        ');
  });

  it('refuses scale/octave tuning for a layout that is not 12 keys per octave, saying why', () => {
    const refused = renderExport(nineteenEqual, 'mts-octave-1');
    expect(refused.ok).toBe(false);
    expect(!refused.ok && refused.errors[0]).toEqual({
      path: 'mapping.keysPerPeriod',
      message:
        'mapping.keysPerPeriod: this layout repeats every 19 keys, and scale/octave tuning needs 12 keys an ' +
        'octave: send a bulk dump or single-note changes instead',
    });
    expect(renderExport(nineteenEqual, 'mts-bulk').ok).toBe(true);
  });

  it('refuses an unknown format and names the field', () => {
    const refused = renderExport(fifthsFromF, 'wav');
    expect(!refused.ok && refused.errors[0].path).toBe('format');
    expect(!refused.ok && refused.errors[0].message).toMatch(
      /^format: "wav" is not an export format/,
    );
  });

  it('clamps keys MTS cannot express and reports them', () => {
    const high = presetOf({
      name: 'High',
      scale: { kind: 'equal', divisions: 12 },
      mapping: { rootKey: 60, rootHz: 1000 },
    });
    const file = rendered(high, 'mts-bulk');
    // MIDI Tuning specification: 7F 7F 7E = 13289.6566 Hz is the top of the range
    expect([...file.bytes.subarray(22 + 3 * 127, 25 + 3 * 127)]).toEqual([0x7f, 0x7f, 0x7e]);
    expect(file.warnings).toHaveLength(1);
    expect(file.warnings[0].message).toMatch(/^mapping: keys 105-127 lie outside the pitches MTS/);
    expect(rendered(high, 'smf').warnings).toEqual(file.warnings);
  });

  it('writes MIDI files that midi-file and @tonejs/midi both read', () => {
    for (const format of ['smf', 'mpe-smf']) {
      const { bytes } = rendered(fifthsFromF, format);
      const notes = parseMidi(bytes).tracks[0].filter((event) => event.type === 'noteOn');
      expect(notes).toHaveLength(15 + 4);
      const midi = new Midi(bytes);
      expect(midi.tracks.flatMap((track) => track.notes)).toHaveLength(15 + 4);
      expect(midi.header.tempos[0].bpm).toBeCloseTo(120, 6);
    }
  });

  it('writes bend tables and sampler maps as text', () => {
    const csv = text(rendered(fifthsFromF, 'bend-csv').bytes).split('\r\n');
    expect(csv[0]).toBe('key,hz,channel,note,bend,residual_cents');
    const json = JSON.parse(text(rendered(fifthsFromF, 'bend-json').bytes));
    expect(json.keys).toHaveLength(csv.length - 2);
    const sfz = text(rendered(fifthsFromF, 'sfz').bytes);
    expect(sfz).toMatch(/^\/\/ Keyloom sampler map: Fifths from F$/m);
    expect(sfz).toMatch(/^<region> lokey=67 hikey=67 pitch_keycenter=60 tune=2$/m);
  });

  it('writes the preset document so that it reads back as the same preset', () => {
    for (const preset of [fifthsFromF, nineteenEqual]) {
      const written = JSON.parse(text(rendered(preset, 'preset').bytes));
      expect(parsePresetDocument(written)).toEqual({ ok: true, value: preset });
    }
    const written = JSON.parse(text(rendered(nineteenEqual, 'preset').bytes));
    expect(written.mapping).not.toHaveProperty('layout');
    expect(written.output.memberChannels).toEqual([2, 16]);
  });

  it('renders every format of any preset, or refuses it with a reason, never throwing', () => {
    const documents = fc.record({
      scale: scaleSpecs,
      rootKey: fc.integer({ min: 0, max: 127 }),
      bendRange: fc.integer({ min: 1, max: 96 }),
      bank: fc.integer({ min: 0, max: 3 }),
    });
    const formats = fc.constantFrom(...exportFormats.map((format) => format.id));
    fc.assert(
      fc.property(documents, formats, (document, format) => {
        const preset = presetOf({
          name: 'Any',
          scale: document.scale,
          mapping: { rootKey: document.rootKey },
          output: { bendRange: document.bendRange, bank: document.bank },
        });
        const result = renderExport(preset, format);
        if (result.ok) expect(result.value.bytes.length).toBeGreaterThan(0);
        else {
          expect(format).toMatch(/^mts-octave/);
          expect(result.errors[0].message).toMatch(/scale\/octave tuning needs/);
        }
      }),
      { numRuns: 300 },
    );
  });
});
