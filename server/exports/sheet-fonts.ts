// The fonts the tuner sheet embeds: Roboto as the project ships it (WOFF, from @fontsource), unpacked once per
// thread into the plain TrueType it wraps and read once into a font that every sheet then shares. The PDF library's
// font reader inflates a WOFF table every time it reads from it, which for the glyph table is once per glyph drawn
// (nine tenths of a sheet's time went there), and a font read afresh for each sheet decodes its layout tables again
// (most of the rest). The tables are the same bytes either way, and so is the sheet.
import { readFileSync } from 'node:fs';
import PDFDocument from 'pdfkit';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { repoRoot } from '../config';

const fontDir = join(repoRoot, 'node_modules/@fontsource/roboto/files');

/** Where each weight comes from. */
export const sheetFontFiles = {
  regular: join(fontDir, 'roboto-latin-400-normal.woff'),
  bold: join(fontDir, 'roboto-latin-700-normal.woff'),
};

/**
 * A WOFF 1.0 file as the sfnt (TrueType or OpenType) font it wraps, following the W3C WOFF File Format 1.0:
 * a 44-byte header, then one 20-byte directory entry per table (tag, offset, compressed length, original length,
 * checksum), each table zlib-compressed when that made it smaller. The sfnt gets the OpenType offset table, the
 * same tables in the same (tag) order, each on a 4-byte boundary with its original checksum.
 */
export function sfntFromWoff(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, index) => {
    const entry = 44 + index * 20;
    const offset = woff.readUInt32BE(entry + 4);
    const compLength = woff.readUInt32BE(entry + 8);
    const origLength = woff.readUInt32BE(entry + 12);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : stored;
    if (data.length !== origLength) throw new Error('a WOFF table unpacked to the wrong length');
    return { tag: woff.subarray(entry, entry + 4), checksum: woff.readUInt32BE(entry + 16), data };
  });
  const padded = (length: number) => (length + 3) & ~3;
  const headerLength = 12 + 16 * numTables;
  const total = tables.reduce((sum, table) => sum + padded(table.data.length), headerLength);
  const sfnt = Buffer.alloc(total);
  // searchRange, entrySelector and rangeShift as the OpenType offset table defines them.
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  sfnt.writeUInt32BE(flavor, 0);
  sfnt.writeUInt16BE(numTables, 4);
  sfnt.writeUInt16BE(searchRange, 6);
  sfnt.writeUInt16BE(entrySelector, 8);
  sfnt.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerLength;
  tables.forEach((table, index) => {
    const record = 12 + index * 16;
    table.tag.copy(sfnt, record);
    sfnt.writeUInt32BE(table.checksum, record + 4);
    sfnt.writeUInt32BE(offset, record + 8);
    sfnt.writeUInt32BE(table.data.length, record + 12);
    table.data.copy(sfnt, offset);
    offset += padded(table.data.length);
  });
  return sfnt;
}

/**
 * A font as pdfkit reads it (its font library's object), which pdfkit takes wherever it takes a font file. Its
 * typings know only files and bytes, so the sheet passes it as one.
 */
type ReadFont = Buffer;

/**
 * The font pdfkit reads from `bytes`, read through a document that is then dropped: pdfkit keeps the font it made
 * as `_font.font` and takes such a font back in place of bytes (checked here, so that a pdfkit that changes either
 * fails at once rather than drawing nothing).
 */
function readFont(bytes: Buffer): ReadFont {
  const reader = new PDFDocument({ autoFirstPage: false });
  reader.font(bytes);
  const font = (reader as unknown as { _font?: { font?: { layout?: unknown } } })._font?.font;
  if (typeof font?.layout !== 'function') throw new Error('pdfkit no longer hands back its fonts');
  return font as unknown as ReadFont;
}

let fonts: { regular: ReadFont; bold: ReadFont } | undefined;

/**
 * The sheet's two weights, read on first use and kept for the life of the thread. Sheets drawn one after another
 * on a thread share them; what each sheet embeds is its own subset.
 */
export function sheetFonts(): { regular: ReadFont; bold: ReadFont } {
  fonts ??= {
    regular: readFont(sfntFromWoff(readFileSync(sheetFontFiles.regular))),
    bold: readFont(sfntFromWoff(readFileSync(sheetFontFiles.bold))),
  };
  return fonts;
}
