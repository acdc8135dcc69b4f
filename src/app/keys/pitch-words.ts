import type { ResolvedPreset } from '@shared/preset/preset-document';
import { noteName } from '@shared/tuning/twelve-edo';

/** Where a tuning's pitch sits, in words: the key tuned to a pitch when there is one, and the root key's pitch. */
export function pitchWords(mapping: ResolvedPreset['mapping']): string {
  const { rootKey, rootHz, anchor } = mapping;
  const root = `key ${rootKey} (${noteName(rootKey)}) sounds ${rootHz.toFixed(4)} Hz.`;
  return anchor
    ? `Key ${anchor.key} (${noteName(anchor.key)}) sounds ${anchor.hz} Hz; root ${root}`
    : `Root ${root}`;
}
