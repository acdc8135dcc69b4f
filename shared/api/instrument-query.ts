// An instrument's settings in a download's query, for callers without a saved instrument (a guest
// on a share link, an unsaved design):
// `?receives=mts-bulk&deviceId=16&program=5&bank=0&bendRange=48&memberChannels=2-9`. They are
// checked by the same schema as a saved instrument's, with the name optional; faults name the query
// field.
import { schemaFaults } from '../preset/schema-faults';
import { type Result, fail, succeed } from '../result';
import { type InstrumentSettings, instrumentSettings } from './instruments';

/** The query fields that carry an instrument's settings. */
export const instrumentQueryFields = [
  'name',
  'receives',
  'deviceId',
  'program',
  'bank',
  'bendRange',
  'memberChannels',
  'port',
] as const;

const numberFields = new Set(['deviceId', 'program', 'bank', 'bendRange']);

/**
 * A query text as the schema checks it: whole numbers, `first-last` channels, anything else as is.
 */
function queryValue(field: string, value: unknown): unknown {
  if (typeof value !== 'string') return value;
  if (numberFields.has(field)) return /^-?\d{1,6}$/.test(value) ? Number(value) : value;
  if (field === 'memberChannels') {
    const range = /^(\d{1,6})-(\d{1,6})$/.exec(value);
    return range ? [Number(range[1]), Number(range[2])] : value;
  }
  return value;
}

/** The name a query instrument gets when the query names none. */
const unnamed = 'Instrument';

/**
 * The instrument a query describes, or null when the query holds none of its fields. Other fields
 * of the query (`revision`, `instrument`) are left to their own readers.
 */
export function readInstrumentQuery(
  query: Record<string, unknown>,
): Result<InstrumentSettings> | null {
  const given = instrumentQueryFields.filter((field) => query[field] !== undefined);
  if (given.length === 0) return null;
  const input: Record<string, unknown> = { name: unnamed };
  for (const field of given) input[field] = queryValue(field, query[field]);
  const parsed = instrumentSettings.safeParse(input, { reportInput: true });
  return parsed.success ? succeed(parsed.data) : fail(schemaFaults(parsed.error.issues));
}

/**
 * The query that describes an instrument: what the app adds to a download's address for a guest.
 */
export function instrumentQuery(settings: InstrumentSettings): Record<string, string> {
  const { name, receives, deviceId, program, bank, bendRange, memberChannels, port } = settings;
  return {
    name,
    receives,
    deviceId: String(deviceId),
    program: String(program),
    bank: String(bank),
    bendRange: String(bendRange),
    memberChannels: `${memberChannels[0]}-${memberChannels[1]}`,
    ...(port === null ? {} : { port }),
  };
}
