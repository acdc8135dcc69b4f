// Who may do what: the one place that decides. A caller who may not see a thing gets 404, as if it did not
// exist; one who may see it but not change it gets 403.
import { and, eq } from 'drizzle-orm';
import type { SignedInUser } from '../auth/github';
import type { Database } from '../db/client';
import { bands, instruments, memberships, presets, setlists } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { type BandRole, type PresetAccess, presetAccessLevels } from '../../shared/api/roles';

export type { BandRole, PresetAccess };

/** What a user may do with a preset, in rising order: none, then the levels the API names. */
export type PresetAccessOrNone = 'none' | PresetAccess;
const presetOrder: PresetAccessOrNone[] = ['none', ...presetAccessLevels];

/** What a user may do with a band, in rising order. */
export type BandAccess = 'none' | 'member' | 'owner';
const bandOrder: BandAccess[] = ['none', 'member', 'owner'];

export type PresetRow = typeof presets.$inferSelect;
export type BandRow = typeof bands.$inferSelect;
export type InstrumentRow = typeof instruments.$inferSelect;

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isId = (text: string) => uuidPattern.test(text);

export function requireUser(user: SignedInUser | undefined): SignedInUser {
  if (!user) throw new HttpError(401, 'sign_in_required', 'Sign in to do this.');
  return user;
}

export async function bandRole(
  db: Database,
  userId: string,
  bandId: string,
): Promise<BandRole | null> {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.bandId, bandId)));
  return row?.role ?? null;
}

/** Personal presets belong to their owner alone; band presets follow the member's role; admins may do anything. */
export function presetAccess(
  user: SignedInUser | undefined,
  preset: Pick<PresetRow, 'bandId' | 'ownerId'>,
  role: BandRole | null,
): PresetAccessOrNone {
  if (!user) return 'none';
  if (user.siteRole === 'admin') return 'own';
  if (preset.bandId === null) return preset.ownerId === user.id ? 'own' : 'none';
  return role === 'owner'
    ? 'own'
    : role === 'editor'
      ? 'edit'
      : role === 'viewer'
        ? 'read'
        : 'none';
}

/** The access shown on a row of the caller's own list (their presets and their bands'), where it is never none. */
export function listedPresetAccess(
  user: SignedInUser,
  preset: Pick<PresetRow, 'bandId' | 'ownerId'>,
  role: BandRole | null,
): PresetAccess {
  const access = presetAccess(user, preset, role);
  return access === 'none' ? 'read' : access;
}

function bandAccess(user: SignedInUser | undefined, role: BandRole | null): BandAccess {
  if (!user) return 'none';
  if (user.siteRole === 'admin' || role === 'owner') return 'owner';
  return role ? 'member' : 'none';
}

const roleWords: Record<string, string> = {
  read: 'see',
  edit: 'change',
  own: 'manage',
  member: 'see',
  owner: 'manage',
};

/** The preset, when the user may do `need` with it; otherwise 404 (cannot see it) or 403 (cannot change it). */
export async function authorizePreset(
  db: Database,
  user: SignedInUser | undefined,
  presetId: string,
  need: PresetAccess,
): Promise<{ preset: PresetRow; access: PresetAccess }> {
  const preset = isId(presetId)
    ? await db.query.presets.findFirst({ where: eq(presets.id, presetId) })
    : undefined;
  if (!preset) throw notFound('preset');
  const role = user && preset.bandId ? await bandRole(db, user.id, preset.bandId) : null;
  const access = presetAccess(user, preset, role);
  if (access === 'none') throw notFound('preset');
  if (presetOrder.indexOf(access) < presetOrder.indexOf(need)) {
    throw new HttpError(
      403,
      'forbidden',
      `Your role lets you see this preset but not ${roleWords[need]} it.`,
    );
  }
  return { preset, access };
}

/** The band, when the user may do `need` with it; otherwise 404 or 403 as above. */
export async function authorizeBand(
  db: Database,
  user: SignedInUser | undefined,
  bandId: string,
  need: Exclude<BandAccess, 'none'>,
): Promise<{ band: BandRow; role: BandRole | null; access: BandAccess }> {
  const band = isId(bandId)
    ? await db.query.bands.findFirst({ where: eq(bands.id, bandId) })
    : undefined;
  if (!band) throw notFound('band');
  const role = user ? await bandRole(db, user.id, band.id) : null;
  const access = bandAccess(user, role);
  if (access === 'none') throw notFound('band');
  if (bandOrder.indexOf(access) < bandOrder.indexOf(need)) {
    throw new HttpError(403, 'forbidden', "Only the band's owners can do this.");
  }
  return { band, role, access };
}

/** Saving into a band's library takes an editor's or owner's role there. */
export async function authorizeBandLibrary(
  db: Database,
  user: SignedInUser,
  bandId: string,
): Promise<void> {
  const { role, access } = await authorizeBand(db, user, bandId, 'member');
  if (access !== 'owner' && role !== 'editor') {
    throw new HttpError(
      403,
      'forbidden',
      "Viewers cannot add presets to the band's library.",
      'bandId',
    );
  }
}

/**
 * The caller's own instrument. Instruments are private to their owner, admins included: anyone
 * else's, an unknown id and a text that is no id at all are the same 404. Signed out is 401.
 */
export async function authorizeInstrument(
  db: Database,
  user: SignedInUser | undefined,
  instrumentId: string,
): Promise<InstrumentRow> {
  const caller = requireUser(user);
  const instrument = isId(instrumentId)
    ? await db.query.instruments.findFirst({
        where: and(eq(instruments.id, instrumentId), eq(instruments.ownerId, caller.id)),
      })
    : undefined;
  if (!instrument) throw notFound('instrument');
  return instrument;
}

export type SetlistRow = typeof setlists.$inferSelect;

/** What a user may do with a band's setlists: viewers read, editors and owners change; admins may do anything. */
export function setlistAccess(
  user: SignedInUser | undefined,
  role: BandRole | null,
): 'none' | 'read' | 'edit' {
  if (!user) return 'none';
  if (user.siteRole === 'admin') return 'edit';
  return role === 'owner' || role === 'editor' ? 'edit' : role === 'viewer' ? 'read' : 'none';
}

function setlistGate(
  access: 'none' | 'read' | 'edit',
  need: 'read' | 'edit',
  what: 'band' | 'setlist',
) {
  if (access === 'none') throw notFound(what);
  if (need === 'edit' && access !== 'edit') {
    throw new HttpError(
      403,
      'forbidden',
      "Viewers can follow the band's setlists but not change them.",
    );
  }
}

/** The band whose setlists the user may read or change; a signed-out caller gets 401, a non-member 404. */
export async function authorizeBandSetlists(
  db: Database,
  user: SignedInUser | undefined,
  bandId: string,
  need: 'read' | 'edit',
): Promise<{ band: BandRow; access: 'read' | 'edit' }> {
  const signedIn = requireUser(user);
  const band = isId(bandId)
    ? await db.query.bands.findFirst({ where: eq(bands.id, bandId) })
    : undefined;
  if (!band) throw notFound('band');
  const access = setlistAccess(signedIn, await bandRole(db, signedIn.id, band.id));
  setlistGate(access, need, 'band');
  return { band, access: access as 'read' | 'edit' };
}

/** The setlist, when the user may read or change it; a signed-out caller gets 401, a non-member 404. */
export async function authorizeSetlist(
  db: Database,
  user: SignedInUser | undefined,
  setlistId: string,
  need: 'read' | 'edit',
): Promise<{ setlist: SetlistRow; access: 'read' | 'edit' }> {
  const signedIn = requireUser(user);
  const setlist = isId(setlistId)
    ? await db.query.setlists.findFirst({ where: eq(setlists.id, setlistId) })
    : undefined;
  if (!setlist) throw notFound('setlist');
  const access = setlistAccess(signedIn, await bandRole(db, signedIn.id, setlist.bandId));
  setlistGate(access, need, 'setlist');
  return { setlist, access: access as 'read' | 'edit' };
}
