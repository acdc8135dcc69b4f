import { describe, expect, it } from 'vitest';
import { keyRuns } from './key-runs';

describe('keyRuns', () => {
  it('joins consecutive keys into runs and keeps lone keys as they are', () => {
    expect(keyRuns([0, 1, 2, 3, 126, 127])).toBe('0-3, 126-127');
    expect(keyRuns([5, 7, 8])).toBe('5, 7-8');
    expect(keyRuns([60])).toBe('60');
    expect(keyRuns([])).toBe('');
  });
});
