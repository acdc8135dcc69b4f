// What an instrument answers to the MTS dump request, for specs that stand in for one.

/**
 * MIDI Tuning specification, bulk dump `F0 7E dev 08 01 tt name[16] (xx yy zz)x128 cs F7`, written out here by the
 * rule: 12-tone equal, device 7F, program `program`, name "12-TET" padded with spaces, entries `nn 00 00`, checksum
 * the XOR of every byte from 7E up to the last data byte, AND 7F. For program 0 the published check value is 0x63,
 * 408 bytes.
 */
export function twelveToneDump(program = 0): Uint8Array {
  const name = Array.from('12-TET'.padEnd(16, ' '), (character) => character.charCodeAt(0));
  const body = [
    0x7e,
    0x7f,
    0x08,
    0x01,
    program,
    ...name,
    ...Array.from({ length: 128 }, (_, key) => [key, 0, 0]).flat(),
  ];
  const checksum = body.reduce((sum, byte) => sum ^ byte, 0) & 0x7f;
  return Uint8Array.from([0xf0, ...body, checksum, 0xf7]);
}
