import * as z from 'zod';
import { type FieldError, fieldError, type Result, succeed, fail } from '../result';
import { readInterval } from '../tuning/interval';
import { keyPlace, layoutFaults } from '../tuning/key-table';
import { buildScale } from '../tuning/scale';
import type { Scale, ScaleSpec } from '../tuning/scale-spec';
import { largestScale } from '../tuning/scale-degrees';
import { storableString } from '../text/plain-text';
import { equalTemperedHz } from '../tuning/twelve-edo';
import { schemaFaults } from './schema-faults';
import { longestTuningName, tuningNameFrom, tuningNamePattern } from '../midi/tuning-name';

/** The one version of the preset document this code reads and writes. */
const presetVersion = 1;

/**
 * An interval in the preset syntax (a ratio 3/2, cents 701.955c or equal steps 7\12), as text (a JSON
 * number is read as its text: 2 is 2/1).
 */
const interval = z
  .union([z.string(), z.number()], { error: 'must be an interval such as "3/2" or "701.955c"' })
  .transform(String)
  .superRefine((text, context) => {
    const read = readInterval(text);
    if (typeof read === 'string') context.addIssue({ code: 'custom', message: read });
  });

const generatorCount = z.int().min(0);

/** A generator narrowed by a fraction of a comma; a list of these (null: pure) tempers a chain link by link. */
const temperLink = z.strictObject({
  comma: interval,
  fraction: z
    .union([z.string().max(64), z.number()], {
      error: 'must be a fraction such as "1/4", "-1/6" or "0.25"',
    })
    .transform(String),
});

const scaleSchema = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('generated'),
    generator: interval,
    period: interval.default('2/1'),
    up: generatorCount,
    down: generatorCount.default(0),
    temper: z.union([temperLink, z.array(temperLink.nullable()).max(largestScale - 1)]).optional(),
  }),
  z.strictObject({
    kind: z.literal('equal'),
    divisions: z.int().min(1),
    period: interval.default('2/1'),
  }),
  z.strictObject({
    kind: z.literal('list'),
    // The length is checked before the entries, so that a huge list is refused at once with one fault.
    degrees: z
      .array(z.unknown())
      .max(largestScale - 1)
      .pipe(z.array(interval)),
    period: interval.default('2/1'),
  }),
  z.strictObject({
    kind: z.literal('harmonic'),
    from: z.int().min(1),
    to: z.int().min(2),
    sub: z.boolean().default(false),
  }),
]);

const midiKey = z.int().min(0).max(127);
const sevenBit = z.int().min(0).max(127);
const channel = z.int().min(1).max(16);

/** A pitch in Hz: from 1 Hz (below that it is a rhythm, not a pitch) to 20 kHz. */
const pitchHz = z.number().min(1).max(20000);

const mappingSchema = z
  .strictObject({
    rootKey: midiKey,
    rootHz: pitchHz.optional(),
    concertA: z.number().min(220).max(880).default(440),
    keysPerPeriod: z.int().min(1).max(128).optional(),
    layout: z.array(z.int().min(0).nullable()).min(1).max(128).nullable().optional(),
    anchor: z.strictObject({ key: midiKey, hz: pitchHz }).nullable().optional(),
  })
  .superRefine((mapping, context) => {
    const { layout, keysPerPeriod } = mapping;
    if (layout && keysPerPeriod !== undefined && layout.length !== keysPerPeriod) {
      context.addIssue({
        code: 'custom',
        path: ['layout'],
        message: `has ${layout.length} entries, but keysPerPeriod is ${keysPerPeriod}`,
      });
    }
  });

/** A sample's file name as a sampler map names it: a plain name, no folders, an audio extension. */
const sampleFile = z
  .string()
  .max(120)
  .regex(/^[\w][\w .()+-]*\.(wav|flac|ogg|aif|aiff)$/i, {
    error:
      'must be a plain file name ending in .wav, .flac, .ogg, .aif or .aiff, such as piano-c4.wav',
  });

const outputSchema = z
  .strictObject({
    deviceId: sevenBit.default(127),
    program: sevenBit.default(0),
    bank: sevenBit.default(0),
    tuningName: z
      .string()
      .max(longestTuningName)
      .regex(tuningNamePattern, {
        error: 'must hold only plain ASCII letters, digits, spaces and punctuation',
      })
      .optional(),
    bendRange: z.int().min(1).max(96).default(2),
    memberChannels: z.tuple([channel, channel]).default([2, 16]),
    samples: z
      .array(z.strictObject({ file: sampleFile, key: midiKey }))
      .min(1)
      .max(128)
      .optional(),
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

/** The preset document: the contract of the API, imports, exports and forms. */
export const presetDocumentSchema = z.strictObject({
  format: z.literal('keyloom.preset'),
  version: z.literal(presetVersion),
  name: storableString().trim().min(1).max(200),
  notes: storableString().max(20000).default(''),
  scale: scaleSchema,
  mapping: mappingSchema,
  output: outputSchema.prefault({}),
});

/** A preset document as the user wrote it: optional fields may be missing. */
export type PresetDocument = z.input<typeof presetDocumentSchema>;

/** A preset document checked through and through, with every default filled in. */
export interface ResolvedPreset {
  format: 'keyloom.preset';
  version: typeof presetVersion;
  name: string;
  notes: string;
  scale: ScaleSpec;
  mapping: {
    rootKey: number;
    /**
     * The pitch of the root key: as written; from the anchor, so that the anchor key sounds its pitch; or
     * else the root key's equal-tempered pitch at `concertA`.
     */
    rootHz: number;
    /** The key that sounds exactly `hz` in the tuning, when the document names one. */
    anchor: { key: number; hz: number } | null;
    concertA: number;
    /** The layout's length; without a layout, the scale size. */
    keysPerPeriod: number;
    layout: (number | null)[] | null;
  };
  output: {
    deviceId: number;
    program: number;
    bank: number;
    tuningName: string;
    bendRange: number;
    memberChannels: [number, number];
    /** The samples an SFZ map draws from, each recorded at its key's equal-tempered pitch; absent: one of middle C. */
    samples?: { file: string; key: number }[];
  };
}

function versionFault(input: unknown): FieldError | null {
  if (typeof input !== 'object' || input === null || !('version' in input)) return null;
  const { version } = input;
  if (version === undefined || version === presetVersion) return null;
  const fault = `is not a version this Keyloom reads (it reads version ${presetVersion})`;
  // Quoted only when short: a huge value must not come back whole in the answer.
  const quoted = JSON.stringify(version) ?? String(version);
  return fieldError('version', `${quoted.length <= 40 ? quoted : 'this'} ${fault}`);
}

/**
 * Checks a preset document and fills in its defaults. A document of an unknown version is refused
 * before anything else is read. Every fault names its field; nothing is thrown.
 */
export function parsePresetDocument(input: unknown): Result<ResolvedPreset> {
  const read = parsePresetAndScale(input);
  return read.ok ? succeed(read.value.preset) : read;
}

/**
 * parsePresetDocument, and the scale it built on the way to check the mapping, for whoever goes on
 * to draw the preview table (previewTable takes it rather than building it again).
 */
export function parsePresetAndScale(
  input: unknown,
): Result<{ preset: ResolvedPreset; scale: Scale }> {
  const wrongVersion = versionFault(input);
  if (wrongVersion) return fail([wrongVersion]);
  const parsed = presetDocumentSchema.safeParse(input, { reportInput: true });
  if (!parsed.success) return fail(schemaFaults(parsed.error.issues));
  const { scale: scaleSpec, mapping, output, ...about } = parsed.data;

  const scale = buildScale(scaleSpec);
  if (!scale.ok) return scale;
  const size = scale.value.degrees.length;
  const layout = mapping.layout ?? null;
  if (layout) {
    const faults = layoutFaults(layout, size);
    if (faults.length > 0) return fail(faults);
  } else if (mapping.keysPerPeriod !== undefined && mapping.keysPerPeriod !== size) {
    return fail([
      fieldError(
        'mapping.keysPerPeriod',
        `${mapping.keysPerPeriod} differs from the scale's ${size} degrees; give a layout of ` +
          `${mapping.keysPerPeriod} entries to say which key plays which degree`,
      ),
    ]);
  }
  let rootHz = mapping.rootHz ?? equalTemperedHz(mapping.rootKey, mapping.concertA);
  const anchor = mapping.anchor ?? null;
  if (anchor) {
    const place = keyPlace(scale.value, { rootKey: mapping.rootKey, layout }, anchor.key);
    if (!place) {
      const fault = `${anchor.key} plays no degree in this layout: anchor a key that does`;
      return fail([fieldError('mapping.anchor.key', fault)]);
    }
    const anchoredHz = anchor.hz / 2 ** (place.centsFromRoot / 1200);
    // A resolved preset carries both, and they agree; a document written with two different pitches is refused.
    if (mapping.rootHz !== undefined && Math.abs(anchoredHz / mapping.rootHz - 1) > 1e-9) {
      const fault =
        'and rootHz both set the pitch: give one of them (the anchor is the key a musician tunes to)';
      return fail([fieldError('mapping.anchor', fault)]);
    }
    rootHz = anchoredHz;
    if (!Number.isFinite(rootHz) || rootHz < 1 || rootHz > 20000) {
      const fault = `${anchor.hz} Hz on key ${anchor.key} puts the root key at ${rootHz} Hz, outside 1 to 20000 Hz`;
      return fail([fieldError('mapping.anchor.hz', fault)]);
    }
  }
  const preset: ResolvedPreset = {
    ...about,
    scale: scaleSpec,
    mapping: {
      rootKey: mapping.rootKey,
      rootHz,
      anchor,
      concertA: mapping.concertA,
      keysPerPeriod: layout ? layout.length : size,
      layout,
    },
    output: { ...output, tuningName: output.tuningName ?? tuningNameFrom(about.name) },
  };
  return succeed({ preset, scale: scale.value });
}
