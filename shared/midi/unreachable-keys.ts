import { type FieldError, fieldError } from '../result';
import { keyRuns } from '../text/key-runs';

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
