import { describe, expect, it } from 'vitest';
import { instrumentSettings } from './instruments';
import { instrumentQuery, readInstrumentQuery } from './instrument-query';

describe('an instrument in a download query', () => {
  it('is absent when the query holds none of its fields', () => {
    expect(readInstrumentQuery({ revision: '2', instrument: 'x' })).toBeNull();
  });

  it('reads numbers and a channel range, with a name of its own when none is given', () => {
    const read = readInstrumentQuery({
      receives: 'mts-bulk',
      deviceId: '16',
      program: '5',
      bank: '0',
      bendRange: '48',
      memberChannels: '2-9',
    });
    expect(read).toEqual({
      ok: true,
      value: {
        name: 'Instrument',
        receives: 'mts-bulk',
        deviceId: 16,
        program: 5,
        bank: 0,
        bendRange: 48,
        memberChannels: [2, 9],
        port: null,
      },
    });
  });

  it('names the query field of each fault', () => {
    const read = readInstrumentQuery({
      receives: 'loud',
      deviceId: '200',
      memberChannels: '2',
      bank: 'x',
    });
    expect(read?.ok).toBe(false);
    const paths = read && !read.ok ? read.errors.map((e) => e.path).sort() : [];
    expect(paths).toEqual(['bank', 'deviceId', 'memberChannels', 'receives']);
    const downwards = readInstrumentQuery({ receives: 'mpe', memberChannels: '9-2' });
    expect(downwards && !downwards.ok && downwards.errors).toEqual([
      {
        path: 'memberChannels',
        message: 'memberChannels: runs from 9 down to 2; write the lower channel first',
      },
    ]);
  });

  it('refuses a list where one value stands (a field given twice)', () => {
    const read = readInstrumentQuery({ receives: 'mpe', program: ['1', '2'] });
    expect(read && !read.ok && read.errors.map((e) => e.path)).toEqual(['program']);
  });

  it('reads back what instrumentQuery wrote', () => {
    const settings = instrumentSettings.parse({
      name: 'Hex Synth',
      receives: 'mpe',
      bendRange: 48,
      memberChannels: [2, 9],
      port: 'USB MIDI 1',
    });
    expect(readInstrumentQuery(instrumentQuery(settings))).toEqual({ ok: true, value: settings });
  });
});
