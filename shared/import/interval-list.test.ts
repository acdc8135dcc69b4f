import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../preset/preset-document';
import { presetFromIntervalList } from './interval-list';

describe('presetFromIntervalList', () => {
  it('reads one interval a line, skips comments and blank lines, and takes a period line', () => {
    const text =
      '# Bright just major\n9/8\n5/4   # the pure third\n\n4/3\n701.955c\n5/3\n15/8\nperiod 2/1\n';
    const result = presetFromIntervalList(text, 'Bright');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.scale).toEqual({
      kind: 'list',
      degrees: ['9/8', '5/4', '4/3', '701.955c', '5/3', '15/8'],
      period: '2/1',
    });
    expect(parsePresetDocument(result.value).ok).toBe(true);
  });

  it('takes another period such as 3/1', () => {
    const result = presetFromIntervalList('9/7\n5/3\n7/3\nperiod: 3/1', 'Tritave');
    expect(result.ok && result.value.scale).toMatchObject({ period: '3/1' });
  });

  it('names the line of every interval it cannot read', () => {
    const result = presetFromIntervalList('9/8\n1.5\nhello\n', 'Bad');
    expect(result.ok ? '' : result.errors[0].message).toBe(
      'line 2: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2',
    );
    expect(result.ok ? '' : result.errors[1].message).toMatch(
      /^line 3: "hello" is not an interval/,
    );
  });

  it('refuses a file with no intervals', () => {
    const result = presetFromIntervalList('# only a comment\n\n', 'Empty');
    expect(result.ok ? '' : result.errors[0].message).toMatch(/^file: no intervals found/);
  });
});

describe('presetFromIntervalList, as musicians paste lists', () => {
  it('reads a list on one line with commas, drops the leading 1/1, takes the closing 2/1 as the period, and says so', () => {
    const result = presetFromIntervalList('1/1, 9/8, 5/4, 4/3, 3/2, 5/3, 15/8, 2/1\n', 'Pasted');
    if (!result.ok) throw new Error(result.errors[0].message);
    expect(result.value.scale).toEqual({
      kind: 'list',
      degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'],
      period: '2/1',
    });
    expect(result.value.notes).toBe(
      'Imported from a list of intervals. The leading 1/1 is the tonic, which every scale has: it was left out of the list. ' +
        'The closing 2/1 is the period: it was taken as the period, not as a degree.',
    );
  });
});
