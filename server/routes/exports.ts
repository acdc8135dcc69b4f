import type { Response } from 'express';
import { Router } from 'express';
import { parsePresetDocument, type ResolvedPreset } from '../../shared/preset/preset-document';
import type { Database } from '../db/client';
import { streamBundle } from '../exports/bundle';
import { exportFileName } from '../../shared/export/export-file-name';
import { renderFile } from '../exports/render';
import type { SheetRevision } from '../exports/tuner-sheet';
import { documentOrThrow } from '../http/documents';
import { valueOrThrow } from '../http/validation';
import { readRevision } from '../library/revisions';
import { authorizePreset } from '../policy/policy';
import { resolveShareToken } from './shares';

/** Content-Disposition with a plain ASCII file name (made safe from the preset's name). */
function attachment(res: Response, fileName: string): void {
  res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/[^\w.-]/g, '_')}"`);
}

async function sendExport(res: Response, preset: ResolvedPreset, format: string, at: SheetRevision): Promise<void> {
  if (format === 'bundle') {
    res.type('application/zip');
    attachment(res, `${exportFileName(preset.name, '')}-bundle.zip`);
    await streamBundle(preset, at, res);
    return;
  }
  const file = await renderFile(preset, format, at);
  res.type(file.contentType);
  attachment(res, file.fileName);
  // Keys clamped into range and similar notes travel with the file, never silently.
  if (file.warnings.length > 0) res.setHeader('Keyloom-Warnings', encodeURIComponent(JSON.stringify(file.warnings.map((w) => w.message))));
  res.send(file.bytes);
}

/** Downloads of unsaved designs (anyone), saved presets (their readers) and shared presets (link holders). */
export function exportsRouter(db: Database): Router {
  const router = Router();

  router.post('/api/preview/export/:format', async (req, res) => {
    const preset = valueOrThrow(parsePresetDocument(req.body));
    await sendExport(res, preset, req.params['format'], { revision: null, savedAt: null });
  });

  async function savedRevision(presetId: string, user: Express.User | undefined, revisionQuery: unknown) {
    const { preset } = await authorizePreset(db, user, presetId, 'read');
    const wanted = revisionQuery === undefined ? preset.latestRevision : Number(revisionQuery);
    const revision = await readRevision(db, preset.id, wanted);
    return { revision, resolved: documentOrThrow(revision.document, 'document') };
  }

  router.get('/api/presets/:id/export/:format', async (req, res) => {
    const { revision, resolved } = await savedRevision(req.params['id'], req.user, req.query['revision']);
    await sendExport(res, resolved, req.params['format'], { revision: revision.revision, savedAt: revision.createdAt });
  });

  router.get('/api/presets/:id/bundle', async (req, res) => {
    const { revision, resolved } = await savedRevision(req.params['id'], req.user, req.query['revision']);
    await sendExport(res, resolved, 'bundle', { revision: revision.revision, savedAt: revision.createdAt });
  });

  router.get('/api/shared/:token/export/:format', async (req, res) => {
    const { revision } = await resolveShareToken(db, req.params['token']);
    await sendExport(res, documentOrThrow(revision.document, 'document'), req.params['format'], {
      revision: revision.revision, savedAt: revision.createdAt,
    });
  });

  router.get('/api/shared/:token/bundle', async (req, res) => {
    const { revision } = await resolveShareToken(db, req.params['token']);
    await sendExport(res, documentOrThrow(revision.document, 'document'), 'bundle', {
      revision: revision.revision, savedAt: revision.createdAt,
    });
  });

  return router;
}
