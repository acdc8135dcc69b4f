import { describe, expect, it } from 'vitest';
import {
  bendRangeMessages,
  mpeConfigurationMessages,
  tuningSelectionMessages,
} from './registered-parameters';

describe('registered parameters', () => {
  it('sets the bend range with RPN 0 and closes with the null RPN', () => {
    // MIDI 1.0 specification, bend range (RPN 0): Bn 65 00, Bn 64 00, Bn 06 semitones, Bn 26 cents,
    // then null RPN Bn 65 7F, Bn 64 7F
    expect(bendRangeMessages(2, 48)).toEqual([
      [0xb1, 0x65, 0x00],
      [0xb1, 0x64, 0x00],
      [0xb1, 0x06, 48],
      [0xb1, 0x26, 0x00],
      [0xb1, 0x65, 0x7f],
      [0xb1, 0x64, 0x7f],
    ]);
  });

  it('selects the tuning bank (RPN 4) and then the program (RPN 3)', () => {
    const bytes = tuningSelectionMessages(3, { bank: 5, program: 9 }).flat();
    // MIDI Tuning specification, selecting a tuning program/bank: RPN 3 (program) and
    // RPN 4 (bank), Bn 64 03 65 00 06 tt
    expect(bytes.slice(0, 9)).toEqual([0xb2, 0x64, 0x04, 0xb2, 0x65, 0x00, 0xb2, 0x06, 5]);
    expect(bytes.slice(9, 18)).toEqual([0xb2, 0x64, 0x03, 0xb2, 0x65, 0x00, 0xb2, 0x06, 9]);
    expect(bytes.slice(18)).toEqual([0xb2, 0x65, 0x7f, 0xb2, 0x64, 0x7f]);
  });

  it('configures an MPE zone with RPN 6 on the manager channel', () => {
    // MPE specification (MMA RP-053) configuration on the manager channel: Bn 64 06, Bn 65 00,
    // Bn 06 count
    expect(mpeConfigurationMessages(1, 15).slice(0, 3)).toEqual([
      [0xb0, 0x64, 0x06],
      [0xb0, 0x65, 0x00],
      [0xb0, 0x06, 15],
    ]);
    expect(mpeConfigurationMessages(16, 3)[0]).toEqual([0xbf, 0x64, 0x06]);
  });
});
