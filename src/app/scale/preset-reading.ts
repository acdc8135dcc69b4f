import { computed } from '@angular/core';
import { parsePresetDocument } from '@shared/preset/preset-document';
import { previewTable } from '@shared/tuning/preview';

/**
 * A preset document read through the shared tuning code, as signals: the faults that keep it from being shown,
 * the resolved preset, and its preview table. `document` is read inside computed signals; null means none yet.
 */
export function readPresetDocument(document: () => unknown) {
  const parsed = computed(() => {
    const written = document();
    return written === null || written === undefined ? null : parsePresetDocument(written);
  });
  const preset = computed(() => {
    const result = parsed();
    return result?.ok ? result.value : null;
  });
  return {
    faults: computed(() => {
      const result = parsed();
      return result && !result.ok ? result.errors.map((error) => error.message) : [];
    }),
    preset,
    preview: computed(() => {
      const resolved = preset();
      return resolved ? previewTable(resolved) : null;
    }),
  };
}
