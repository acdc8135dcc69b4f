import type { HeardFrame } from './pitch-detector';

// How a stream of frames becomes a reading that holds still on a steady tone. One frame is read per screen
// refresh (about 16.7 ms at 60 frames a second), each over the last 85 ms or so of sound.

/** The reading is the mean of at most this many recent frames. */
export const averagedFrames = 5;
/** A reading shows once this many of the recent frames agree. */
export const agreeingFrames = 3;
/** Frames agree when they lie within this many cents of the median of the recent frames. */
export const agreementCents = 10;
/** A frame further than this from the median of the recent frames starts a new note. */
const newNoteCents = 40;
/** Frames in a row without a steady pitch that the last reading outlasts before "no clear pitch". */
export const heldFrames = 6;

/** The frames of the note being heard and the reading they give. */
export interface PitchTrack {
  /** The recent frames' pitches, in cents above 1 Hz, oldest first. */
  recentCents: readonly number[];
  /** Frames in a row that gave no steady pitch. */
  unsteadyFrames: number;
  /** The reading in Hz; null: no clear pitch. */
  hz: number | null;
}

/** Before the first frame: nothing heard. */
export const silentTrack: PitchTrack = { recentCents: [], unsteadyFrames: 0, hz: null };

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** The frames that agree with the median of the recent frames, or null when too few do. */
function agreeing(recentCents: readonly number[]): number[] | null {
  if (recentCents.length < agreeingFrames) return null;
  const centre = median(recentCents);
  const close = recentCents.filter((cents) => Math.abs(cents - centre) <= agreementCents);
  return close.length >= agreeingFrames ? close : null;
}

/**
 * The track after one more frame. A pitched frame joins the recent ones (or, far from them, starts a new note);
 * when enough agree, the reading is their mean. A frame that leaves no steady pitch keeps the last reading for
 * up to `heldFrames` frames in a row, then gives way to no reading, forgetting the note.
 */
export function followPitch(track: PitchTrack, frame: HeardFrame): PitchTrack {
  let recentCents = track.recentCents;
  if (frame.kind === 'pitch') {
    const cents = 1200 * Math.log2(frame.hz);
    const sameNote =
      recentCents.length === 0 || Math.abs(cents - median(recentCents)) <= newNoteCents;
    recentCents = [...(sameNote ? recentCents : []), cents].slice(-averagedFrames);
    const steady = agreeing(recentCents);
    if (steady) {
      const mean = steady.reduce((sum, cents) => sum + cents, 0) / steady.length;
      return { recentCents, unsteadyFrames: 0, hz: 2 ** (mean / 1200) };
    }
  }
  const unsteadyFrames = track.unsteadyFrames + 1;
  if (unsteadyFrames <= heldFrames) return { recentCents, unsteadyFrames, hz: track.hz };
  return { recentCents: frame.kind === 'pitch' ? recentCents : [], unsteadyFrames, hz: null };
}
