/**
 * Answers kept as the bytes sent, by a key that says everything the answer depends on, within a budget of bytes:
 * the least recently used go first. For routes whose answer is a pure function of what the request says, asked
 * the same again and again (the preview of a preset many people open), so that the answer is made once.
 */
export class AnswerCache {
  private readonly answers = new Map<string, Buffer>();
  private bytes = 0;

  constructor(
    /** The most the answers and their keys may take together. */
    private readonly budgetBytes: number,
  ) {}

  /** The answer kept for `key`, made by `make` (and kept) when there is none. */
  answer(key: string, make: () => Buffer): Buffer {
    const kept = this.answers.get(key);
    if (kept) {
      // Taken again: to the back of the queue, the last to go.
      this.answers.delete(key);
      this.answers.set(key, kept);
      return kept;
    }
    const made = make();
    const size = made.length + key.length * 2;
    if (size > this.budgetBytes) return made;
    this.bytes += size;
    this.answers.set(key, made);
    for (const [oldest, answer] of this.answers) {
      if (this.bytes <= this.budgetBytes) break;
      this.answers.delete(oldest);
      this.bytes -= answer.length + oldest.length * 2;
    }
    return made;
  }

  /** What the answers and their keys take now, in bytes. */
  get size(): number {
    return this.bytes;
  }
}
