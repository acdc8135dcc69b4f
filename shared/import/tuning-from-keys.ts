// A preset from a 128-key table of pitches, as an .syx file of MTS messages sets it: the degrees are found
// relative to a root key, and the smallest block of keys that repeats by one constant interval is the period.
import type { KeyPitch } from '../midi/frequency-word';
import type { PresetDocument } from '../preset/preset-document';
import { type Result, fail, fieldError, succeed } from '../result';

/** Two pitches read from MTS words agree to within this many cents (two rounding steps of 0.0061 cents). */
const mtsAgreementCents = 0.013;
/** The most keys one period may span in a found repetition. */
const widestBlock = 64;
/** The widest span a scale that does not repeat may cover (the scale builders' limit of 8 octaves). */
const widestSpanCents = 9600;

const centsAboveKey0 = (hz: number) => 1200 * Math.log2(hz / 440) + 6900;
/** Cents written with enough decimals that re-encoding gives back the same MTS word. */
const writeCents = (cents: number) => `${Number(cents.toFixed(7))}c`;

export interface KeyImport {
  document: PresetDocument;
  /** Whether a repeating period was found, or the keys were taken as they are. */
  repeats: boolean;
}

function rootOf(mapped: number[]): number {
  return mapped.reduce(
    (best, key) => (Math.abs(key - 60) < Math.abs(best - 60) ? key : best),
    mapped[0],
  );
}

interface Repetition {
  keys: number;
  cents: number;
}

/** Whether every key's pitch (and every unmapped key) repeats `block` keys higher, by one constant interval. */
function repetition(cents: (number | null)[], block: number): Repetition | null {
  let size: number | null = null;
  let pairs = 0;
  for (let key = 0; key + block < cents.length; key++) {
    const low = cents[key];
    const high = cents[key + block];
    if ((low === null) !== (high === null)) return null;
    if (low === null || high === null || atMtsEdge(low) || atMtsEdge(high)) continue;
    const step = high - low;
    size ??= step;
    if (step <= 0 || Math.abs(step - size) > mtsAgreementCents) return null;
    pairs++;
  }
  return size !== null && pairs >= block && size <= widestSpanCents
    ? { keys: block, cents: size }
    : null;
}

/** The lowest and highest pitches MTS can send, in cents above key 0: exports clamp what lies beyond to these. */
const highestMtsCents = 12700 + (16382 / 16384) * 100;
const atMtsEdge = (c: number) => c <= 1e-6 || c >= highestMtsCents - 1e-6;

const closeTo = (cents: number, target: number) => Math.abs(cents - target) <= mtsAgreementCents;

/**
 * The period of a table: of the blocks of keys that repeat, one that spans an octave if there is one (as a
 * musician reads an equal-tempered table), else one that spans 3/1, else the smallest.
 */
function findPeriod(cents: (number | null)[]): Repetition | null {
  const found: Repetition[] = [];
  for (let block = 1; block <= widestBlock; block++) {
    const r = repetition(cents, block);
    if (r) found.push(r);
  }
  const tritave = 1200 * Math.log2(3);
  return (
    found.find((r) => closeTo(r.cents, 1200)) ??
    found.find((r) => closeTo(r.cents, tritave)) ??
    found[0] ??
    null
  );
}

/**
 * Lays the keys of one block out as degrees: the distinct pitches (reduced into the period when it repeats)
 * become the degrees, sorted, and the layout says which key plays which.
 */
function layOut(offsets: (number | null)[], periodCents: number | null) {
  const reduce = (c: number) =>
    periodCents === null ? c : ((c % periodCents) + periodCents) % periodCents;
  const distinct: number[] = [];
  for (const offset of offsets) {
    if (offset === null) continue;
    const c = reduce(offset);
    if (!distinct.some((d) => Math.abs(d - c) <= mtsAgreementCents)) distinct.push(c);
  }
  distinct.sort((a, b) => a - b);
  const layout = offsets.map((offset) =>
    offset === null
      ? null
      : distinct.findIndex((d) => Math.abs(d - reduce(offset)) <= mtsAgreementCents),
  );
  return { degrees: distinct.slice(1), layout };
}

export function presetFromKeys(keys: KeyPitch[], name: string): Result<KeyImport> {
  const cents = keys.map((k) => (k.hz === null ? null : centsAboveKey0(k.hz)));
  const mapped = cents.flatMap((c, key) => (c === null ? [] : [key]));
  if (mapped.length === 0) return fail([fieldError('file', 'the tuning sets no key to any pitch')]);
  const period = findPeriod(cents);

  if (period) {
    const rootKey = rootOf(mapped);
    const block = Array.from({ length: period.keys }, (_, i) => {
      const key = rootKey + i < 128 ? rootKey + i : rootKey + i - period.keys;
      const c = cents[key];
      return c === null ? null : c - cents[rootKey]! + (key < rootKey ? period.cents : 0);
    });
    const { degrees, layout } = layOut(block, period.cents);
    const identity = layout.every((d, i) => d === i);
    const periodText = closeTo(period.cents, 1200)
      ? '2/1'
      : closeTo(period.cents, 1200 * Math.log2(3))
        ? '3/1'
        : writeCents(period.cents);
    return succeed({
      repeats: true,
      document: {
        format: 'keyloom.preset',
        version: 1,
        name,
        notes: `Imported from MTS data: ${period.keys} keys repeat every ${period.cents.toFixed(4)} cents.`,
        scale: { kind: 'list', degrees: degrees.map(writeCents), period: periodText },
        mapping: {
          rootKey,
          rootHz: keys[rootKey].hz!,
          ...(identity ? {} : { keysPerPeriod: period.keys, layout }),
        },
      },
    });
  }

  const lowest = mapped[0];
  const span = cents[mapped[mapped.length - 1]]! - cents[lowest]!;
  if (span >= widestSpanCents) {
    return fail([
      fieldError(
        'file',
        `the tuning does not repeat and spans ${(span / 1200).toFixed(1)} octaves; Keyloom takes at most 8 octaves of keys that do not repeat`,
      ),
    ]);
  }
  const offsets = Array.from({ length: 128 }, (_, i) =>
    lowest + i < 128 && cents[lowest + i] !== null ? cents[lowest + i]! - cents[lowest]! : null,
  );
  const { degrees, layout } = layOut(offsets, null);
  const periodCents = Math.min(widestSpanCents, Math.max(1200, Math.ceil(span) + 100));
  return succeed({
    repeats: false,
    document: {
      format: 'keyloom.preset',
      version: 1,
      name,
      notes:
        `Imported from MTS data. The tuning does not repeat, so it is kept as a list over the ${mapped.length} keys ` +
        'the file tunes; the other keys are left unmapped.',
      scale: { kind: 'list', degrees: degrees.map(writeCents), period: `${periodCents}c` },
      mapping: { rootKey: lowest, rootHz: keys[lowest].hz!, keysPerPeriod: 128, layout },
    },
  });
}
