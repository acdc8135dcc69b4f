import { and, asc, eq, sql } from 'drizzle-orm';
import { Router } from 'express';
import {
  type Instrument,
  type InstrumentSettings,
  createInstrumentRequest,
  instrumentSettings,
  updateInstrumentRequest,
} from '../../shared/api/instruments';
import { parseRequest } from '../../shared/api/requests';
import type { ItemList } from '../../shared/api/wire';
import type { Database } from '../db/client';
import { instruments } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { valueOrThrow } from '../http/validation';
import { iso } from '../http/wire';
import { type InstrumentRow, authorizeInstrument, requireUser } from '../policy/policy';

/**
 * The most instruments one member keeps: more than anyone's rig, and a bound on one account's rows.
 */
export const mostInstruments = 100;

/** A stored instrument's settings, as the API and the exports read them. */
export function settingsOf(row: InstrumentRow): InstrumentSettings {
  return {
    name: row.name,
    receives: row.receives,
    deviceId: row.deviceId,
    program: row.program,
    bank: row.bank,
    bendRange: row.bendRange,
    memberChannels: [row.firstMemberChannel, row.lastMemberChannel],
    port: row.port,
  };
}

function columnsOf({ memberChannels: [first, last], ...settings }: InstrumentSettings) {
  return { ...settings, firstMemberChannel: first, lastMemberChannel: last };
}

/** An instrument as the API answers it. */
function instrumentAnswer(row: InstrumentRow): Instrument {
  return {
    id: row.id,
    ...settingsOf(row),
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
  };
}

/** A member's own instruments: only their owner ever reads or changes them. */
export function instrumentsRouter(db: Database): Router {
  const router = Router();

  router.get('/api/instruments', async (req, res) => {
    const user = requireUser(req.user);
    const rows = await db
      .select()
      .from(instruments)
      .where(eq(instruments.ownerId, user.id))
      .orderBy(asc(instruments.createdAt), asc(instruments.id));
    res.json({ items: rows.map(instrumentAnswer) } satisfies ItemList<Instrument>);
  });

  router.post('/api/instruments', async (req, res) => {
    const user = requireUser(req.user);
    const settings = valueOrThrow(parseRequest(createInstrumentRequest, req.body));
    const row = await db.transaction(async (tx) => {
      // One member's creations queue here, so that two at once cannot both pass the count.
      await tx.execute(sql`SELECT pg_advisory_xact_lock(hashtext(${`instruments:${user.id}`}))`);
      const [{ count }] = await tx
        .select({ count: sql<number>`count(*)`.mapWith(Number) })
        .from(instruments)
        .where(eq(instruments.ownerId, user.id));
      if (count >= mostInstruments) {
        throw new HttpError(
          409,
          'too_many',
          `You keep ${count} instruments, the most there can be: delete one first.`,
        );
      }
      const [created] = await tx
        .insert(instruments)
        .values({ ownerId: user.id, ...columnsOf(settings) })
        .returning();
      return created;
    });
    res.status(201).json(instrumentAnswer(row) satisfies Instrument);
  });

  router.patch('/api/instruments/:id', async (req, res) => {
    const stored = await authorizeInstrument(db, req.user, req.params['id']);
    const changes = valueOrThrow(parseRequest(updateInstrumentRequest, req.body));
    const given = Object.fromEntries(
      Object.entries(changes).filter(([, value]) => value !== undefined),
    );
    const settings = valueOrThrow(
      parseRequest(instrumentSettings, { ...settingsOf(stored), ...given }),
    );
    const [row] = await db
      .update(instruments)
      .set({ ...columnsOf(settings), updatedAt: new Date() })
      .where(and(eq(instruments.id, stored.id), eq(instruments.ownerId, stored.ownerId)))
      .returning();
    if (!row) throw notFound('instrument');
    res.json(instrumentAnswer(row) satisfies Instrument);
  });

  router.delete('/api/instruments/:id', async (req, res) => {
    const stored = await authorizeInstrument(db, req.user, req.params['id']);
    await db
      .delete(instruments)
      .where(and(eq(instruments.id, stored.id), eq(instruments.ownerId, stored.ownerId)));
    res.status(204).end();
  });

  return router;
}
