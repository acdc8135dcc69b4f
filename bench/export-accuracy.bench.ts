// The largest pitch error of every export format over a corpus of scales, each as a ratio against what that
// format can hold at best (its floor: half of its smallest step). A ratio of 1.00 or less means every key lands
// on the nearest value the format has. Run: npx tsx bench/export-accuracy.bench.ts
import { parse as parseCsv } from 'csv-parse/sync';
import { parseMidi } from 'midi-file';
import { renderExport } from '../shared/export/export-catalogue';
import { tuningOfPreset } from '../shared/export/preset-tuning';
import { decodeMtsStream } from '../shared/midi/mts-decode';
import { parsePresetDocument, type ResolvedPreset } from '../shared/preset/preset-document';

const corpus: [string, object, object?][] = [
  ['twelve pure fifths', { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 }],
  [
    'quarter-comma meantone',
    {
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 8,
      down: 3,
      temper: { comma: '81/80', fraction: '1/4' },
    },
  ],
  [
    'seven fifths, white keys',
    { kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 },
    { keysPerPeriod: 12, layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6] },
  ],
  ['31 equal', { kind: 'equal', divisions: 31, period: '2/1' }],
  ['53 equal', { kind: 'equal', divisions: 53, period: '2/1' }],
  ['13 equal of 3/1', { kind: 'equal', divisions: 13, period: '3/1' }],
  ['harmonics 8-16', { kind: 'harmonic', from: 8, to: 16 }],
  ['subharmonics 6-12', { kind: 'harmonic', from: 6, to: 12, sub: true }],
  [
    'just major',
    { kind: 'list', degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'], period: '2/1' },
  ],
  [
    'twelve just',
    {
      kind: 'list',
      degrees: ['16/15', '9/8', '6/5', '5/4', '4/3', '45/32', '3/2', '8/5', '5/3', '9/5', '15/8'],
      period: '2/1',
    },
  ],
  [
    'twelve random cents',
    {
      kind: 'list',
      degrees: Array.from({ length: 11 }, (_, i) => `${(i + 1) * 100 + ((i * 37) % 19) - 9.3}c`),
      period: '2/1',
    },
  ],
];

function preset(name: string, scale: object, mapping: object = {}): ResolvedPreset {
  const parsed = parsePresetDocument({
    format: 'keyloom.preset',
    version: 1,
    name,
    scale,
    mapping: { rootKey: 60, ...mapping },
    output: { bendRange: 2 },
  });
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return parsed.value;
}

const centsBetween = (a: number, b: number) => Math.abs(1200 * Math.log2(a / b));
const mtsUnit = 100 / 16384;

/** Each format: its floor in cents, and the pitch each key gets from the file, read back. */
const formats: Record<
  string,
  { floor: number; read: (bytes: Uint8Array, preset: ResolvedPreset) => Map<number, number> }
> = {
  'mts-bulk': { floor: mtsUnit / 2, read: readSyx },
  'mts-bulk-bank': { floor: mtsUnit / 2, read: readSyx },
  'mts-notes': { floor: mtsUnit / 2, read: readSyx },
  'mts-octave-1': { floor: 0.5, read: readSyx },
  'mts-octave-2': { floor: 100 / 8192 / 2, read: readSyx },
  smf: { floor: mtsUnit / 2, read: readSmfSysex },
  'bend-csv': { floor: (100 * 2) / 8192 / 2, read: readBendCsv },
  'bend-json': { floor: (100 * 2) / 8192 / 2, read: readBendJson },
  sfz: { floor: 0.5, read: readSfz },
};

/**
 * The MPE phrase: each note's pitch from its channel's bend and bend range (RPN 0), matched to the key whose
 * exact pitch it is nearest. Returns the worst error and the floor at the file's own bend range.
 */
function mpeSmfError(
  bytes: Uint8Array,
  exact: Map<number, number>,
): { error: number; floor: number } {
  const song = parseMidi(bytes);
  const bend = new Map<number, number>();
  const range = new Map<number, number>();
  const rpn = new Map<number, number[]>();
  let error = 0;
  let widest = 0;
  for (const e of song.tracks.flat()) {
    if (e.type === 'controller' && (e.controllerType === 0x65 || e.controllerType === 0x64)) {
      rpn.set(e.channel, [...(rpn.get(e.channel) ?? []), e.value].slice(-2));
    } else if (
      e.type === 'controller' &&
      e.controllerType === 0x06 &&
      rpn.get(e.channel)?.join() === '0,0'
    ) {
      range.set(e.channel, e.value);
    } else if (e.type === 'pitchBend') {
      bend.set(e.channel, e.value + 8192);
    } else if (e.type === 'noteOn' && e.velocity > 0) {
      const r = range.get(e.channel) ?? 2;
      widest = Math.max(widest, r);
      const hz = bendHz(e.noteNumber, bend.get(e.channel) ?? 8192, r);
      let nearest = Infinity;
      for (const target of exact.values()) nearest = Math.min(nearest, centsBetween(hz, target));
      error = Math.max(error, nearest);
    }
  }
  return { error, floor: (100 * widest) / 8192 / 2 };
}

function readSyx(bytes: Uint8Array): Map<number, number> {
  const decoded = decodeMtsStream(bytes);
  if (!decoded.ok) throw new Error(decoded.errors[0].message);
  return new Map(decoded.value.keys.filter((k) => k.hz !== null).map((k) => [k.key, k.hz!]));
}

function readSmfSysex(bytes: Uint8Array): Map<number, number> {
  const song = parseMidi(bytes);
  const dump = song.tracks.flat().find((e) => e.type === 'sysEx' && e.data[3] === 0x01);
  if (!dump || dump.type !== 'sysEx') throw new Error('no bulk dump in the song');
  return readSyx(Uint8Array.from([0xf0, ...Array.from(dump.data)]));
}

const bendHz = (note: number, bend14: number, range: number) =>
  440 * 2 ** ((note + ((bend14 - 8192) / 8192) * range - 69) / 12);

function readBendCsv(bytes: Uint8Array, p: ResolvedPreset): Map<number, number> {
  const rows = parseCsv(Buffer.from(bytes), { columns: true }) as Record<string, string>[];
  const columns = Object.keys(rows[0]);
  const column = (pattern: RegExp) => columns.find((c) => pattern.test(c))!;
  const [key, note, bend] = [column(/^key$/i), column(/note/i), column(/bend/i)];
  return new Map(
    rows.map((r) => [Number(r[key]), bendHz(Number(r[note]), Number(r[bend]), p.output.bendRange)]),
  );
}

function readBendJson(bytes: Uint8Array, p: ResolvedPreset): Map<number, number> {
  const table = JSON.parse(new TextDecoder().decode(bytes));
  const rows: Record<string, number>[] = table.rows ?? table.keys ?? table;
  return new Map(
    rows.map((r) => [
      r['key'],
      bendHz(r['note'], r['bendValue14'] ?? r['bend'], p.output.bendRange),
    ]),
  );
}

/** The sampler plays a sample of middle C (key 60 at A4 = 440 Hz) moved by (key - pitch_keycenter) semitones plus tune cents. */
function readSfz(bytes: Uint8Array): Map<number, number> {
  const map = new Map<number, number>();
  for (const region of new TextDecoder().decode(bytes).split('<region>').slice(1)) {
    const field = (name: string) =>
      Number(region.match(new RegExp(`\\b${name}=(-?[\\d.]+)`))?.[1] ?? 0);
    const key = field('lokey');
    map.set(
      key,
      440 *
        2 ** ((60 - 69) / 12) *
        2 ** (((key - field('pitch_keycenter')) * 100 + field('tune')) / 1200),
    );
  }
  return map;
}

const worst: Record<string, { error: number; scale: string }> = {};
let mpeWorst = { error: 0, floor: 0, scale: '' };
for (const [name, scale, mapping] of corpus) {
  const p = preset(name, scale, mapping);
  const tuning = tuningOfPreset(p);
  if (!tuning.ok) throw new Error(tuning.errors[0].message);
  const exact = new Map(
    tuning.value.keys.filter((k) => k.hz !== null && !k.outOfMtsRange).map((k) => [k.key, k.hz!]),
  );
  for (const [format, { read }] of Object.entries(formats)) {
    const file = renderExport(p, format);
    if (!file.ok) continue;
    const got = read(file.value.bytes, p);
    for (const [key, hz] of exact) {
      const back = got.get(key);
      if (back === undefined) continue;
      const error = centsBetween(back, hz);
      if (!worst[format] || error > worst[format].error) worst[format] = { error, scale: name };
    }
  }
  const mpe = renderExport(p, 'mpe-smf');
  if (mpe.ok) {
    const found = mpeSmfError(mpe.value.bytes, exact);
    if (found.error / found.floor > mpeWorst.error / (mpeWorst.floor || 1))
      mpeWorst = { ...found, scale: name };
  }
}

console.log(
  `Largest pitch error per export format over ${corpus.length} scales (floor: half the format's smallest step)`,
);
for (const [format, { floor }] of Object.entries(formats)) {
  const w = worst[format];
  if (!w) {
    console.log(`  ${format.padEnd(13)} no scale of the corpus applies`);
    continue;
  }
  console.log(
    `  ${format.padEnd(13)} ${w.error.toFixed(6)} cents, floor ${floor.toFixed(6)}: ratio ${(w.error / floor).toFixed(2)} (worst: ${w.scale})`,
  );
}
const m = mpeWorst;
console.log(
  `  ${'mpe-smf'.padEnd(13)} ${m.error.toFixed(6)} cents, floor ${m.floor.toFixed(6)}: ratio ${(m.error / m.floor).toFixed(2)} (worst: ${m.scale})`,
);
