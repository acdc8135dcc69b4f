// A member's instruments: how one player's gear takes a tuning. Private to their owner. An instrument's settings
// override a preset's `output` block wherever a tuning is sent or downloaded "for this instrument".
import * as z from 'zod';
import { storableString } from '../text/plain-text';
import type { Timestamp } from './wire';

/** How an instrument takes a tuning, and the export it is sent or downloaded as. */
export const receiveForms = [
  'mts-bulk',
  'mts-bulk-bank',
  'mts-notes',
  'mts-octave-1',
  'mts-octave-2',
  'mpe',
  'bend-table',
  'sfz',
] as const;
export type ReceiveForm = (typeof receiveForms)[number];

/** The export (shared/export/export-catalogue.ts) each form downloads as. */
export const exportOfReceiveForm: Record<ReceiveForm, string> = {
  'mts-bulk': 'mts-bulk',
  'mts-bulk-bank': 'mts-bulk-bank',
  'mts-notes': 'mts-notes',
  'mts-octave-1': 'mts-octave-1',
  'mts-octave-2': 'mts-octave-2',
  mpe: 'mpe-smf',
  'bend-table': 'bend-csv',
  sfz: 'sfz',
};

const sevenBit = z.int({ error: 'must be a whole number from 0 to 127' }).min(0).max(127);
const channel = z.int({ error: 'must be a channel from 1 to 16' }).min(1).max(16);

/** What an instrument is: every field but its id and times. Faults name their field. */
export const instrumentSettings = z
  .strictObject({
    name: storableString()
      .trim()
      .min(1, { error: 'must not be empty' })
      .max(80, { error: 'must be at most 80 characters' }),
    receives: z.enum(receiveForms, { error: `must be one of ${receiveForms.join(', ')}` }),
    deviceId: sevenBit.default(127),
    program: sevenBit.default(0),
    bank: sevenBit.default(0),
    bendRange: z
      .int({ error: 'must be a whole number of semitones from 1 to 96' })
      .min(1)
      .max(96)
      .default(2),
    memberChannels: z.tuple([channel, channel]).default([2, 16]),
    /** The MIDI output's name to pick in the browser when it is present. */
    port: storableString()
      .trim()
      .max(100, { error: 'must be at most 100 characters' })
      .nullable()
      .default(null),
  })
  .superRefine(({ memberChannels: [first, last] }, context) => {
    if (first > last) {
      context.addIssue({
        code: 'custom',
        path: ['memberChannels'],
        message: `runs from ${first} down to ${last}; write the lower channel first`,
      });
    }
  });
export type InstrumentSettings = z.output<typeof instrumentSettings>;

/** `POST /api/instruments` takes the settings. */
export const createInstrumentRequest = instrumentSettings;
/**
 * `PATCH /api/instruments/:id` takes any of them: this schema refuses unknown fields, and the server checks the
 * stored settings with the changes laid over them through `instrumentSettings`, so faults name their field.
 */
export const updateInstrumentRequest = z.strictObject({
  name: z.unknown().optional(),
  receives: z.unknown().optional(),
  deviceId: z.unknown().optional(),
  program: z.unknown().optional(),
  bank: z.unknown().optional(),
  bendRange: z.unknown().optional(),
  memberChannels: z.unknown().optional(),
  port: z.unknown().optional(),
});

/** `GET /api/instruments` (items), `POST` (201), `PATCH /api/instruments/:id`. */
export interface Instrument extends InstrumentSettings {
  id: string;
  createdAt: Timestamp;
  updatedAt: Timestamp;
}
