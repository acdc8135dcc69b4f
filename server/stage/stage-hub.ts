// One instance's ear on the stage: a dedicated PostgreSQL connection (not one of the pool's) that
// LISTENs for stage notices from every instance, reads the setlist's stage once per notice and
// hands it to this instance's followers of that setlist. The connection comes up with the first
// follower and comes back when it drops; after each (re)connection every followed setlist is read
// again, so that a notice missed in between costs nothing.
import pg from 'pg';
import type { Database } from '../db/client';
import { readStage, readStageNotice, type StageState, stageChannel } from './stage-events';

/** One open stream. `offer` sends what is newer than what it sent; `end` closes the stream. */
export interface StageFollower {
  offer(state: StageState): void;
  /** The newest event id this follower has (sent, or named in Last-Event-ID). */
  readonly lastId: number;
  end(): void;
}

export interface StageHub {
  /** Starts following a setlist; returns the function that stops. */
  follow(setlistId: string, follower: StageFollower): () => void;
  /** Ends every stream and closes the connection. */
  close(): Promise<void>;
}

export interface StageHubOptions {
  /** Wait before connecting again after the connection dropped or failed. */
  reconnectMs?: number;
  /** Tells of a dropped connection or a failed read; the hub carries on. */
  log?: (message: string) => void;
}

export function createStageHub(
  databaseUrl: string,
  db: Database,
  { reconnectMs = 1_000, log = (message) => console.error(message) }: StageHubOptions = {},
): StageHub {
  const followers = new Map<string, Set<StageFollower>>();
  /** Setlists being read now; `again` asks for one more read after the current one. */
  const reading = new Map<string, { again: boolean }>();
  let client: pg.Client | null = null;
  let connecting = false;
  let retry: NodeJS.Timeout | null = null;
  let closed = false;

  function listen(): void {
    if (closed || client || connecting || retry) return;
    connecting = true;
    const candidate = new pg.Client({
      connectionString: databaseUrl,
      connectionTimeoutMillis: 5_000,
      keepAlive: true,
      application_name: `keyloom-stage-${process.pid}`,
    });
    const dropped = (why: string) => {
      if (client !== candidate) return;
      client = null;
      log(`Stage listener lost its connection (${why}); connecting again`);
      candidate.end().catch(() => {});
      later();
    };
    candidate.on('error', (error) => dropped(error.message));
    candidate.on('end', () => dropped('closed by the server'));
    candidate.on('notification', ({ channel, payload }) => {
      const notice = channel === stageChannel ? readStageNotice(payload) : null;
      if (!notice) return;
      const those = followers.get(notice.setlistId);
      if (those && [...those].some((f) => f.lastId < notice.eventId))
        void refresh(notice.setlistId);
    });
    candidate
      .connect()
      .then(() => candidate.query(`LISTEN ${stageChannel}`))
      .then(
        () => {
          connecting = false;
          if (closed) {
            void candidate.end().catch(() => {});
            return;
          }
          client = candidate;
          for (const setlistId of followers.keys()) void refresh(setlistId);
        },
        (error: Error) => {
          connecting = false;
          log(`Stage listener could not connect (${error.message}); trying again`);
          candidate.end().catch(() => {});
          later();
        },
      );
  }

  function later(): void {
    if (closed || retry) return;
    retry = setTimeout(() => {
      retry = null;
      if (followers.size > 0) listen();
    }, reconnectMs);
    retry.unref();
  }

  /**
   * Reads the setlist's stage and offers it to its followers; notices that arrive meanwhile cause
   * one more read.
   */
  async function refresh(setlistId: string): Promise<void> {
    const running = reading.get(setlistId);
    if (running) {
      running.again = true;
      return;
    }
    const state = { again: true };
    reading.set(setlistId, state);
    try {
      while (state.again) {
        state.again = false;
        if (!followers.get(setlistId)?.size) break;
        const now = await readStage(db, setlistId);
        for (const follower of followers.get(setlistId) ?? []) {
          if (now) follower.offer(now);
          else follower.end();
        }
      }
    } catch (error) {
      // Followers that cannot be told the truth are cut off; they reconnect with Last-Event-ID and
      // catch up.
      log(`Stage read of setlist ${setlistId} failed: ${(error as Error).message}`);
      for (const follower of followers.get(setlistId) ?? []) follower.end();
    } finally {
      reading.delete(setlistId);
    }
  }

  return {
    follow(setlistId, follower) {
      if (closed) {
        follower.end();
        return () => {};
      }
      let those = followers.get(setlistId);
      if (!those) followers.set(setlistId, (those = new Set()));
      those.add(follower);
      listen();
      return () => {
        those.delete(follower);
        if (those.size === 0 && followers.get(setlistId) === those) followers.delete(setlistId);
      };
    },
    async close() {
      closed = true;
      if (retry) clearTimeout(retry);
      for (const those of followers.values()) for (const follower of those) follower.end();
      followers.clear();
      const open = client;
      client = null;
      await open?.end().catch(() => {});
    },
  };
}
