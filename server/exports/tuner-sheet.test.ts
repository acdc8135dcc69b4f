import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { renderTunerSheet, tunerRows } from './tuner-sheet';

function preset(document: object) {
  const parsed = parsePresetDocument({ format: 'keyloom.preset', version: 1, ...document });
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return parsed.value;
}

/** The text of every page, read back with pdf.js, an independent PDF reader. */
async function pdfText(bytes: Buffer): Promise<string> {
  const pdf = await getDocument({
    data: new Uint8Array(bytes),
    useSystemFonts: false,
    isEvalSupported: false,
  }).promise;
  const pages: string[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const content = await (await pdf.getPage(n)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  return pages.join('\n');
}

const fifths = preset({
  name: 'Fen Fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
  mapping: { rootKey: 60 },
});
const saved = { revision: 4, savedAt: new Date('2026-11-30T10:00:00Z') };

describe('the tuner sheet', () => {
  it('says what to dial into a tuner for each key: pure fifths from C against equal temperament', () => {
    const rows = tunerRows(fifths);
    expect(rows.map((r) => r.tunerNote)).toEqual([
      'C4',
      'C#4',
      'D4',
      'D#4',
      'E4',
      'F4',
      'F#4',
      'G4',
      'G#4',
      'A4',
      'A#4',
      'B4',
    ]);
    // arithmetic: pure fifths from equal-tempered C4: D 294.3288, E 331.1199, F 348.8341,
    // G 392.4383, A 441.4931, B 496.6798 Hz.
    const hz = Object.fromEntries(rows.map((r) => [r.tunerNote, r.hz]));
    expect(hz['D4']).toBeCloseTo(294.3288, 3);
    expect(hz['E4']).toBeCloseTo(331.1199, 3);
    expect(hz['F4']).toBeCloseTo(348.8341, 3);
    expect(hz['G4']).toBeCloseTo(392.4383, 3);
    expect(hz['A4']).toBeCloseTo(441.4931, 3);
    expect(hz['B4']).toBeCloseTo(496.6798, 3);
    // Definition: 3/2 = 1200 log2(3/2) = 701.9550008654 cents, so G sits 1.955 cents above
    // equal-tempered G.
    expect(rows.find((r) => r.tunerNote === 'G4')!.offsetCents).toBeCloseTo(1.9550008654, 8);
  });

  it('prints the name, revision, degrees and tuner offsets, as an independent PDF reader sees them', async () => {
    const text = await pdfText(await renderTunerSheet(fifths, saved));
    expect(text).toContain('Fen Fifths');
    expect(text).toContain('Revision 4, saved 2026-11-30');
    expect(text).toContain('2187/2048');
    expect(text).toContain('392.438');
    expect(text).toContain('+13.7');
    expect(text).toContain('What to dial into a tuner (A4 = 440 Hz)');
  });

  it('writes "about" for an approximate ratio, and the exact ratio a tempered degree equals', async () => {
    const meantone = preset({
      name: 'Quarter-comma',
      scale: {
        kind: 'generated',
        generator: '3/2',
        up: 8,
        down: 3,
        temper: { comma: '81/80', fraction: '1/4' },
      },
      mapping: { rootKey: 60 },
    });
    const text = await pdfText(await renderTunerSheet(meantone, saved));
    // Standard acoustics texts: the quarter-comma fifth is 696.578 c, 5.377 c narrow of 3/2; G# is
    // exactly 25/16.
    expect(text).toContain('about 3/2 (−5.4c)');
    expect(text).toContain('25/16');
    expect(text).not.toContain('≈');
  });

  it('follows the anchor: the tuned key and the root it gives', async () => {
    const anchored = preset({
      name: 'Quarter-comma at 415',
      scale: {
        kind: 'generated',
        generator: '3/2',
        up: 8,
        down: 3,
        temper: { comma: '81/80', fraction: '1/4' },
      },
      mapping: { rootKey: 60, anchor: { key: 69, hz: 415 } },
    });
    const text = await pdfText(await renderTunerSheet(anchored, saved));
    // With A4 anchored at 415 Hz on key 69 in quarter-comma meantone, C4 = 248.2279 Hz
    // (arithmetic).
    expect(text).toContain('Key A4 (69) sounds 415 Hz; Root key C4 (60) = 248.2279 Hz');
    const rows = tunerRows(anchored);
    expect(rows.find((row) => row.key === 'A4 (69)')!.hz).toBeCloseTo(415, 9);
  });

  it('gives the same bytes for the same revision', async () => {
    const [a, b] = await Promise.all([
      renderTunerSheet(fifths, saved),
      renderTunerSheet(fifths, saved),
    ]);
    expect(a.equals(b)).toBe(true);
    expect(a.subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('runs onto more pages for a 72-tone scale without losing rows', async () => {
    const many = preset({
      name: 'Seventy-Two',
      scale: { kind: 'equal', divisions: 72, period: '2/1' },
      mapping: { rootKey: 24 },
    });
    const text = await pdfText(await renderTunerSheet(many, { revision: null, savedAt: null }));
    expect(text).toContain('Unsaved design');
    for (const degree of [0, 35, 71]) expect(text).toContain(((degree * 1200) / 72).toFixed(3));
  });
});
