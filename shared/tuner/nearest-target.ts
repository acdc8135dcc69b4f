/** A key the tuning maps, as a pitch to tune to. */
export interface TunerTarget {
  key: number;
  degree: number;
  hz: number;
}

/** What the tuner compares with: the nearest mapped key, the nearest key of one degree, or one key. */
export type TunerLock = { kind: 'degree'; degree: number } | { kind: 'key'; key: number } | null;

/** The target a pitch is read against, and how far the pitch lies above (+) or below (-) it. */
export interface TunerMatch extends TunerTarget {
  cents: number;
}

/** How many cents `hz` lies above (+) or below (-) `targetHz`: 1200 log2(f / f_target). */
export function centsFrom(hz: number, targetHz: number): number {
  return 1200 * Math.log2(hz / targetHz);
}

/**
 * The mapped keys of a key table as targets, every pitch multiplied by `referenceRatio`: a session's own concert
 * A over the preset's moves every target by the same interval. Unmapped keys are left out.
 */
export function tunerTargets(
  keys: readonly { key: number; degree: number | null; hz: number | null }[],
  referenceRatio = 1,
): TunerTarget[] {
  return keys.flatMap(({ key, degree, hz }) =>
    degree === null || hz === null ? [] : [{ key, degree, hz: hz * referenceRatio }],
  );
}

/**
 * The target nearest `hz` in cents among those the lock allows (all of them, the keys of one degree, or one
 * key), the lowest key winning a tie; null when none is allowed.
 */
export function nearestTarget(
  hz: number,
  targets: readonly TunerTarget[],
  lock: TunerLock = null,
): TunerMatch | null {
  let best: TunerMatch | null = null;
  for (const target of targets) {
    if (lock?.kind === 'degree' && target.degree !== lock.degree) continue;
    if (lock?.kind === 'key' && target.key !== lock.key) continue;
    const cents = centsFrom(hz, target.hz);
    if (!best || Math.abs(cents) < Math.abs(best.cents)) best = { ...target, cents };
  }
  return best;
}
