import { controlChange as controlChangeStatus } from './midi-bytes';

/**
 * Registered parameter numbers (RPN) as control changes on a channel 1-16: select with 101/100
 * (MSB/LSB), set with data entry 6 (and 38 for the fine part), then deselect with the null RPN 7F
 * 7F so that a stray data entry cannot change it later. Each function writes the order its source
 * shows.
 */

type ChannelMessage = number[];

function controlChange(channel: number, controller: number, value: number): ChannelMessage {
  return [controlChangeStatus | (channel - 1), controller, value];
}

const rpnMsb = 0x65;
const rpnLsb = 0x64;
const dataEntry = 0x06;
const dataEntryFine = 0x26;

function nullRpn(channel: number): ChannelMessage[] {
  return [controlChange(channel, rpnMsb, 0x7f), controlChange(channel, rpnLsb, 0x7f)];
}

/**
 * RPN 0, the pitch bend range: `Bn 65 00`, `Bn 64 00`, `Bn 06 semitones`, `Bn 26 cents`, null RPN
 * (MIDI 1.0).
 */
export function bendRangeMessages(channel: number, semitones: number, cents = 0): ChannelMessage[] {
  return [
    controlChange(channel, rpnMsb, 0x00),
    controlChange(channel, rpnLsb, 0x00),
    controlChange(channel, dataEntry, semitones),
    controlChange(channel, dataEntryFine, cents),
    ...nullRpn(channel),
  ];
}

/**
 * RPN 4 then RPN 3, `Bn 64 04 65 00 06 bb`, `Bn 64 03 65 00 06 tt`: the MTS tuning bank, then the
 * program in it.
 */
export function tuningSelectionMessages(
  channel: number,
  target: { bank: number; program: number },
): ChannelMessage[] {
  return [
    controlChange(channel, rpnLsb, 0x04),
    controlChange(channel, rpnMsb, 0x00),
    controlChange(channel, dataEntry, target.bank),
    controlChange(channel, rpnLsb, 0x03),
    controlChange(channel, rpnMsb, 0x00),
    controlChange(channel, dataEntry, target.program),
    ...nullRpn(channel),
  ];
}

/**
 * RPN 6 on a zone's manager channel, `Bn 64 06`, `Bn 65 00`, `Bn 06 count`: MPE zone configuration
 * (RP-053).
 */
export function mpeConfigurationMessages(
  managerChannel: number,
  memberCount: number,
): ChannelMessage[] {
  return [
    controlChange(managerChannel, rpnLsb, 0x06),
    controlChange(managerChannel, rpnMsb, 0x00),
    controlChange(managerChannel, dataEntry, memberCount),
    ...nullRpn(managerChannel),
  ];
}
