// The bodies and queries the API accepts, one schema per route, shared by the server (which validates) and the app (which sends them).
// A preset document inside a body is checked separately, by parsePresetDocument, so that its faults carry the
// document's own field paths.
import * as z from 'zod';
import { schemaFaults } from '../preset/schema-faults';
import { storableString } from '../text/plain-text';
import { type Result, fail, succeed } from '../result';
import { bandRoles } from './roles';

const id = z.uuid({ error: 'must be an id as the API gives them' });
const note = storableString().trim().max(500, { error: 'must be at most 500 characters' });
const bandRole = z.enum(bandRoles);
/** Revisions are numbered from 1; PostgreSQL's integer holds up to 2^31 - 1. */
export const largestRevision = 2_147_483_647;
const revision = z.int().min(1).max(largestRevision);
/** Far past any library's last page, and small enough that the offset stays a safe integer. */
const lastPage = 100_000;

export const createPresetRequest = z.strictObject({
  document: z.unknown(),
  bandId: id.optional(),
  note: note.optional(),
});
export const saveRevisionRequest = z.strictObject({ document: z.unknown(), note: note.optional() });
export const restoreRevisionRequest = z.strictObject({ revision });
export const forkPresetRequest = z.strictObject({ bandId: id.optional() });
export const createShareRequest = z.strictObject({ revision: revision.optional() });
export const bandNameRequest = z.strictObject({
  name: storableString()
    .trim()
    .min(1, { error: 'must not be empty' })
    .max(80, { error: 'must be at most 80 characters' }),
});
export const memberRoleRequest = z.strictObject({ role: bandRole });
export const inviteRequest = z.strictObject({
  email: z.email({ error: 'must be an e-mail address' }).max(254),
  role: bandRole,
});

export const presetListQuery = z.object({
  q: storableString().trim().max(100).optional(),
  sort: z.enum(['name', '-name', 'updated', '-updated']).default('-updated'),
  page: z.coerce.number().min(1).max(lastPage).int().default(1),
  pageSize: z.coerce.number().min(1).max(100).int().default(20),
  bandId: id.optional(),
  trash: z.enum(['0', '1']).optional(),
});

/** Checks a body or query against its schema; faults name their field. */
export function parseRequest<S extends z.ZodType>(schema: S, input: unknown): Result<z.output<S>> {
  const parsed = schema.safeParse(input ?? {}, { reportInput: true });
  return parsed.success ? succeed(parsed.data) : fail(schemaFaults(parsed.error.issues));
}
