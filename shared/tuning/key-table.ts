import { type FieldError, fieldError } from '../result';
import type { Scale } from './scale-spec';
import { centsFromEqualTempered } from './twelve-edo';

/** How the scale lies across the keys (the preset's mapping), the root pitch resolved. */
export interface KeyMapping {
  /** The key that plays degree 0 at `rootHz`. */
  rootKey: number;
  rootHz: number;
  /** A4 (key 69) of the equal-tempered reference that `centsFrom12` is measured against. */
  concertA: number;
  /**
   * One block of keys: each entry the degree the key plays, or null for an unmapped key. Each block
   * starting at `rootKey` goes up one period. Null: consecutive keys take consecutive degrees, a
   * period every scale size.
   */
  layout: (number | null)[] | null;
}

export interface KeyEntry {
  key: number;
  degree: number | null;
  hz: number | null;
  /** Cents above (+) or below (-) the root key's pitch. */
  centsFromRoot: number | null;
  /** Cents from this key's own twelve-tone equal-tempered pitch at the concert pitch. */
  centsFrom12: number | null;
  /** True when MTS cannot express the pitch: below key 0's `00 00 00` or above `7F 7F 7E`. */
  outOfMtsRange: boolean;
}

/** All 128 MIDI keys, key 0 first. */
export type KeyTable = KeyEntry[];

const keyCount = 128;

/** MTS frequency words count 1/16384 semitone from key 0; the highest usable is `7F 7F 7E`. */
const mtsUnitsPerSemitone = 16384;
const highestMtsUnits = 127 * mtsUnitsPerSemitone + 16382;

/** Whether a pitch, rounded to the nearest MTS frequency word, falls outside what MTS sends. */
function outsideMts(hz: number): boolean {
  const units = Math.round((69 + 12 * Math.log2(hz / 440)) * mtsUnitsPerSemitone);
  return units < 0 || units > highestMtsUnits;
}

/** Faults of a layout against the scale it lays out; every fault names its entry. */
export function layoutFaults(layout: (number | null)[], scaleSize: number): FieldError[] {
  const degrees = `the scale has ${scaleSize} degrees (0-${scaleSize - 1})`;
  return layout.flatMap((degree, index) =>
    degree === null || degree < scaleSize
      ? []
      : [fieldError(`mapping.layout[${index}]`, `degree ${degree} does not exist; ${degrees}`)],
  );
}

function unmapped(key: number): KeyEntry {
  const entry = { key, degree: null, hz: null, centsFromRoot: null, centsFrom12: null };
  return { ...entry, outOfMtsRange: false };
}

/**
 * The degree `key` plays and how far above (+) or below (-) the root key's pitch it sounds, in cents,
 * or null when the key is unmapped: the one rule of how a layout lays degrees on keys, used by the
 * key table and by the anchor.
 */
export function keyPlace(
  scale: Scale,
  mapping: Pick<KeyMapping, 'rootKey' | 'layout'>,
  key: number,
): { degree: number; centsFromRoot: number } | null {
  const { rootKey, layout } = mapping;
  const blockSize = layout ? layout.length : scale.degrees.length;
  const offset = key - rootKey;
  const block = Math.floor(offset / blockSize);
  const place = offset - block * blockSize;
  const degree = layout ? layout[place] : place;
  if (degree === null || degree >= scale.degrees.length) return null;
  return { degree, centsFromRoot: block * scale.period.cents + scale.degrees[degree].cents };
}

/**
 * Lays the scale across the 128 keys. A key whose layout entry is null, or names a degree the scale
 * lacks, is unmapped. Pitches outside what MTS can express keep their true frequency and are
 * flagged, never wrapped.
 */
export function mapKeys(scale: Scale, mapping: KeyMapping): KeyTable {
  const { rootHz, concertA } = mapping;
  const table: KeyTable = [];
  for (let key = 0; key < keyCount; key++) {
    const place = keyPlace(scale, mapping, key);
    if (!place) {
      table.push(unmapped(key));
      continue;
    }
    const hz = rootHz * 2 ** (place.centsFromRoot / 1200);
    table.push({
      key,
      degree: place.degree,
      hz,
      centsFromRoot: place.centsFromRoot,
      centsFrom12: centsFromEqualTempered(hz, key, concertA),
      outOfMtsRange: outsideMts(hz),
    });
  }
  return table;
}
