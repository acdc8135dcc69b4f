import type { PresetDocument } from '@shared/preset/preset-document';

/**
 * A number field as the musician left it: the number, or text that is not one yet ("261." on the
 * way to "261.6"), so that the schema can say what is wrong and the field keeps what was typed.
 */
export type Typed = number | string;

export type ScaleKind = 'generated' | 'equal' | 'list' | 'harmonic';

export interface DraftTemper {
  comma: string;
  fraction: string;
}

export type DraftScale =
  | {
      kind: 'generated';
      generator: string;
      period: string;
      up?: Typed;
      down?: Typed;
      /** One fraction for every generator, or one link each from the chain's lowest note up (null: pure). */
      temper?: DraftTemper | (DraftTemper | null)[];
    }
  | { kind: 'equal'; divisions?: Typed; period: string }
  | { kind: 'list'; degrees: string[]; period: string }
  | { kind: 'harmonic'; from?: Typed; to?: Typed; sub?: boolean };

export interface DraftAnchor {
  key?: Typed;
  hz?: Typed;
}

export interface DraftMapping {
  rootKey?: Typed;
  rootHz?: Typed;
  /** The key a musician tunes to and its pitch; the root's pitch then follows. */
  anchor?: DraftAnchor;
  concertA?: Typed;
  /** Only while the field holds something that is not a whole number; otherwise the layout's length. */
  keysPerPeriod?: Typed;
  layout?: (number | null)[] | null;
}

export interface DraftOutput {
  deviceId?: Typed;
  program?: Typed;
  bank?: Typed;
  tuningName?: string;
  bendRange?: Typed;
  memberChannels?: [Typed | undefined, Typed | undefined];
  /** The samples an SFZ map draws from, each at the key whose pitch it was recorded at. */
  samples?: { key: Typed; file: string }[];
}

/**
 * A preset document being edited: the shape of the preset document, with number fields that may
 * still hold text. `parsePresetDocument` judges it; nothing here checks it.
 */
export interface DraftDocument {
  format: 'keyloom.preset';
  version: 1;
  name: string;
  notes?: string;
  scale: DraftScale;
  mapping: DraftMapping;
  output: DraftOutput;
}

/** The scale each kind starts from when first chosen. */
export function startingScale(kind: ScaleKind): DraftScale {
  switch (kind) {
    case 'generated':
      return { kind, generator: '3/2', period: '2/1', up: 5, down: 1 };
    case 'equal':
      return { kind, divisions: 12, period: '2/1' };
    case 'list':
      return { kind, degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'], period: '2/1' };
    case 'harmonic':
      return { kind, from: 8, to: 16, sub: false };
  }
}

/**
 * A new design: five pure fifths up and one down from middle C on the white keys (each degree on its nearest key,
 * as the designer lays out scales of fewer than 12 degrees), every output setting at its default.
 */
export function newDraft(): DraftDocument {
  return {
    format: 'keyloom.preset',
    version: 1,
    name: 'New scale',
    scale: startingScale('generated'),
    mapping: {
      rootKey: 60,
      concertA: 440,
      layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
    },
    output: { deviceId: 127, program: 0, bank: 0, bendRange: 2, memberChannels: [2, 16] },
  };
}

/**
 * What a number field holds after a keystroke: nothing when empty (the default applies or the
 * schema asks for it), the number when the text is exactly one, else the text itself.
 */
export function typedFrom(text: string): Typed | undefined {
  const written = text.trim();
  if (written === '') return undefined;
  const value = Number(written);
  return Number.isFinite(value) && String(value) === written ? value : written;
}

/** What a number field shows. */
export function typedText(value: Typed | undefined | null): string {
  return value === undefined || value === null ? '' : String(value);
}

/**
 * A document from the server or an address, as a draft: missing parts become empty objects so
 * that every field has somewhere to live. The document's own values are kept as they are.
 */
export function draftFrom(document: PresetDocument | DraftDocument): DraftDocument {
  const loose = document as DraftDocument;
  return {
    ...loose,
    mapping: { ...(loose.mapping ?? {}) },
    output: { ...(loose.output ?? {}) },
  };
}
