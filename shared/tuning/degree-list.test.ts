import { describe, expect, it } from 'vitest';
import { readDegreeList } from './degree-list';

describe('readDegreeList', () => {
  it('reads one a line, as before, with nothing to say', () => {
    expect(readDegreeList('9/8\n5/4\n4/3\n')).toEqual({
      degrees: ['9/8', '5/4', '4/3'],
      period: '2/1',
      notices: [],
    });
  });

  it('reads a list pasted on one line, with commas or spaces, keeping 9 / 8 and 386.3 c whole', () => {
    expect(readDegreeList('9/8, 5/4, 4/3,3/2').degrees).toEqual(['9/8', '5/4', '4/3', '3/2']);
    expect(readDegreeList('9 / 8  386.3 c 7\\12').degrees).toEqual(['9/8', '386.3c', '7\\12']);
    expect(readDegreeList('9/8; 5/4 # a comment\n4/3').degrees).toEqual(['9/8', '5/4', '4/3']);
  });

  it('drops a leading 1/1 and takes a closing 2/1 as the period, saying both', () => {
    const reading = readDegreeList('1/1 9/8 5/4 4/3 3/2 5/3 15/8 2/1');
    expect(reading.degrees).toEqual(['9/8', '5/4', '4/3', '3/2', '5/3', '15/8']);
    expect(reading.period).toBe('2/1');
    expect(reading.notices).toEqual([
      'The leading 1/1 is the tonic, which every scale has: it was left out of the list.',
      'The closing 2/1 is the period: it was taken as the period, not as a degree.',
    ]);
  });

  it('takes a closing entry as the period only when it equals the period written, by size', () => {
    expect(readDegreeList('0c 146.3c 292.6c 1901.955c', '3/1').degrees).toEqual([
      '146.3c',
      '292.6c',
    ]);
    expect(readDegreeList('9/8 5/4 3/1').degrees).toEqual(['9/8', '5/4', '3/1']);
    expect(readDegreeList('9/8 1200c').notices).toHaveLength(1);
  });

  it('keeps what is not an interval as written, for the scale to refuse by name', () => {
    expect(readDegreeList('9/8 hello 1.5').degrees).toEqual(['9/8', 'hello', '1.5']);
    expect(readDegreeList('')).toEqual({ degrees: [], period: '2/1', notices: [] });
  });
});
