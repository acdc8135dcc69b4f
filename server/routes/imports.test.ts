import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tuningOfPreset } from '../../shared/export/preset-tuning';
import { encodeBulkDump } from '../../shared/midi/mts-bulk-dump';
import { previewTable } from '../../shared/tuning/preview';
import { startTestServer } from '../../tests/support/test-server';
import { fifthsPreset, resolvedPreset } from '../../shared/preset/presets.testing';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

const fifths = fifthsPreset('Fen Fifths', 8, 3);

const upload = (bytes: Buffer | string, fileName: string) =>
  request(server.app).post('/api/import').attach('file', Buffer.from(bytes), fileName);

describe('POST /api/import', () => {
  it('turns an .syx bulk dump into a preset that lays the same pitches on every key', async () => {
    const tuning = tuningOfPreset(resolvedPreset(fifths));
    if (!tuning.ok) throw new Error('no tuning');
    const [dump] = encodeBulkDump(tuning.value.keys, {
      deviceId: 0x7f,
      program: 0,
      tuningName: 'FEN FIFTHS',
    }).messages;
    const res = await upload(Buffer.from(dump), 'fen-fifths.syx').expect(200);
    expect(res.body.kind).toBe('syx');
    expect(res.body.document.name).toBe('fen fifths');
    const before = previewTable(resolvedPreset(fifths)).keys;
    const after = previewTable(resolvedPreset(res.body.document)).keys;
    // MIDI Tuning specification: rounding to the nearest frequency word leaves at most
    // 0.0030517578125 cents of error.
    for (let key = 0; key < 128; key++) {
      expect(Math.abs(1200 * Math.log2(after[key].hz! / before[key].hz!))).toBeLessThanOrEqual(
        0.0030517578125 + 1e-9,
      );
    }
  });

  it('checks a preset .json and hands it back with its defaults filled in', async () => {
    const res = await upload(JSON.stringify(fifths), 'fifths.json').expect(200);
    expect(res.body.kind).toBe('preset');
    expect(res.body.document.output).toMatchObject({
      deviceId: 127,
      program: 0,
      bendRange: 2,
      memberChannels: [2, 16],
    });
    const wrong = await upload(JSON.stringify({ ...fifths, version: 7 }), 'future.json').expect(
      400,
    );
    expect(wrong.body.error.field).toBe('version');
  });

  it('reads a text list of intervals, naming the line of a fault', async () => {
    const res = await upload('# a just pentatonic\n9/8\n5/4\n3/2\n5/3\n', 'just-five.txt').expect(
      200,
    );
    expect(res.body.document.scale).toEqual({
      kind: 'list',
      degrees: ['9/8', '5/4', '3/2', '5/3'],
      period: '2/1',
    });
    const bad = await upload('9/8\n1.25\n', 'bad.txt').expect(400);
    expect(bad.body.error.message).toBe(
      'line 2: 1.25 needs a unit: write 1.25c for cents or a ratio such as 3/2',
    );
  });

  it('refuses broken and foreign files with a 4xx that says what was wrong', async () => {
    const cases: [Buffer | string, string, number, RegExp][] = [
      ['', 'empty.syx', 400, /file: is empty/],
      [
        Buffer.from([0xf0, 0x7e, 0x7f, 0x08, 0x01, 0x00, 0x20]),
        'cut.syx',
        400,
        /cut short|never ends/,
      ],
      [
        Buffer.from([
          0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00, 0x08, 0x00, 0x00, 0x00, 0xff, 0xfe,
        ]),
        'song.zip',
        400,
        /neither an \.syx/,
      ],
      [
        Buffer.concat([
          Buffer.from('%PDF-1.4\n%'),
          Buffer.from([0xe2, 0xe3, 0xcf, 0xd3, 0x0a, 0x01, 0x02]),
        ]),
        'sheet.pdf',
        400,
        /neither an \.syx/,
      ],
      ['{"format": "keyloom.preset", ', 'half.json', 400, /not valid JSON/],
      [Buffer.alloc(6 * 1024 * 1024, 0x39), 'huge.txt', 413, /limit of 5 MB/],
    ];
    for (const [bytes, name, status, message] of cases) {
      const res = await upload(bytes, name);
      expect([name, res.status]).toEqual([name, status]);
      expect(res.body.error.message).toMatch(message);
    }
    const none = await request(server.app).post('/api/import').field('note', 'no file').expect(400);
    expect(none.body.error.field).toBe('file');
  });
});
