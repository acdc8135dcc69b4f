// Fuzzing the parsers a user types into: every input gets an answer (a value or faults that name their field),
// never an exception, a hang or a leak. 10,000 cases each.
import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { parseInterval } from '../../shared/tuning/interval';
import { previewTable } from '../../shared/tuning/preview';
import { exportFormats, renderExport } from '../../shared/export/export-catalogue';
import { decodeMtsStream } from '../../shared/midi/mts-decode';
import { firstNonFinite } from '../../shared/tuning/finite-numbers';

const runs = 10_000;
/** Any single case taking longer than this counts as a hang (generous: the machine may be busy with other work). */
const slowestMs = 2000;

/** Text shaped like intervals: digits, slashes, backslashes, units, signs, dots, spaces and stray characters. */
const intervalish = fc
  .array(
    fc.constantFrom(
      '0',
      '1',
      '2',
      '3',
      '5',
      '7',
      '9',
      '/',
      '\\',
      '.',
      'c',
      '¢',
      '-',
      '+',
      ' ',
      'e',
      'x',
      '٣',
      '\u0000',
    ),
    { maxLength: 24 },
  )
  .map((parts) => parts.join(''));

const anyText = fc.oneof(
  fc.string({ maxLength: 64 }),
  fc.string({ unit: 'binary', maxLength: 64 }),
  intervalish,
  fc.bigInt().map(String),
);

function timed<T>(work: () => T): T {
  const started = performance.now();
  const value = work();
  expect(performance.now() - started).toBeLessThan(slowestMs);
  return value;
}

describe('fuzzing the interval parser', () => {
  it('answers every text with an interval or a fault that names the field', () => {
    fc.assert(
      fc.property(anyText, (text) => {
        const result = timed(() => parseInterval(text, 'scale.generator'));
        if (!result.ok) {
          expect(result.errors.length).toBeGreaterThan(0);
          for (const e of result.errors)
            expect(e.message.startsWith('scale.generator: ')).toBe(true);
        }
      }),
      { numRuns: runs },
    );
  });
});

/** Mostly the right thing, now and then anything at all. */
const mostly = <T>(right: fc.Arbitrary<T>) =>
  fc.oneof({ weight: 12, arbitrary: right }, { weight: 1, arbitrary: fc.anything() });

/** Documents near the real shape: each field sometimes right, sometimes anything at all. */
/** Sizes at the edges of what can be written: huge terms, huge cents, huge step counts. */
const hugeText = fc.constantFrom(
  '9'.repeat(400),
  '9'.repeat(63) + 'c',
  '3000000000\\1',
  '1/' + '9'.repeat(60),
  '9'.repeat(30) + '/7',
  '4294967296/1',
);
const intervalText = fc.oneof(
  { weight: 1, arbitrary: intervalish },
  {
    weight: 4,
    arbitrary: fc.constantFrom(
      '3/2',
      '2/1',
      '3/1',
      '81/80',
      '1/4',
      '701.955c',
      '7\\12',
      '0/1',
      '1/0',
      '-3/2',
    ),
  },
  { weight: 1, arbitrary: hugeText },
);
const nearlyDocument = fc.record(
  {
    format: mostly(fc.constant('keyloom.preset')),
    version: mostly(fc.constant(1)),
    name: mostly(fc.string({ minLength: 1, maxLength: 30 })),
    scale: fc.oneof(
      fc.record(
        {
          kind: fc.constant('generated'),
          generator: intervalText,
          period: intervalText,
          up: mostly(fc.integer({ min: -3, max: 80 })),
          down: fc.integer({ min: -3, max: 80 }),
          temper: fc.option(fc.record({ comma: intervalText, fraction: intervalText }), {
            nil: undefined,
          }),
        },
        { requiredKeys: ['kind', 'generator', 'period', 'up', 'down'] },
      ),
      fc.record({
        kind: fc.constant('equal'),
        divisions: fc.oneof(
          { weight: 6, arbitrary: fc.integer({ min: -2, max: 400 }) },
          { weight: 1, arbitrary: fc.double() },
        ),
        period: intervalText,
      }),
      fc.record({
        kind: fc.constant('list'),
        degrees: fc.array(intervalText, { maxLength: 20 }),
        period: intervalText,
      }),
      fc.record({
        kind: fc.constant('harmonic'),
        from: fc.integer({ min: -2, max: 300 }),
        to: fc.integer({ min: -2, max: 300 }),
        sub: fc.boolean(),
      }),
    ),
    mapping: fc.oneof(
      fc.record(
        {
          rootKey: mostly(fc.integer({ min: -5, max: 140 })),
          rootHz: fc.option(fc.double({ min: -10, max: 30000, noNaN: false }), {
            nil: undefined,
            freq: 2,
          }),
          concertA: fc.option(fc.double({ min: -10, max: 2000 }), { nil: undefined, freq: 2 }),
          layout: fc.option(
            fc.array(fc.option(fc.integer({ min: -2, max: 20 }), { nil: null }), { maxLength: 30 }),
            { nil: undefined },
          ),
        },
        { requiredKeys: ['rootKey'] },
      ),
    ),
    output: fc.option(fc.anything(), { nil: undefined, freq: 2 }),
  },
  { requiredKeys: ['format', 'version', 'name', 'scale', 'mapping'] },
);

describe('fuzzing the preset document', () => {
  it('answers every document with a preset that previews on 128 keys, or faults that name their fields', () => {
    const heapBefore = process.memoryUsage().heapUsed;
    let accepted = 0;
    fc.assert(
      fc.property(
        fc.oneof({ weight: 9, arbitrary: nearlyDocument }, { weight: 1, arbitrary: fc.anything() }),
        (input) => {
          const result = timed(() => parsePresetDocument(input));
          if (result.ok) {
            accepted++;
            const table = timed(() => previewTable(result.value));
            expect(table.keys).toHaveLength(128);
          } else {
            for (const e of result.errors) expect(e.message.startsWith(`${e.path}: `)).toBe(true);
          }
        },
      ),
      { numRuns: runs },
    );
    // The generator must reach the valid side too, or the property says little.
    expect(accepted).toBeGreaterThan(100);
    global.gc?.();
    expect(process.memoryUsage().heapUsed - heapBefore).toBeLessThan(200 * 1024 * 1024);
  });
});

describe('no table, file or stored document carries NaN or an infinite value', () => {
  it('holds for the preview and every export format of every document that is accepted', () => {
    let accepted = 0;
    fc.assert(
      fc.property(nearlyDocument, (input) => {
        const result = parsePresetDocument(input);
        if (!result.ok) return;
        accepted++;
        // What is stored is the document as sent: it went through JSON, so it holds no NaN; what is built from it:
        expect(firstNonFinite(result.value)).toBeNull();
        const table = previewTable(result.value);
        expect(firstNonFinite(table)).toBeNull();
        for (const key of table.keys) if (key.degree !== null) expect(key.hz).toBeGreaterThan(0);
        for (const format of exportFormats) {
          const file = renderExport(result.value, format.id);
          if (!file.ok) continue;
          const bytes = file.value.bytes;
          if (format.extension === 'syx') {
            // A layout with no mapped key gives a file with nothing to tune, which reads back as such.
            const decoded = decodeMtsStream(bytes);
            if (decoded.ok) expect(firstNonFinite(decoded.value.keys)).toBeNull();
            else
              expect(decoded.errors[0].message, format.id).toMatch(
                /holds no tuning|holds nothing|empty/,
              );
          } else if (format.extension !== 'mid') {
            const text = new TextDecoder().decode(bytes);
            expect(text, format.id).not.toMatch(/NaN|Infinity/);
            if (format.extension === 'json') expect(firstNonFinite(JSON.parse(text))).toBeNull();
          }
        }
      }),
      { numRuns: 5000 },
    );
    expect(accepted).toBeGreaterThan(50);
  });
});
