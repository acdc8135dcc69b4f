// Fuzzing what users upload: MTS decoders, the song reader and retuner, and the import endpoint. Random bytes and
// valid files with bytes flipped, cut or spliced: every input gets a value or an error, never an exception, a
// 5xx, a hang or a leak. 10,000 cases each.
import * as fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderExport } from '../../shared/export/export-catalogue';
import { tuningOfPreset } from '../../shared/export/preset-tuning';
import { decodeMtsStream } from '../../shared/midi/mts-decode';
import { readSong } from '../../shared/midi/smf-reader';
import { retuneSong } from '../../shared/midi/song-retune';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { startTestServer } from '../support/test-server';

const runs = 10_000;
const slowestMs = 2000;

const parsed = parsePresetDocument({
  format: 'keyloom.preset',
  version: 1,
  name: 'Fuzz Fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
  mapping: { rootKey: 60 },
});
if (!parsed.ok) throw new Error('bad fuzz preset');
const preset = parsed.value;
const file = (format: string) => {
  const rendered = renderExport(preset, format);
  if (!rendered.ok) throw new Error(rendered.errors[0].message);
  return rendered.value.bytes;
};
const tuning = (() => {
  const t = tuningOfPreset(preset);
  if (!t.ok) throw new Error('no tuning');
  return { keys: t.value.keys, output: preset.output };
})();

/** A valid file with some bytes changed, a piece cut off, or random bytes spliced in. */
function damaged(seeds: Uint8Array[]): fc.Arbitrary<Uint8Array> {
  return fc
    .tuple(
      fc.constantFrom(...seeds),
      fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 255 })), { maxLength: 8 }),
      fc.option(fc.nat(), { nil: undefined }),
      fc.uint8Array({ maxLength: 16 }),
    )
    .map(([seed, flips, cut, splice]) => {
      const bytes = Uint8Array.from(seed);
      for (const [at, value] of flips) if (bytes.length > 0) bytes[at % bytes.length] = value;
      const kept = cut === undefined ? bytes : bytes.subarray(0, cut % (bytes.length + 1));
      return Uint8Array.from([...kept, ...splice]);
    });
}

const bytesToFuzz = (seeds: Uint8Array[]) =>
  fc.oneof(
    { weight: 3, arbitrary: damaged(seeds) },
    { weight: 1, arbitrary: fc.uint8Array({ maxLength: 600 }) },
  );

function timed<T>(work: () => T): T {
  const started = performance.now();
  const value = work();
  expect(performance.now() - started).toBeLessThan(slowestMs);
  return value;
}

describe('fuzzing the MTS decoders', () => {
  it('reads every byte string as a tuning or an error, never throwing', () => {
    const seeds = ['mts-bulk', 'mts-bulk-bank', 'mts-notes', 'mts-octave-1', 'mts-octave-2'].map(
      file,
    );
    let decoded = 0;
    fc.assert(
      fc.property(bytesToFuzz(seeds), (bytes) => {
        const result = timed(() => decodeMtsStream(bytes));
        if (result.ok) {
          decoded++;
          expect(result.value.keys).toHaveLength(128);
        } else {
          expect(result.errors[0].message.length).toBeGreaterThan(10);
        }
      }),
      { numRuns: runs },
    );
    expect(decoded).toBeGreaterThan(0);
  });
});

describe('fuzzing the song reader and retuner', () => {
  it('reads and retunes every byte string, or says what is wrong, never throwing', () => {
    const seeds = [file('smf'), file('mpe-smf')];
    const heapBefore = process.memoryUsage().heapUsed;
    fc.assert(
      fc.property(
        bytesToFuzz(seeds),
        fc.constantFrom('mts' as const, 'mpe' as const),
        (bytes, mode) => {
          timed(() => readSong(bytes, () => {}));
          const result = timed(() => retuneSong(bytes, tuning, mode));
          if (!result.ok) expect(result.errors[0].message.length).toBeGreaterThan(10);
        },
      ),
      { numRuns: runs },
    );
    expect(process.memoryUsage().heapUsed - heapBefore).toBeLessThan(200 * 1024 * 1024);
  });
});

describe('fuzzing the import endpoint', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(() => server.close());

  it('answers every upload with a preset or a 4xx in the JSON error shape, never a 5xx', async () => {
    const text = new TextEncoder();
    const seeds = [
      file('mts-bulk'),
      file('mts-notes'),
      file('preset'),
      text.encode('9/8\n5/4\n# c\n3/2\nperiod 2/1\n'),
    ];
    await fc.assert(
      fc.asyncProperty(
        bytesToFuzz(seeds),
        fc.constantFrom('a.syx', 'b.json', 'c.txt', 'd.mid', ''),
        async (bytes, name) => {
          const res = await request(server.app)
            .post('/api/import')
            .attach('file', Buffer.from(bytes), name || 'upload');
          expect(res.status).toBeLessThan(500);
          if (res.status !== 200) expect(typeof res.body.error?.message).toBe('string');
        },
      ),
      { numRuns: runs },
    );
  }, 300_000);
});
