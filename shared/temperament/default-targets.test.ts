import { describe, expect, it } from 'vitest';
import { oddLimitConsonances } from './default-targets';

describe('odd-limit consonances', () => {
  it('lists the six 5-limit consonances within the octave', () => {
    // common practice: the 5-odd-limit intervals are 6/5, 5/4, 4/3, 3/2, 8/5, 5/3
    expect(oddLimitConsonances(5)).toEqual(['6/5', '5/4', '4/3', '3/2', '8/5', '5/3']);
    expect(oddLimitConsonances(3)).toEqual(['4/3', '3/2']);
  });

  it('takes 9 into the 11 and 13 odd limits', () => {
    // arithmetic: odd numbers up to 13 are 1, 3, 5, 7, 9, 11, 13: 21 pairs, each with its inverse, less
    // 9/3 and 3/9, which repeat 3/2 and 4/3
    const thirteen = oddLimitConsonances(13);
    expect(thirteen).toHaveLength(40);
    expect(thirteen).toContain('9/8');
    expect(thirteen).toContain('13/11');
    expect(oddLimitConsonances(7)).not.toContain('9/8');
  });
});
