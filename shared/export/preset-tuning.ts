import type { ResolvedPreset } from '../preset/preset-document';
import { type Result, succeed } from '../result';
import { type KeyTable, mapKeys } from '../tuning/key-table';
import { buildScale } from '../tuning/scale';
import type { Scale } from '../tuning/scale-spec';

/** A preset's scale laid across the 128 keys, with the output settings its exports use. */
export interface PresetTuning {
  scale: Scale;
  keys: KeyTable;
  mapping: ResolvedPreset['mapping'];
  output: ResolvedPreset['output'];
}

/**
 * Builds a preset's scale and lays it across the keys, as the preview does; faults name their
 * field.
 */
export function tuningOfPreset(preset: ResolvedPreset): Result<PresetTuning> {
  const built = buildScale(preset.scale);
  if (!built.ok) return built;
  const keys = mapKeys(built.value, preset.mapping);
  return succeed({ scale: built.value, keys, mapping: preset.mapping, output: preset.output });
}
