// Many players at once: each signs in, keeps a preset, and in a loop reads it, saves revisions and downloads
// exports. Every save the server acknowledged is remembered, so that it can be checked afterwards.
import { CookieJar } from './cookie-jar';
import { fifthsPreset } from '../../shared/preset/presets.testing';

export interface Acknowledged {
  presetId: string;
  revision: number;
  note: string;
  /** When the server's answer arrived (ms since the epoch). */
  at: number;
}

export interface LoadReport {
  requests: number;
  failures: string[];
  /** Failures while the server was known to be down (a fault test kills it on purpose). */
  failuresDuringOutage: number;
  acknowledged: Acknowledged[];
}

export interface LoadOptions {
  appUrl: () => string;
  clients: number;
  seconds: number;
  /**
   * When given, the run goes on after `seconds` until this holds, for at most two minutes more: a busy machine gets
   * the time it needs to show what a test waits for, and the test still checks the outcome itself.
   */
  until?: (report: LoadReport) => boolean;
  /** Logins are `${loginPrefix}-${n}`. */
  loginPrefix: string;
  /** While this says true, failed requests (and those started while it did) are counted apart and retried. */
  outage?: () => boolean;
  /** Told of each save the server acknowledged, as it happens. */
  onAcknowledged?: (ack: Acknowledged) => void;
}

const document = (name: string, up: number) => fifthsPreset(name, up, 1);

export async function runMixedLoad(options: LoadOptions): Promise<LoadReport> {
  const report: LoadReport = {
    requests: 0,
    failures: [],
    failuresDuringOutage: 0,
    acknowledged: [],
  };
  const deadline = Date.now() + options.seconds * 1000;
  const patience = deadline + 120_000;
  const running = () =>
    Date.now() < deadline ||
    (options.until !== undefined && !options.until(report) && Date.now() < patience);

  /** One request and the reading of its answer; a failure is counted (or set apart during an outage), never thrown. */
  async function attempt<T>(
    jar: CookieJar,
    path: string,
    read: (res: Response) => Promise<T>,
    init?: RequestInit & { json?: unknown },
  ): Promise<T | null> {
    report.requests++;
    // A request sent to a server that is down fails when it fails, perhaps after the server is back.
    const sentDuringOutage = options.outage?.() ?? false;
    const body = init?.json === undefined ? init?.body : JSON.stringify(init.json);
    const headers =
      init?.json === undefined ? init?.headers : { 'content-type': 'application/json' };
    const what = `${init?.method ?? 'GET'} ${path}`;
    try {
      const res = await jar.fetch(`${options.appUrl()}${path}`, { ...init, body, headers });
      if (res.status >= 200 && res.status < 400) return await read(res);
      const text = await res.text();
      if (sentDuringOutage || options.outage?.() || res.status === 503)
        report.failuresDuringOutage++;
      else report.failures.push(`${what}: ${res.status} ${text.slice(0, 120)}`);
    } catch (error) {
      if (sentDuringOutage || options.outage?.()) report.failuresDuringOutage++;
      else report.failures.push(`${what}: ${(error as Error).message}`);
    }
    await new Promise((r) => setTimeout(r, 100));
    return null;
  }

  async function client(n: number): Promise<void> {
    const jar = new CookieJar();
    while (running()) {
      try {
        await jar.signIn(options.appUrl(), `${options.loginPrefix}-${n}`);
        break;
      } catch {
        await new Promise((r) => setTimeout(r, 200));
      }
    }
    let presetId: string | null = null;
    for (let i = 0; running(); i++) {
      if (!presetId) {
        presetId = await attempt(
          jar,
          '/api/presets',
          async (res) => (await res.json()).id as string,
          {
            method: 'POST',
            json: { document: document(`Load ${n}`, 5), note: 'start' },
          },
        );
        continue;
      }
      switch (i % 4) {
        case 0:
          await attempt(jar, `/api/presets/${presetId}`, (res) => res.json());
          break;
        case 1: {
          const note = `client ${n} save ${i}`;
          const revision = await attempt(
            jar,
            `/api/presets/${presetId}/revisions`,
            async (res) => (await res.json()).revision as number,
            {
              method: 'POST',
              json: { document: document(`Load ${n}`, 1 + (i % 11)), note },
            },
          );
          if (revision !== null) {
            const ack = { presetId, revision, note, at: Date.now() };
            report.acknowledged.push(ack);
            options.onAcknowledged?.(ack);
          }
          break;
        }
        case 2:
          await attempt(jar, `/api/presets/${presetId}/export/mts-bulk`, (res) =>
            res.arrayBuffer(),
          );
          break;
        default:
          await attempt(jar, '/api/preview/table', (res) => res.json(), {
            method: 'POST',
            json: document('Preview', 1 + (i % 11)),
          });
      }
    }
  }

  await Promise.all(Array.from({ length: options.clients }, (_, n) => client(n)));
  return report;
}

/** Reads back every acknowledged save; returns the ones that are missing or differ. */
export async function missingSaves(
  appUrl: string,
  loginPrefix: string,
  acknowledged: Acknowledged[],
): Promise<string[]> {
  const byPreset = new Map<string, Acknowledged[]>();
  for (const ack of acknowledged)
    byPreset.set(ack.presetId, [...(byPreset.get(ack.presetId) ?? []), ack]);
  const missing: string[] = [];
  // Presets are personal: read each back through its owner's own session.
  const owners = new Map<string, CookieJar>();
  for (const [presetId, acks] of byPreset) {
    const owner = acks[0].note.match(/^client (\d+)/)![1];
    let ownerJar = owners.get(owner);
    if (!ownerJar) {
      ownerJar = new CookieJar();
      await ownerJar.signIn(appUrl, `${loginPrefix}-${owner}`);
      owners.set(owner, ownerJar);
    }
    const history = await (
      await ownerJar.fetch(`${appUrl}/api/presets/${presetId}/revisions`)
    ).json();
    const notes = new Map<number, string>(
      history.items.map((r: { revision: number; note: string }) => [r.revision, r.note]),
    );
    for (const ack of acks)
      if (notes.get(ack.revision) !== ack.note)
        missing.push(`${presetId} revision ${ack.revision}`);
  }
  return missing;
}
