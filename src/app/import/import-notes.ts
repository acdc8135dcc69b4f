import type { ResolvedPreset } from '@shared/preset/preset-document';
import type { PreviewTable } from '@shared/tuning/preview';
import { noteName } from '@shared/tuning/twelve-edo';

/** The widest layout there is: one that gives every key of the keyboard a pitch of its own. */
const everyKey = 128;

function periodText(table: PreviewTable): string {
  const { ratio, cents } = table.analysis.period;
  return ratio ?? `${cents.toFixed(2)} cents`;
}

/** What a musician should know about an imported tuning before opening it, in plain sentences. */
export function importNotes(preset: ResolvedPreset, table: PreviewTable): string[] {
  const { rootKey, rootHz, keysPerPeriod, layout } = preset.mapping;
  const unmapped = layout?.filter((degree) => degree === null).length ?? 0;
  const notes: string[] = [];
  if (layout && keysPerPeriod === everyKey) {
    notes.push(
      `The tuning does not repeat: each of the ${everyKey - unmapped} keys it tunes keeps a pitch of its own, ` +
        'and the other keys are left unmapped.',
    );
  } else {
    const octave = Math.abs(table.analysis.period.cents - 1200) < 1e-6;
    notes.push(
      octave
        ? `It repeats every octave, ${keysPerPeriod} keys to the octave.`
        : `It repeats every ${periodText(table)} rather than every octave, ${keysPerPeriod} keys to the period.`,
    );
    if (unmapped > 0) {
      notes.push(
        `${unmapped} of every ${keysPerPeriod} keys are left unmapped: the instrument keeps its own pitch for them.`,
      );
    }
  }
  notes.push(
    `Degree 0 sounds on key ${rootKey} (${noteName(rootKey)}) at ${rootHz.toFixed(2)} Hz.`,
  );
  return [...notes, ...table.warnings.map((warning) => warning.message)];
}
