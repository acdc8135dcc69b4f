import { parse as parseCsv } from 'csv-parse/sync';
import { parseMidi } from 'midi-file';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exportFormats } from '../../shared/export/export-catalogue';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { previewTable } from '../../shared/tuning/preview';
import { asBytes } from '../../tests/support/binary-response';
import { startTestServer } from '../../tests/support/test-server';
import { readZip } from '../../tests/support/zip';
import { fifthsPreset } from '../../shared/preset/presets.testing';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

const fifths = fifthsPreset('Fen Fifths!', 8, 3);
const bp = {
  ...fifths,
  name: 'Tritave Thirteen',
  scale: { kind: 'equal', divisions: 13, period: '3/1' },
};

const exportOf = (format: string, document: object = fifths) =>
  asBytes(request(server.app).post(`/api/preview/export/${format}`).send(document));

async function pdfText(bytes: Buffer): Promise<string> {
  const pdf = await getDocument({ data: new Uint8Array(bytes), isEvalSupported: false }).promise;
  const page = await pdf.getPage(1);
  return (await page.getTextContent()).items.map((i) => ('str' in i ? i.str : '')).join(' ');
}

/** Reads a file of each kind with a reader that is not Keyloom's own, and says what it found. */
async function readIndependently(name: string, bytes: Buffer): Promise<string> {
  if (name.endsWith('.mid')) {
    const song = parseMidi(bytes);
    return `midi ${song.tracks.length} tracks, ${song.tracks.flat().filter((e) => e.type === 'noteOn' && e.velocity > 0).length} notes`;
  }
  if (name.endsWith('.syx')) {
    expect(bytes[0]).toBe(0xf0);
    expect(bytes[bytes.length - 1]).toBe(0xf7);
    return `syx ${bytes.length} bytes`;
  }
  if (name.endsWith('.csv')) return `csv ${parseCsv(bytes, { columns: true }).length} rows`;
  if (name.endsWith('.json'))
    return `json ${Object.keys(JSON.parse(bytes.toString('utf8'))).length} fields`;
  if (name.endsWith('.sfz'))
    return `sfz ${(bytes.toString('utf8').match(/<region>/g) ?? []).length} regions`;
  if (name.endsWith('.pdf'))
    return `pdf ${(await pdfText(bytes)).includes('Fen Fifths') ? 'names the preset' : 'says nothing'}`;
  return 'unknown';
}

describe('downloads of an unsaved design', () => {
  it('answers every export id with its content type, a safe file name and a file an independent reader opens', async () => {
    for (const format of [...exportFormats.map((f) => f.id), 'tuner-sheet']) {
      const res = await exportOf(format);
      expect([format, res.status]).toEqual([format, 200]);
      const disposition = res.headers['content-disposition'];
      expect(disposition).toMatch(/^attachment; filename="fen-fifths[\w.-]*"$/);
      const summary = await readIndependently(disposition.match(/filename="(.*)"/)![1], res.body);
      expect(summary).not.toMatch(/unknown|says nothing|\b0 (notes|rows|regions)/);
    }
  });

  it('writes a bulk dump of 408 bytes with a correct checksum', async () => {
    const res = await exportOf('mts-bulk');
    expect(res.body.length).toBe(408);
    // MIDI Tuning specification: checksum = XOR of every byte after F0 up to the last data byte,
    // AND 7F.
    let checksum = 0;
    for (let i = 1; i < 406; i++) checksum ^= res.body[i];
    expect(res.body[406]).toBe(checksum & 0x7f);
  });

  it('refuses scale/octave tuning for a layout that is not 12 keys per octave, and an unknown format, by field', async () => {
    const octave = await exportOf('mts-octave-1', bp);
    expect(octave.status).toBe(400);
    expect(JSON.parse(octave.body.toString()).error.message).toMatch(/12/);
    const unknown = await exportOf('wav');
    expect(unknown.status).toBe(400);
    expect(JSON.parse(unknown.body.toString()).error).toMatchObject({
      code: 'unknown_format',
      field: 'format',
    });
  });

  it('gives back the same 128-key table when its own .syx and preset exports are imported', async () => {
    const before = previewTable(valid(fifths)).keys;
    for (const format of ['mts-bulk', 'mts-notes', 'preset']) {
      const file = await exportOf(format);
      const imported = await request(server.app)
        .post('/api/import')
        .attach('file', file.body, `fen-fifths.${format === 'preset' ? 'json' : 'syx'}`);
      expect([format, imported.status]).toEqual([format, 200]);
      const after = previewTable(valid(imported.body.document)).keys;
      // MIDI Tuning specification: the nearest frequency word is at most 0.0030517578125 cents
      // away.
      const tolerance = format === 'preset' ? 1e-9 : 0.0030517578125 + 1e-9;
      for (let key = 0; key < 128; key++) {
        expect(Math.abs(1200 * Math.log2(after[key].hz! / before[key].hz!))).toBeLessThanOrEqual(
          tolerance,
        );
      }
    }
  });
});

function valid(document: unknown) {
  const parsed = parsePresetDocument(document);
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return parsed.value;
}

describe('downloads of saved and shared presets, and the bundle', () => {
  it('bundles every export that applies with a read-me, the same bytes each time, readable by an independent zip reader', async () => {
    const owner = await server.signIn('exports-owner');
    const created = await owner.agent
      .post('/api/presets')
      .set('X-XSRF-TOKEN', owner.xsrf)
      .send({ document: fifths })
      .expect(201);
    const first = await asBytes(owner.agent.get(`/api/presets/${created.body.id}/bundle`));
    expect(first.status).toBe(200);
    expect(first.headers['content-type']).toBe('application/zip');
    const second = await asBytes(owner.agent.get(`/api/presets/${created.body.id}/bundle`));
    expect(second.body.equals(first.body)).toBe(true);

    const files = await readZip(first.body);
    const names = [...files.keys()];
    expect(names[0]).toBe('READ-ME.txt');
    expect(names).toContain('fen-fifths-tuner-sheet.pdf');
    expect(names.filter((n) => n.endsWith('.mid'))).toHaveLength(2);
    const readMe = files.get('READ-ME.txt')!.toString('utf8');
    for (const name of names.slice(1)) {
      expect(readMe).toContain(name);
      expect(await readIndependently(name, files.get(name)!)).not.toMatch(/unknown|says nothing/);
    }
    expect(readMe).toMatch(/overwrites the tuning program/);

    const outsider = await server.signIn('exports-outsider');
    await outsider.agent.get(`/api/presets/${created.body.id}/export/smf`).expect(404);
    const share = await owner.agent
      .post(`/api/presets/${created.body.id}/shares`)
      .set('X-XSRF-TOKEN', owner.xsrf)
      .send({})
      .expect(201);
    const shared = await asBytes(
      request(server.app).get(`/api/shared/${share.body.token}/export/sfz`),
    );
    expect(shared.status).toBe(200);
    expect(await readIndependently('x.sfz', shared.body)).toMatch(/^sfz \d+ regions$/);
  });

  it('leaves scale/octave files out of the bundle of a non-12 layout and says why in the read-me', async () => {
    const res = await asBytes(request(server.app).post('/api/preview/export/bundle').send(bp));
    const files = await readZip(res.body);
    expect([...files.keys()].some((n) => n.includes('mts-octave'))).toBe(false);
    expect(files.get('READ-ME.txt')!.toString()).toMatch(/Not included[\s\S]*mts-octave-1/);
  });
});
