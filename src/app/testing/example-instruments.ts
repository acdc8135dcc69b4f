// Instruments of the demo players for specs: the same two wherever a page offers "for my instrument".
import type { Instrument } from '@shared/api/instruments';

/** An MTS bulk-dump synth on device 16, program 5, with no port remembered. */
export const ondes: Instrument = {
  id: 'i-ondes',
  name: 'Ondes',
  receives: 'mts-bulk',
  deviceId: 16,
  program: 5,
  bank: 0,
  bendRange: 2,
  memberChannels: [2, 16],
  port: null,
  createdAt: '2026-11-01T10:00:00Z',
  updatedAt: '2026-11-01T10:00:00Z',
};

/** An MPE controller and synth: bends of 48 semitones on member channels 2 to 9. */
export const latticeBoard: Instrument = {
  ...ondes,
  id: 'i-board',
  name: 'Lattice board',
  receives: 'mpe',
  bendRange: 48,
  memberChannels: [2, 9],
};
