import { describe, expect, it } from 'vitest';
import { AnswerCache } from './answer-cache';

const bytes = (text: string) => Buffer.from(text);

describe('AnswerCache', () => {
  it('makes an answer once and hands the same bytes back for the same key', () => {
    const cache = new AnswerCache(1000);
    let made = 0;
    const make = () => {
      made++;
      return bytes('{"table":1}');
    };
    const first = cache.answer('a', make);
    expect(cache.answer('a', make)).toBe(first);
    expect(made).toBe(1);
    expect(cache.answer('b', make)).not.toBe(first);
    expect(made).toBe(2);
  });

  it('keeps within its budget by letting the least recently used answers go', () => {
    // Each entry takes 10 bytes of answer and 2 of key (one UTF-16 character): three fit in 40, four do not.
    const cache = new AnswerCache(40);
    const counts = new Map<string, number>();
    const ask = (key: string) =>
      cache.answer(key, () => {
        counts.set(key, (counts.get(key) ?? 0) + 1);
        return bytes('0123456789');
      });
    ask('a');
    ask('b');
    ask('c');
    ask('a'); // a was used last, so b is now the oldest
    ask('d');
    expect(cache.size).toBeLessThanOrEqual(40);
    ask('a');
    ask('c');
    ask('d');
    expect([...counts]).toEqual([
      ['a', 1],
      ['b', 1],
      ['c', 1],
      ['d', 1],
    ]);
    ask('b');
    expect(counts.get('b')).toBe(2);
  });

  it('answers, but does not keep, an answer larger than the whole budget', () => {
    const cache = new AnswerCache(8);
    let made = 0;
    const make = () => {
      made++;
      return bytes('far too long for the budget');
    };
    expect(cache.answer('x', make).toString()).toBe('far too long for the budget');
    cache.answer('x', make);
    expect(made).toBe(2);
    expect(cache.size).toBe(0);
  });
});
