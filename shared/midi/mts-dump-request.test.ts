import { describe, expect, it } from 'vitest';
import { decodeDumpRequest, encodeDumpRequest } from './mts-dump-request';

describe('MTS bulk dump request (08 00)', () => {
  it('asks for one tuning program in 7 bytes and reads back', () => {
    const request = encodeDumpRequest({ deviceId: 0x7f, program: 9 });
    // MIDI Tuning specification: MTS 00 dump request, F0 7E dev 08 00 tt F7, 7 bytes
    expect([...request]).toEqual([0xf0, 0x7e, 0x7f, 0x08, 0x00, 0x09, 0xf7]);
    expect(decodeDumpRequest(request)).toEqual({
      ok: true,
      value: { kind: 'dump-request', deviceId: 0x7f, program: 9 },
    });
  });

  it('refuses a request that is cut short', () => {
    const request = encodeDumpRequest({ deviceId: 1, program: 2 });
    const decoded = decodeDumpRequest(request.subarray(0, 6));
    expect(!decoded.ok && decoded.errors[0].message).toBe(
      'file: the bulk dump request (08 00) is cut short: it has 6 bytes of the 7 it needs',
    );
  });
});
