import { sql } from 'drizzle-orm';
import { Router } from 'express';
import type { Database } from '../db/client';

export function healthRouter(db: Database): Router {
  return Router().get('/api/health', async (_req, res) => {
    try {
      await db.execute(sql`select 1`);
      res.json({ ok: true, db: true });
    } catch {
      res.status(503).json({
        ok: false,
        db: false,
        error: {
          code: 'database_unavailable',
          message: 'The server is up but its database is not answering.',
        },
      });
    }
  });
}
