import type { PresetDocument, ResolvedPreset } from '../preset/preset-document';

/**
 * The preset document as a file: every default written out, so that what the file says is what
 * Keyloom used, and still a document `parsePresetDocument` reads back to the same preset (a layout
 * is left out when there is none, since the document has no way to say "no layout" but silence).
 */
export function presetDocumentFile(preset: ResolvedPreset): string {
  // The anchor is written as the musician set it; the root's pitch then follows from it, as it did here.
  const { layout, anchor, rootHz, ...rest } = preset.mapping;
  const mapping = anchor ? { ...rest, anchor } : { ...rest, rootHz };
  const document: PresetDocument = {
    format: preset.format,
    version: preset.version,
    name: preset.name,
    notes: preset.notes,
    scale: preset.scale,
    mapping: layout ? { ...mapping, layout } : mapping,
    output: preset.output,
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}
