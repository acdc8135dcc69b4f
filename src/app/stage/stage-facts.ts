import { parsePresetDocument, type ResolvedPreset } from '@shared/preset/preset-document';
import { previewTable } from '@shared/tuning/preview';

/** A tuning's key facts as the stage shows them. */
export interface StageFacts {
  preset: ResolvedPreset;
  degrees: number;
  /** The period in cents, with its ratio when it has one: "1200.0 ¢ (2/1)". */
  period: string;
  /** The reference pitch: "261.63 Hz on key 60". */
  reference: string;
}

/** The facts of a saved preset document; null when it does not read. */
export function stageFacts(document: unknown): StageFacts | null {
  const parsed = parsePresetDocument(document);
  if (!parsed.ok) return null;
  const preset = parsed.value;
  try {
    const { size, period } = previewTable(preset).analysis;
    const ratio = period.ratio ? ` (${period.ratio})` : '';
    const { rootHz, rootKey } = preset.mapping;
    return {
      preset,
      degrees: size,
      period: `${period.cents.toFixed(1)} ¢${ratio}`,
      reference: `${rootHz.toFixed(2)} Hz on key ${rootKey}`,
    };
  } catch {
    return null;
  }
}
