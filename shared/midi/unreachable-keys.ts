import { type FieldError, fieldError } from '../result';

/** Runs of consecutive keys written compactly: 0, 1, 2, 3, 126, 127 becomes "0-3, 126-127". */
function keyRuns(keys: readonly number[]): string {
  const runs: [number, number][] = [];
  for (const key of keys) {
    const last = runs[runs.length - 1];
    if (last && last[1] === key - 1) last[1] = key;
    else runs.push([key, key]);
  }
  return runs.map(([first, last]) => (first === last ? `${first}` : `${first}-${last}`)).join(', ');
}

/**
 * One warning naming the keys (in ascending order) whose pitch a format could not hold, so that a
 * clamped key is never silent. `what` finishes the sentence: "lie above ... and were sent as ...".
 * No keys, no warning.
 */
export function unreachableKeysWarning(keys: readonly number[], what: string): FieldError[] {
  if (keys.length === 0) return [];
  const which = keys.length === 1 ? `key ${keyRuns(keys)}` : `keys ${keyRuns(keys)}`;
  return [fieldError('mapping', `${which} ${what}`)];
}
