// What a player set up to move the stage with their feet, kept in this browser between visits: the MIDI input (by
// its name, which outlives the browser's port ids) and the footswitch controller.
import * as z from 'zod';

export const stageControlsKey = 'keyloom.stage-controls';

/** A sustain pedal sends controller 64 (MIDI 1.0 Detailed Specification, control change assignments). */
export const defaultFootswitch = 64;

const stageControls = z.object({
  inputName: z.string().max(200).nullable().catch(null),
  footswitch: z.int().min(0).max(127).catch(defaultFootswitch),
});
export type StageControls = z.output<typeof stageControls>;

/** The controls kept in this browser, or none chosen yet; anything unreadable counts as nothing kept. */
export function keptStageControls(storage: Storage = localStorage): StageControls {
  try {
    const parsed = stageControls.safeParse(JSON.parse(storage.getItem(stageControlsKey) ?? 'null'));
    if (parsed.success) return parsed.data;
  } catch {
    // Not JSON: as if nothing were kept.
  }
  return { inputName: null, footswitch: defaultFootswitch };
}

export function keepStageControls(controls: StageControls, storage: Storage = localStorage): void {
  try {
    storage.setItem(stageControlsKey, JSON.stringify(controls));
  } catch {
    // Storage full or refused (a private window): the controls last for this visit only.
  }
}
