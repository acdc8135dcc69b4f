// The printable tuner sheet: the degrees of a preset, what to dial into a chromatic tuner for each key of one
// period, and a chart of those offsets. A PDF made with pdfkit and the Roboto font the project ships.
import PDFDocument from 'pdfkit';
import type { ResolvedPreset } from '../../shared/preset/preset-document';
import { nearestEqualTemperedNote, noteName } from '../../shared/tuning/twelve-edo';
import { previewTable } from '../../shared/tuning/preview';
import { sheetFonts } from './sheet-fonts';

export interface SheetRevision {
  revision: number | null;
  savedAt: Date | null;
}

export interface TunerRow {
  key: string;
  degree: number;
  hz: number;
  tunerNote: string;
  offsetCents: number;
}

/**
 * One period of keys from the root key: what each plays and where a chromatic tuner shows it. `table`: the
 * preset's preview table, when the caller has it already.
 */
export function tunerRows(preset: ResolvedPreset, table = previewTable(preset)): TunerRow[] {
  const { keys } = table;
  const { rootKey, keysPerPeriod, concertA } = preset.mapping;
  const rows: TunerRow[] = [];
  for (let key = rootKey; key < Math.min(128, rootKey + keysPerPeriod); key++) {
    const entry = keys[key];
    if (entry.degree === null || entry.hz === null) continue;
    const nearest = nearestEqualTemperedNote(entry.hz, concertA);
    rows.push({
      key: `${noteName(key)} (${key})`,
      degree: entry.degree,
      hz: entry.hz,
      tunerNote: nearest.name,
      offsetCents: nearest.offsetCents,
    });
  }
  return rows;
}

const signed = (cents: number, digits = 1) =>
  `${cents >= 0 ? '+' : '−'}${Math.abs(cents).toFixed(digits)}`;

function describeScale(scale: ResolvedPreset['scale']): string {
  switch (scale.kind) {
    case 'generated':
      return (
        `Generator ${scale.generator} in period ${scale.period}, ${scale.up} up and ${scale.down} down` +
        (Array.isArray(scale.temper)
          ? `, ${scale.temper.filter((link) => link !== null).length} of its ${scale.temper.length} links tempered one by one`
          : scale.temper
            ? `, narrowed by ${scale.temper.fraction} of ${scale.temper.comma}`
            : '')
      );
    case 'equal':
      return `${scale.divisions} equal divisions of ${scale.period}`;
    case 'list':
      return `Ratio list in period ${scale.period}`;
    case 'harmonic':
      return `${scale.sub ? 'Subharmonics' : 'Harmonics'} ${scale.from} to ${scale.to}`;
  }
}

interface Column {
  title: string;
  width: number;
  align?: 'left' | 'right';
}

/** Renders the sheet. The creation date is the revision's own, so the same revision always gives the same bytes. */
export function renderTunerSheet(preset: ResolvedPreset, at: SheetRevision): Promise<Buffer> {
  const table = previewTable(preset);
  const rows = tunerRows(preset, table);
  const created = at.savedAt ?? new Date(0);
  const doc = new PDFDocument({
    size: 'A4',
    margin: 48,
    info: {
      Title: `${preset.name} — tuner sheet`,
      Author: 'Keyloom',
      Creator: 'Keyloom',
      Producer: 'Keyloom',
      CreationDate: created,
      ModDate: created,
    },
  });
  const fonts = sheetFonts();
  doc.registerFont('regular', fonts.regular);
  doc.registerFont('bold', fonts.bold);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const bottom = () => doc.page.height - doc.page.margins.bottom;

  doc.font('bold').fontSize(20).text(preset.name);
  doc.font('regular').fontSize(10).fillColor('#444');
  doc.text(
    at.revision
      ? `Revision ${at.revision}, saved ${created.toISOString().slice(0, 10)}`
      : 'Unsaved design',
  );
  doc.text(describeScale(preset.scale));
  const { rootKey, rootHz, concertA, anchor } = preset.mapping;
  const tunedKey = anchor
    ? `Key ${noteName(anchor.key)} (${anchor.key}) sounds ${anchor.hz} Hz; `
    : '';
  doc.text(
    `${tunedKey}Root key ${noteName(rootKey)} (${rootKey}) = ${rootHz.toFixed(4)} Hz; tuner reference A4 = ${concertA} Hz`,
  );
  doc.fillColor('black').moveDown();

  function drawTable(title: string, columns: Column[], cells: string[][]) {
    const rowHeight = 15;
    const header = () => {
      let x = left;
      const y = doc.y;
      doc.font('bold').fontSize(9);
      for (const c of columns) {
        doc.text(c.title, x, y, { width: c.width - 6, align: c.align ?? 'left', lineBreak: false });
        x += c.width;
      }
      doc.y = y + 13;
      doc
        .moveTo(left, doc.y)
        .lineTo(left + columns.reduce((s, c) => s + c.width, 0), doc.y)
        .strokeColor('#999')
        .stroke();
      doc.y += 3;
    };
    doc.font('bold').fontSize(13).text(title, left);
    doc.moveDown(0.3);
    header();
    doc.font('regular').fontSize(9);
    for (const row of cells) {
      if (doc.y + rowHeight > bottom()) {
        doc.addPage();
        header();
        doc.font('regular').fontSize(9);
      }
      const y = doc.y;
      let x = left;
      row.forEach((cell, i) => {
        doc.text(cell, x, y, {
          width: columns[i].width - 6,
          align: columns[i].align ?? 'left',
          lineBreak: false,
        });
        x += columns[i].width;
      });
      doc.y = y + rowHeight;
    }
    doc.x = left;
    doc.moveDown();
  }

  drawTable(
    'Degrees',
    [
      { title: 'Degree', width: 50, align: 'right' },
      { title: 'Ratio', width: 150 },
      { title: 'Cents', width: 80, align: 'right' },
      { title: 'Step (cents)', width: 80, align: 'right' },
      { title: 'Hz at the root', width: 100, align: 'right' },
    ],
    table.degrees.map((d) => [
      String(d.degree),
      // Written as a word: the font's Latin subset has no glyph for the approximately-equal sign.
      d.ratio ??
        (d.approximation
          ? `about ${d.approximation.ratio} (${d.approximation.errorCents >= 0 ? '+' : '−'}${Math.abs(d.approximation.errorCents).toFixed(1)}c)`
          : '—'),
      d.cents.toFixed(3),
      d.step.cents.toFixed(3),
      (rootHz * 2 ** (d.cents / 1200)).toFixed(3),
    ]),
  );

  drawTable(
    `What to dial into a tuner (A4 = ${concertA} Hz)`,
    [
      { title: 'Key', width: 90 },
      { title: 'Degree', width: 50, align: 'right' },
      { title: 'Hz', width: 90, align: 'right' },
      { title: 'Tuner shows', width: 90 },
      { title: 'Offset (cents)', width: 90, align: 'right' },
    ],
    rows.map((r) => [r.key, String(r.degree), r.hz.toFixed(3), r.tunerNote, signed(r.offsetCents)]),
  );

  drawOffsetChart(doc, rows, left, bottom);
  doc.end();
  return done;
}

/** Bars of each key's offset from the tuner's note, up for sharp and down for flat. */
function drawOffsetChart(
  doc: PDFKit.PDFDocument,
  rows: TunerRow[],
  left: number,
  bottom: () => number,
) {
  const height = 120;
  if (doc.y + height + 40 > bottom()) doc.addPage();
  doc.font('bold').fontSize(13).text('Offsets from equal temperament', left);
  const top = doc.y + 8;
  const width = doc.page.width - 2 * left;
  const limit = Math.max(
    10,
    Math.ceil(Math.max(...rows.map((r) => Math.abs(r.offsetCents)), 0) / 10) * 10,
  );
  const mid = top + height / 2;
  const scale = height / 2 / limit;
  doc.font('regular').fontSize(7).fillColor('#666');
  for (const mark of [limit, limit / 2, 0, -limit / 2, -limit]) {
    const y = mid - mark * scale;
    doc
      .moveTo(left + 30, y)
      .lineTo(left + width, y)
      .strokeColor(mark === 0 ? '#333' : '#ddd')
      .lineWidth(0.5)
      .stroke();
    doc.text(signed(mark, 0), left, y - 3, { width: 26, align: 'right', lineBreak: false });
  }
  const slot = (width - 34) / Math.max(rows.length, 1);
  rows.forEach((row, i) => {
    const x = left + 34 + i * slot + slot * 0.15;
    const barHeight = Math.abs(row.offsetCents) * scale;
    const y = row.offsetCents >= 0 ? mid - barHeight : mid;
    doc
      .rect(x, y, slot * 0.7, Math.max(barHeight, 0.5))
      .fillColor(row.offsetCents >= 0 ? '#b8612d' : '#146871')
      .fill();
    if (rows.length <= 36) {
      doc.fillColor('#333').text(row.tunerNote, x - 4, top + height + 4, {
        width: slot * 0.7 + 8,
        align: 'center',
        lineBreak: false,
      });
    }
  });
  doc.fillColor('black');
  doc.y = top + height + 20;
  doc.x = left;
}
