import { describe, expect, it } from 'vitest';
import { exportFileName } from './export-file-name';

describe('export file names', () => {
  it('makes a safe name from the preset name', () => {
    expect(exportFileName('Fen Fifths', '.syx')).toBe('fen-fifths.syx');
    const name = exportFileName('  Tempérament égal / 12 ', '-mpe.mid');
    expect(name).toBe('temperament-egal-12-mpe.mid');
    expect(exportFileName('a"b\\c\r\nd', '.sfz')).toBe('a-b-c-d.sfz');
  });

  it('falls back to a name of its own when nothing is left', () => {
    expect(exportFileName('!!!', '.json')).toBe('keyloom-tuning.json');
    expect(exportFileName('音律', '.syx')).toBe('keyloom-tuning.syx');
  });

  it('keeps names short', () => {
    expect(exportFileName('x'.repeat(200), '.mid')).toBe(`${'x'.repeat(60)}.mid`);
    expect(exportFileName(`${'y'.repeat(59)} z`, '.mid')).toBe(`${'y'.repeat(59)}.mid`);
  });
});
