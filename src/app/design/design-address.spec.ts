import { decodeDesign, encodeDesign } from './design-address';
import { type DraftDocument, newDraft } from './draft-document';

describe('The design in the address', () => {
  it('round-trips a design with every part filled in, text that is not a number yet included', () => {
    const draft: DraftDocument = {
      ...newDraft(),
      name: 'Fifths from F, ¼-comma ♭',
      scale: {
        kind: 'generated',
        generator: '3/2',
        period: '2/1',
        up: 11,
        down: '1.',
        temper: { comma: '81/80', fraction: '1/4' },
      },
      mapping: {
        rootKey: 53,
        rootHz: 174.6141,
        concertA: 440,
        layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
      },
      output: {
        deviceId: 127,
        program: 3,
        bank: 1,
        tuningName: 'MEANTONE',
        bendRange: 12,
        memberChannels: [2, 9],
      },
    };
    const encoded = encodeDesign(draft);
    expect(encoded).toMatch(/^1\.[A-Za-z0-9_-]+$/);
    expect(decodeDesign(encoded)).toEqual(draft);
  });

  it('round-trips a 72-degree list and stays shorter than the JSON it holds', () => {
    const degrees = Array.from({ length: 71 }, (_, index) => `${145 + index}/144`);
    const draft: DraftDocument = { ...newDraft(), scale: { kind: 'list', degrees, period: '2/1' } };
    const encoded = encodeDesign(draft);
    expect(decodeDesign(encoded)).toEqual(draft);
    expect(encoded.length).toBeLessThan(encodeURIComponent(JSON.stringify(draft)).length);
  });

  it('refuses an address written by another version of the encoding, saying so', () => {
    expect(decodeDesign('2.eyJuIjoiWCJ9')).toContain('another version of Keyloom');
  });

  it('refuses a damaged address rather than guessing at it', () => {
    const encoded = encodeDesign(newDraft());
    expect(decodeDesign(encoded.slice(0, encoded.length - 9))).toContain('damaged');
    expect(decodeDesign('1.not*base64')).toContain('damaged');
    expect(decodeDesign(`1.${btoa(JSON.stringify({ n: 'no scale' }))}`)).toContain('damaged');
  });
});
