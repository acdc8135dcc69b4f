/**
 * A song's events held for rewriting: compact columns per track, and the order they sound in across
 * tracks.
 */

/**
 * A track's events as columns of typed arrays, in file order: the tick, the status and data bytes
 * packed into one number, and where each event's bytes lie in the song (`start`..`end`). Grows by
 * doubling.
 */
export class SongTrackEvents {
  length = 0;
  ticks = new Float64Array(256);
  /** status << 16 | data1 << 8 | data2 */
  messages = new Int32Array(256);
  starts = new Int32Array(256);
  ends = new Int32Array(256);

  add(
    tick: number,
    status: number,
    data1: number,
    data2: number,
    start: number,
    end: number,
  ): void {
    if (this.length === this.ticks.length) this.grow();
    const index = this.length++;
    this.ticks[index] = tick;
    this.messages[index] = (status << 16) | (data1 << 8) | data2;
    this.starts[index] = start;
    this.ends[index] = end;
  }

  private grow(): void {
    const capacity = this.ticks.length * 2;
    const grown = <T extends Float64Array | Int32Array>(
      column: T,
      make: new (size: number) => T,
    ): T => {
      const larger = new make(capacity);
      larger.set(column);
      return larger;
    };
    this.ticks = grown(this.ticks, Float64Array);
    this.messages = grown(this.messages, Int32Array);
    this.starts = grown(this.starts, Int32Array);
    this.ends = grown(this.ends, Int32Array);
  }
}

/**
 * Visits the events of all tracks in the order they sound: by tick, and at one tick the earlier
 * track first (as players merge format 1 tracks). A heap over the tracks keeps it O(events x log
 * tracks).
 */
export function mergedOrder(
  tracks: readonly SongTrackEvents[],
  visit: (track: number, index: number) => void,
): void {
  const positions = new Array<number>(tracks.length).fill(0);
  const heap = tracks.flatMap((events, track) => (events.length > 0 ? [track] : []));
  const before = (a: number, b: number) => {
    const tickA = tracks[a].ticks[positions[a]];
    const tickB = tracks[b].ticks[positions[b]];
    return tickA < tickB || (tickA === tickB && a < b);
  };
  const siftDown = (from: number) => {
    let at = from;
    for (;;) {
      const left = 2 * at + 1;
      const right = left + 1;
      let first = at;
      if (left < heap.length && before(heap[left], heap[first])) first = left;
      if (right < heap.length && before(heap[right], heap[first])) first = right;
      if (first === at) return;
      [heap[at], heap[first]] = [heap[first], heap[at]];
      at = first;
    }
  };
  for (let index = Math.floor(heap.length / 2) - 1; index >= 0; index--) siftDown(index);
  while (heap.length > 0) {
    const track = heap[0];
    visit(track, positions[track]);
    positions[track]++;
    if (positions[track] >= tracks[track].length) {
      const last = heap.pop() as number;
      if (heap.length === 0) break;
      heap[0] = last;
    }
    siftDown(0);
  }
}
