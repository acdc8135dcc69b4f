import type { Request, Response } from 'express';
import { Router } from 'express';
import { readInstrumentQuery } from '../../shared/api/instrument-query';
import { type InstrumentSettings, exportOfReceiveForm } from '../../shared/api/instruments';
import { presetForInstrument } from '../../shared/api/preset-for-instrument';
import { parsePresetDocument, type ResolvedPreset } from '../../shared/preset/preset-document';
import type { Database } from '../db/client';
import { streamBundle } from '../exports/bundle';
import { exportFileName } from '../../shared/export/export-file-name';
import { renderFile } from '../exports/render';
import type { SheetRevision } from '../exports/tuner-sheet';
import { documentOrThrow } from '../http/documents';
import { valueOrThrow } from '../http/validation';
import { readRevision } from '../library/revisions';
import { HttpError } from '../http/errors';
import { authorizeInstrument, authorizePreset } from '../policy/policy';
import { settingsOf } from './instruments';
import { resolveShareToken } from './shares';

/** Content-Disposition with a plain ASCII file name (made safe from the preset's name). */
function attachment(res: Response, fileName: string): void {
  res.setHeader(
    'Content-Disposition',
    `attachment; filename="${fileName.replace(/[^\w.-]/g, '_')}"`,
  );
}

/** The pseudo-format that picks the export of the instrument's own form (exportOfReceiveForm). */
const forInstrument = 'for-instrument';

async function sendExport(
  res: Response,
  preset: ResolvedPreset,
  format: string,
  at: SheetRevision,
  instrument: InstrumentSettings | null,
): Promise<void> {
  // The instrument's output settings stand in for the preset's; the preset itself is not touched.
  const played = instrument ? presetForInstrument(preset, instrument) : preset;
  if (format === forInstrument) {
    if (!instrument) {
      throw new HttpError(
        400,
        'instrument_required',
        "instrument: for-instrument needs ?instrument=ID or an instrument's settings (receives=...).",
        'instrument',
      );
    }
    format = exportOfReceiveForm[instrument.receives];
  }
  if (format === 'bundle') {
    res.type('application/zip');
    attachment(res, `${exportFileName(preset.name, '')}-bundle.zip`);
    await streamBundle(played, at, res);
    return;
  }
  const file = await renderFile(played, format, at);
  res.type(file.contentType);
  attachment(res, file.fileName);
  // Keys clamped into range and similar notes travel with the file, never silently.
  if (file.warnings.length > 0)
    res.setHeader(
      'Keyloom-Warnings',
      encodeURIComponent(JSON.stringify(file.warnings.map((w) => w.message))),
    );
  res.send(file.bytes);
}

/**
 * The instrument a download is for: the caller's own saved one (`?instrument=ID`, 404 when it is
 * not theirs), or one described by the query (a guest's); null for the preset's own output block.
 */
async function instrumentOf(db: Database, req: Request): Promise<InstrumentSettings | null> {
  const query = req.query as Record<string, unknown>;
  const described = readInstrumentQuery(query);
  const id = query['instrument'];
  if (id === undefined) return described ? valueOrThrow(described) : null;
  if (described) {
    throw new HttpError(
      400,
      'invalid',
      "instrument: give a saved instrument or an instrument's settings, not both.",
      'instrument',
    );
  }
  return settingsOf(await authorizeInstrument(db, req.user, typeof id === 'string' ? id : ''));
}

/**
 * Downloads of unsaved designs (anyone), saved presets (their readers) and shared presets (link
 * holders); each for the preset's own output block, or for an instrument (`?instrument=ID`, or its
 * settings in the query), and `for-instrument` as the format picks the instrument's own form.
 */
export function exportsRouter(db: Database): Router {
  const router = Router();

  router.post('/api/preview/export/:format', async (req, res) => {
    const preset = valueOrThrow(parsePresetDocument(req.body));
    const instrument = await instrumentOf(db, req);
    const at = { revision: null, savedAt: null };
    await sendExport(res, preset, req.params['format'], at, instrument);
  });

  async function savedRevision(
    presetId: string,
    user: Express.User | undefined,
    revisionQuery: unknown,
  ) {
    const { preset } = await authorizePreset(db, user, presetId, 'read');
    const wanted = revisionQuery === undefined ? preset.latestRevision : Number(revisionQuery);
    const revision = await readRevision(db, preset.id, wanted);
    return { revision, resolved: documentOrThrow(revision.document, 'document') };
  }

  router.get('/api/presets/:id/export/:format', async (req, res) => {
    const { revision, resolved } = await savedRevision(
      req.params['id'],
      req.user,
      req.query['revision'],
    );
    const at = { revision: revision.revision, savedAt: revision.createdAt };
    await sendExport(res, resolved, req.params['format'], at, await instrumentOf(db, req));
  });

  router.get('/api/presets/:id/bundle', async (req, res) => {
    const { revision, resolved } = await savedRevision(
      req.params['id'],
      req.user,
      req.query['revision'],
    );
    const at = { revision: revision.revision, savedAt: revision.createdAt };
    await sendExport(res, resolved, 'bundle', at, await instrumentOf(db, req));
  });

  router.get('/api/shared/:token/export/:format', async (req, res) => {
    const revision = await resolveShareToken(db, req.params['token']);
    const at = { revision: revision.revision, savedAt: revision.createdAt };
    const instrument = await instrumentOf(db, req);
    const shared = documentOrThrow(revision.document, 'document');
    await sendExport(res, shared, req.params['format'], at, instrument);
  });

  router.get('/api/shared/:token/bundle', async (req, res) => {
    const revision = await resolveShareToken(db, req.params['token']);
    const at = { revision: revision.revision, savedAt: revision.createdAt };
    const instrument = await instrumentOf(db, req);
    await sendExport(res, documentOrThrow(revision.document, 'document'), 'bundle', at, instrument);
  });

  return router;
}
