import { fifthsPreset, resolvedPreset } from '@shared/preset/presets.testing';
import { previewTable } from '@shared/tuning/preview';
import { importNotes } from './import-notes';

function notesOf(document: unknown): string[] {
  const preset = resolvedPreset(document);
  return importNotes(preset, previewTable(preset));
}

describe('importNotes', () => {
  it('says when a tuning repeats at a period other than the octave', () => {
    const notes = notesOf({
      format: 'keyloom.preset',
      version: 1,
      name: 'Copper Fen tritaves',
      scale: { kind: 'equal', divisions: 13, period: '3/1' },
      mapping: { rootKey: 60 },
    });
    expect(notes).toContain(
      'It repeats every 3/1 rather than every octave, 13 keys to the period.',
    );
  });

  it('says when a tuning from MTS messages does not repeat, and how many keys it tunes', () => {
    // The shape shared/import/tuning-from-keys.ts gives a table with no repeating block: one period over all 128 keys.
    const layout = Array.from({ length: 128 }, (_, key) => (key < 3 ? key : null));
    const notes = notesOf({
      format: 'keyloom.preset',
      version: 1,
      name: 'Fen drones',
      scale: { kind: 'list', degrees: ['150c', '320c'], period: '1300c' },
      mapping: { rootKey: 40, rootHz: 82.4, keysPerPeriod: 128, layout },
    });
    expect(notes[0]).toBe(
      'The tuning does not repeat: each of the 3 keys it tunes keeps a pitch of its own, and the other keys are left unmapped.',
    );
    expect(notes).toContain('Degree 0 sounds on key 40 (E2) at 82.40 Hz.');
  });

  it('counts the keys a layout leaves unmapped', () => {
    const notes = notesOf({
      ...fifthsPreset('Fen Fifths'),
      mapping: {
        rootKey: 60,
        keysPerPeriod: 12,
        layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
      },
    });
    expect(notes).toContain(
      '5 of every 12 keys are left unmapped: the instrument keeps its own pitch for them.',
    );
  });
});
