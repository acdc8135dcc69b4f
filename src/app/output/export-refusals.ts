import { renderExport, exportFormats as catalogue } from '@shared/export/export-catalogue';
import type { ResolvedPreset } from '@shared/preset/preset-document';

/**
 * The formats of the catalogue that this preset cannot be written in, each with the reason in plain words (the
 * fault without the field it names): worked out in the browser by the same code the server runs, so that the menu
 * greys them out rather than offering a download that would be refused.
 */
export function exportRefusals(preset: ResolvedPreset): Map<string, string> {
  const refusals = new Map<string, string>();
  for (const format of catalogue) {
    const file = renderExport(preset, format.id);
    if (file.ok) continue;
    const [fault] = file.errors;
    const words = fault.message.startsWith(`${fault.path}: `)
      ? fault.message.slice(fault.path.length + 2)
      : fault.message;
    refusals.set(format.id, words.charAt(0).toUpperCase() + words.slice(1));
  }
  return refusals;
}
