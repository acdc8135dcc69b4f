import type { ResolvedPreset } from '@shared/preset/preset-document';
import { type PreviewTable, previewTable } from '@shared/tuning/preview';
import type { Scale } from '@shared/tuning/scale-spec';

/** Whether two pieces of plain data (numbers, strings, booleans, null, arrays and objects of them) are alike. */
function sameData(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let index = 0; index < a.length; index++) if (!sameData(a[index], b[index])) return false;
    return true;
  }
  if (Array.isArray(b)) return false;
  const keys = Object.keys(a);
  if (keys.length !== Object.keys(b).length) return false;
  for (const key of keys) {
    if (!sameData((a as Record<string, unknown>)[key], (b as Record<string, unknown>)[key]))
      return false;
  }
  return true;
}

/** Keeps the earlier object where the new one is alike, so that whoever was handed it sees no change. */
function kept<T>(earlier: T, next: T): T {
  return sameData(earlier, next) ? earlier : next;
}

/**
 * The preview table of `preset`, keeping from the one shown before every part that came out the same: the same
 * objects, so that the pictures and tables (OnPush) given a part that did not change are not drawn again. An edit that
 * leaves the scale and the mapping as they were (a name, a note, an output setting) keeps the whole table without
 * computing it; an edit of the mapping keeps the degrees and the interval matrix; one of the scale usually keeps
 * nothing but is told apart quickly.
 */
export function keptTable(
  earlier: { preset: ResolvedPreset; table: PreviewTable } | null,
  preset: ResolvedPreset,
  scale: Scale,
): PreviewTable {
  if (
    earlier &&
    sameData(earlier.preset.scale, preset.scale) &&
    sameData(earlier.preset.mapping, preset.mapping)
  )
    return earlier.table;
  const next = previewTable(preset, scale);
  if (!earlier) return next;
  const before = earlier.table;
  const analysis = kept(before.analysis, next.analysis);
  return {
    degrees: kept(before.degrees, next.degrees),
    analysis:
      analysis === before.analysis
        ? analysis
        : {
            ...analysis,
            intervalMatrix: kept(before.analysis.intervalMatrix, analysis.intervalMatrix),
          },
    keys: kept(before.keys, next.keys),
    warnings: kept(before.warnings, next.warnings),
  };
}
