// A band's setlists and the stage's live position: viewers read and follow, editors change and
// move.
import { and, asc, count, eq, inArray } from 'drizzle-orm';
import { type Response, Router } from 'express';
import { parseRequest } from '../../shared/api/requests';
import {
  type Setlist,
  type SetlistBody,
  type SetlistEntry,
  positionRequest,
  setlistRequest,
} from '../../shared/api/setlists';
import type { ItemList } from '../../shared/api/wire';
import { type FieldError, fieldError } from '../../shared/result';
import type { Database } from '../db/client';
import { presets, setlistEntries, setlists } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { ValidationError, valueOrThrow } from '../http/validation';
import { iso } from '../http/wire';
import { recordAudit, type Writer } from '../library/audit';
import { authorizeBandSetlists, authorizeSetlist, type SetlistRow } from '../policy/policy';
import {
  announceSetlistGone,
  readStage,
  recordStageEvent,
  type StageState,
} from '../stage/stage-events';
import type { StageFollower, StageHub } from '../stage/stage-hub';

/** A comment line this often keeps proxies from closing a quiet stream. */
const keepAliveMs = 20_000;
/** How long a browser waits before reconnecting a dropped stream. */
const retryMs = 3_000;

/**
 * Every entry's preset must be in the band's library (and not in the trash); a pinned revision must
 * exist.
 */
async function checkEntries(
  writer: Writer,
  bandId: string,
  entries: SetlistBody['entries'],
): Promise<void> {
  const ids = [...new Set(entries.map((entry) => entry.presetId))];
  const rows = ids.length
    ? await writer
        .select({
          id: presets.id,
          bandId: presets.bandId,
          latest: presets.latestRevision,
          deletedAt: presets.deletedAt,
        })
        .from(presets)
        .where(inArray(presets.id, ids))
    : [];
  const found = new Map(rows.map((row) => [row.id, row]));
  const faults: FieldError[] = [];
  entries.forEach((entry, index) => {
    const preset = found.get(entry.presetId);
    if (!preset || preset.bandId !== bandId || preset.deletedAt) {
      faults.push(
        fieldError(`entries[${index}].presetId`, "is not a preset in this band's library"),
      );
    } else if (entry.revision !== null && entry.revision > preset.latest) {
      faults.push(
        fieldError(
          `entries[${index}].revision`,
          `is ${entry.revision}, but the preset has revisions 1 to ${preset.latest}`,
        ),
      );
    }
  });
  if (faults.length) throw new ValidationError(faults);
}

async function writeEntries(writer: Writer, setlistId: string, entries: SetlistBody['entries']) {
  if (!entries.length) return;
  await writer.insert(setlistEntries).values(
    entries.map((entry, place) => ({
      setlistId,
      place,
      presetId: entry.presetId,
      revision: entry.revision,
      trigger: entry.trigger,
    })),
  );
}

/**
 * The setlists as the API gives them, entries in order with their presets' names and latest
 * revisions.
 */
async function answer(
  db: Writer,
  rows: SetlistRow[],
  access: Setlist['access'],
): Promise<Setlist[]> {
  const ids = rows.map((row) => row.id);
  const entries = ids.length
    ? await db
        .select({
          setlistId: setlistEntries.setlistId,
          presetId: setlistEntries.presetId,
          revision: setlistEntries.revision,
          trigger: setlistEntries.trigger,
          presetName: presets.name,
          latestRevision: presets.latestRevision,
        })
        .from(setlistEntries)
        .innerJoin(presets, eq(presets.id, setlistEntries.presetId))
        .where(inArray(setlistEntries.setlistId, ids))
        .orderBy(asc(setlistEntries.setlistId), asc(setlistEntries.place))
    : [];
  const bySetlist = new Map<string, SetlistEntry[]>(ids.map((id) => [id, []]));
  for (const { setlistId, ...entry } of entries) bySetlist.get(setlistId)!.push(entry);
  return rows.map((row) => ({
    id: row.id,
    bandId: row.bandId,
    name: row.name,
    entries: bySetlist.get(row.id)!,
    position: row.position,
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
    access,
  }));
}

/** The setlist's row, locked until the transaction ends; 404 when it was deleted meanwhile. */
async function lockSetlist(writer: Writer, id: string): Promise<SetlistRow> {
  const [row] = await writer.select().from(setlists).where(eq(setlists.id, id)).for('update');
  if (!row) throw notFound('setlist');
  return row;
}

/** One event in the text/event-stream format (WHATWG HTML, "Server-sent events"). */
function positionEvent({ eventId, stage }: StageState): string {
  return `event: position\nid: ${eventId}\ndata: ${JSON.stringify(stage)}\n\n`;
}

/**
 * The Last-Event-ID a reconnecting browser sends; -1 (everything is news) when absent or not a
 * number.
 */
function lastEventId(header: string | undefined): number {
  return header && /^\d{1,15}$/.test(header.trim()) ? Number(header.trim()) : -1;
}

export function setlistsRouter(db: Database, stage: StageHub): Router {
  const router = Router();

  router.post('/api/bands/:id/setlists', async (req, res) => {
    const { band } = await authorizeBandSetlists(db, req.user, req.params['id'], 'edit');
    const user = req.user!;
    const body = valueOrThrow(parseRequest(setlistRequest, req.body));
    const created = await db.transaction(async (tx) => {
      await checkEntries(tx, band.id, body.entries);
      const [row] = await tx
        .insert(setlists)
        .values({ bandId: band.id, name: body.name, createdBy: user.id })
        .returning();
      await writeEntries(tx, row.id, body.entries);
      await recordAudit(tx, {
        actorId: user.id,
        action: 'setlist.create',
        bandId: band.id,
        detail: { setlistId: row.id, name: body.name, entries: body.entries.length },
      });
      return row;
    });
    const [setlist] = await answer(db, [created], 'edit');
    res.status(201).json(setlist satisfies Setlist);
  });

  router.get('/api/bands/:id/setlists', async (req, res) => {
    const { band, access } = await authorizeBandSetlists(db, req.user, req.params['id'], 'read');
    const rows = await db
      .select()
      .from(setlists)
      .where(eq(setlists.bandId, band.id))
      .orderBy(asc(setlists.name), asc(setlists.id));
    res.json({ items: await answer(db, rows, access) } satisfies ItemList<Setlist>);
  });

  router.get('/api/setlists/:id', async (req, res) => {
    const { setlist, access } = await authorizeSetlist(db, req.user, req.params['id'], 'read');
    const [answered] = await answer(db, [setlist], access);
    res.json(answered satisfies Setlist);
  });

  router.put('/api/setlists/:id', async (req, res) => {
    const { setlist } = await authorizeSetlist(db, req.user, req.params['id'], 'edit');
    const user = req.user!;
    const body = valueOrThrow(parseRequest(setlistRequest, req.body));
    const changed = await db.transaction(async (tx) => {
      const before = await lockSetlist(tx, setlist.id);
      await checkEntries(tx, before.bandId, body.entries);
      const [old] = await tx
        .select()
        .from(setlistEntries)
        .where(
          and(eq(setlistEntries.setlistId, before.id), eq(setlistEntries.place, before.position)),
        );
      await tx.delete(setlistEntries).where(eq(setlistEntries.setlistId, before.id));
      await writeEntries(tx, before.id, body.entries);
      const position = Math.min(before.position, Math.max(body.entries.length - 1, 0));
      const [row] = await tx
        .update(setlists)
        .set({ name: body.name, position, updatedAt: new Date() })
        .where(eq(setlists.id, before.id))
        .returning();
      // Followers hear the change when the entry under the position is no longer what it was.
      const now = body.entries[position];
      const same =
        position === before.position &&
        old?.presetId === now?.presetId &&
        (old?.revision ?? null) === (now?.revision ?? null);
      if (!same) await recordStageEvent(tx, row.id, position);
      await recordAudit(tx, {
        actorId: user.id,
        action: 'setlist.change',
        bandId: row.bandId,
        detail: { setlistId: row.id, name: body.name, entries: body.entries.length },
      });
      return row;
    });
    const [answered] = await answer(db, [changed], 'edit');
    res.json(answered satisfies Setlist);
  });

  router.delete('/api/setlists/:id', async (req, res) => {
    const { setlist } = await authorizeSetlist(db, req.user, req.params['id'], 'edit');
    await db.transaction(async (tx) => {
      const row = await lockSetlist(tx, setlist.id);
      await tx.delete(setlists).where(eq(setlists.id, row.id));
      await recordAudit(tx, {
        actorId: req.user!.id,
        action: 'setlist.delete',
        bandId: row.bandId,
        detail: { setlistId: row.id, name: row.name },
      });
      // Followers of a deleted setlist are told, and their streams end.
      await announceSetlistGone(tx, row.id);
    });
    res.status(204).end();
  });

  router.post('/api/setlists/:id/position', async (req, res) => {
    const { setlist } = await authorizeSetlist(db, req.user, req.params['id'], 'edit');
    const { position } = valueOrThrow(parseRequest(positionRequest, req.body));
    const moved = await db.transaction(async (tx) => {
      await lockSetlist(tx, setlist.id);
      const [{ n }] = await tx
        .select({ n: count() })
        .from(setlistEntries)
        .where(eq(setlistEntries.setlistId, setlist.id));
      if (position >= n) {
        const fault = n === 0 ? 'the setlist has no entries' : `the last entry is ${n - 1}`;
        throw new ValidationError([
          fieldError('position', `is ${position}, beyond the list: ${fault}`),
        ]);
      }
      const [row] = await tx
        .update(setlists)
        .set({ position })
        .where(eq(setlists.id, setlist.id))
        .returning();
      await recordStageEvent(tx, row.id, position);
      return row;
    });
    const [answered] = await answer(db, [moved], 'edit');
    res.json(answered satisfies Setlist);
  });

  router.get('/api/setlists/:id/live', async (req, res) => {
    const { setlist } = await authorizeSetlist(db, req.user, req.params['id'], 'read');
    res.status(200).set({
      'Content-Type': 'text/event-stream; charset=utf-8',
      'Cache-Control': 'no-cache, no-transform',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    res.write(`retry: ${retryMs}\n\n`);
    const follower = streamFollower(res, lastEventId(req.get('Last-Event-ID')));
    const unfollow = stage.follow(setlist.id, follower);
    const keepAlive = setInterval(() => res.write(': keep-alive\n\n'), keepAliveMs);
    res.on('close', () => {
      clearInterval(keepAlive);
      unfollow();
    });
    try {
      const now = await readStage(db, setlist.id);
      if (now) follower.offer(now);
      else follower.end();
    } catch (error) {
      console.error(`Stage stream of setlist ${setlist.id}: ${(error as Error).message}`);
      follower.end();
    }
  });

  return router;
}

/** A follower writing to one response: only what is newer than what it last sent. */
function streamFollower(res: Response, lastId: number): StageFollower {
  return {
    get lastId() {
      return lastId;
    },
    offer(state) {
      if (state.eventId <= lastId || res.writableEnded || res.destroyed) return;
      lastId = state.eventId;
      if (state.stage) res.write(positionEvent(state));
    },
    end() {
      if (!res.writableEnded) res.end();
    },
  };
}
