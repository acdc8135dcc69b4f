import { readFileSync } from 'node:fs';
import PDFDocument from 'pdfkit';
import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { sfntFromWoff, sheetFontFiles, sheetFonts } from './sheet-fonts';
import { renderTunerSheet } from './tuner-sheet';

/** A table's checksum as the OpenType specification defines it: the sum of its big-endian uint32s, zero-padded. */
function tableChecksum(table: Buffer): number {
  const padded = Buffer.concat([table, Buffer.alloc((4 - (table.length % 4)) % 4)]);
  let sum = 0;
  for (let offset = 0; offset < padded.length; offset += 4)
    sum = (sum + padded.readUInt32BE(offset)) >>> 0;
  return sum;
}

/** A one-page PDF with a line in each weight, drawn from the fonts given. */
function drawLine(regular: Buffer, bold: Buffer): Promise<Buffer> {
  const doc = new PDFDocument({ info: { CreationDate: new Date(0) } });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve) =>
    doc.on('end', () => resolve(Buffer.concat(chunks))),
  );
  doc.font(regular).text('Degree 7: 2187/2048, 113.685 cents, tuner shows C#4 +13.7');
  doc.font(bold).text('What to dial into a tuner (A4 = 440 Hz)');
  doc.end();
  return done;
}

describe('the tuner sheet fonts', () => {
  it('unpack each WOFF table to the bytes its checksum was taken from, in an sfnt with its own table directory', () => {
    const woff = readFileSync(sheetFontFiles.regular);
    const sfnt = sfntFromWoff(woff);
    const numTables = sfnt.readUInt16BE(4);
    // W3C WOFF File Format 1.0: the header says how many tables the font has and which sfnt it wraps.
    expect(numTables).toBe(woff.readUInt16BE(12));
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    for (let index = 0; index < numTables; index++) {
      const record = 12 + index * 16;
      const offset = sfnt.readUInt32BE(record + 8);
      const length = sfnt.readUInt32BE(record + 12);
      // OpenType specification: every table starts on a 4-byte boundary.
      expect(offset % 4).toBe(0);
      const table = sfnt.subarray(offset, offset + length);
      const tag = sfnt.toString('latin1', record, record + 4);
      // The head table's checksum is taken with its checkSumAdjustment field (bytes 8 to 11) as zero.
      const summed =
        tag === 'head'
          ? Buffer.concat([table.subarray(0, 8), Buffer.alloc(4), table.subarray(12)])
          : table;
      expect({ tag, checksum: tableChecksum(summed) }).toEqual({
        tag,
        checksum: sfnt.readUInt32BE(record + 4),
      });
    }
  });

  it('draw the same PDF bytes as the WOFF files they come from', async () => {
    const fromFiles = await drawLine(
      readFileSync(sheetFontFiles.regular),
      readFileSync(sheetFontFiles.bold),
    );
    const fonts = sheetFonts();
    expect((await drawLine(fonts.regular, fonts.bold)).equals(fromFiles)).toBe(true);
    // And again, the fonts now shared with the sheet drawn before.
    expect((await drawLine(fonts.regular, fonts.bold)).equals(fromFiles)).toBe(true);
  });

  it('shared between sheets, leave each sheet the bytes it has when drawn alone', async () => {
    const read = (document: object) => {
      const parsed = parsePresetDocument({ format: 'keyloom.preset', version: 1, ...document });
      if (!parsed.ok) throw new Error(parsed.errors[0].message);
      return parsed.value;
    };
    const fifths = read({
      name: 'Fen Fifths',
      scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
      mapping: { rootKey: 60 },
    });
    const harmonics = read({
      name: 'Harmonics Ж',
      scale: { kind: 'harmonic', from: 8, to: 16 },
      mapping: { rootKey: 48 },
    });
    const at = { revision: 2, savedAt: new Date('2026-11-30T10:00:00Z') };
    const first = await renderTunerSheet(fifths, at);
    await renderTunerSheet(harmonics, at);
    expect((await renderTunerSheet(fifths, at)).equals(first)).toBe(true);
  });
});
