import { parsePresetDocument, type PresetDocument, type ResolvedPreset } from './preset-document';

/**
 * The suites' usual example: `up` pure fifths stacked above the tonic and `down` below it, octave period,
 * degree 0 on key 60 (C4), every other field left to its default.
 */
export function fifthsPreset(name = 'Fen Fifths', up = 5, down = 1) {
  // Fields a test may change stay writable; the literals stay literal, so the document is a PresetDocument.
  return {
    format: 'keyloom.preset' as const,
    version: 1 as const,
    name,
    scale: { kind: 'generated' as const, generator: '3/2' as string, period: '2/1', up, down },
    mapping: { rootKey: 60 },
  } satisfies PresetDocument;
}

/** A preset of `scale` with degree 0 on key 60, for tests that look at the scale alone. */
export function presetOf(scale: unknown, name = 'T'): unknown {
  return { format: 'keyloom.preset', version: 1, name, scale, mapping: { rootKey: 60 } };
}

/** Checks a document a test expects to be valid, failing the test with its first fault otherwise. */
export function resolvedPreset(document: unknown): ResolvedPreset {
  const parsed = parsePresetDocument(document);
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return parsed.value;
}
