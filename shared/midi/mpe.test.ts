import { describe, expect, it } from 'vitest';
import { MemberChannelAllocator, mpeSetupMessages, mpeZoneOf } from './mpe';

describe('MPE zones', () => {
  it('makes a lower zone when channel 1 is free to manage it', () => {
    // MPE specification (MMA RP-053): lower zone, manager channel 1, member channels 2 upward
    expect(mpeZoneOf([2, 16])).toMatchObject({ managerChannel: 1, memberCount: 15, warnings: [] });
    expect(mpeZoneOf([3, 8])).toMatchObject({
      managerChannel: 1,
      memberCount: 7,
      memberChannels: [3, 4, 5, 6, 7, 8],
    });
  });

  it('makes an upper zone when the members start at channel 1', () => {
    // MPE specification (MMA RP-053): upper zone, manager 16, members downward
    expect(mpeZoneOf([1, 8])).toMatchObject({ managerChannel: 16, memberCount: 15 });
  });

  it('warns that 16 member channels leave no manager', () => {
    const zone = mpeZoneOf([1, 16]);
    expect(zone.managerChannel).toBeNull();
    expect(zone.warnings[0].message).toMatch(/^output\.memberChannels: takes all 16 channels/);
    expect(mpeSetupMessages(zone, 2)).toHaveLength(16 * 6);
  });

  it('configures the zone before setting the bend range on every member channel', () => {
    const messages = mpeSetupMessages(mpeZoneOf([2, 4]), 48);
    // MPE specification (MMA RP-053): configuration on the manager channel Bn 64 06, Bn 65 00, Bn
    // 06 count; bend range RPN 0
    expect(messages.slice(0, 3)).toEqual([
      [0xb0, 0x64, 0x06],
      [0xb0, 0x65, 0x00],
      [0xb0, 0x06, 3],
    ]);
    const dataEntries = messages
      .filter((message) => message[1] === 0x06)
      .map((message) => [message[0], message[2]]);
    expect(dataEntries).toEqual([
      [0xb0, 3],
      [0xb1, 48],
      [0xb2, 48],
      [0xb3, 48],
    ]);
  });
});

describe('member channel allocation', () => {
  it('takes the channel silent longest first', () => {
    const allocator = new MemberChannelAllocator<string>([2, 3, 4]);
    expect(allocator.start('a').channel).toBe(2);
    expect(allocator.start('b').channel).toBe(3);
    allocator.release(3);
    allocator.release(2);
    expect(allocator.start('c').channel).toBe(4);
    expect(allocator.start('d').channel).toBe(3);
    expect(allocator.start('e').channel).toBe(2);
  });

  it('steals the oldest sounding note when every channel sounds', () => {
    const allocator = new MemberChannelAllocator<string>([2, 3]);
    allocator.start('a');
    allocator.start('b');
    expect(allocator.start('c')).toEqual({ channel: 2, stolen: 'a' });
    expect(allocator.start('d')).toEqual({ channel: 3, stolen: 'b' });
    allocator.release(3);
    expect(allocator.start('e')).toEqual({ channel: 3, stolen: null });
    expect(allocator.start('f')).toEqual({ channel: 2, stolen: 'c' });
  });
});
