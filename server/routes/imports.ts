import { Router } from 'express';
import type { ImportedTuning, ImportKind } from '../../shared/api/songs';
import { presetFromIntervalList } from '../../shared/import/interval-list';
import { systemExclusive } from '../../shared/midi/midi-bytes';
import { parsePresetDocument, type PresetDocument } from '../../shared/preset/preset-document';
import type { Result } from '../../shared/result';
import type { Database } from '../db/client';
import { HttpError } from '../http/errors';
import { recordUpload, requireFile, singleUpload } from '../http/uploads';
import { valueOrThrow } from '../http/validation';
import { syxImportOffThread } from '../work/worker-pool';

/** A preset document or a list of intervals is a few kilobytes; a text file past this is refused unread. */
const largestTextBytes = 256 * 1024;

function nameFrom(fileName: string): string {
  return (
    fileName
      .replace(/\.[^.]*$/, '')
      .replace(/[_-]+/g, ' ')
      .trim()
      .slice(0, 80) || 'Imported tuning'
  );
}

/** Reads text only when it is UTF-8 without control bytes: a binary file posted as text is refused. */
function asText(bytes: Buffer): string {
  if (bytes.length > largestTextBytes) {
    const size = `${(bytes.length / 1024 / 1024).toFixed(1)} MB`;
    throw new HttpError(
      413,
      'too_large',
      `file: a preset or a list of intervals is at most ${largestTextBytes / 1024} kB; this file is ${size}.`,
      'file',
    );
  }
  const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  if (text.includes('\uFFFD') || /[\x00-\x08\x0e-\x1f]/.test(text)) {
    throw new HttpError(
      400,
      'unreadable',
      'file: is neither an .syx file of MTS messages, a preset .json, nor a text list of intervals.',
      'file',
    );
  }
  return text;
}

/** A preset document from an .syx of MTS messages, a preset .json, or a text list of intervals. */
export function importsRouter(db: Database): Router {
  const router = Router();
  router.post('/api/import', ...singleUpload('file'), async (req, res) => {
    const file = requireFile(req.file);
    await recordUpload(db, req.user?.id, 'import', file);
    const name = nameFrom(file.originalname);
    let document: Result<unknown>;
    let kind: ImportKind;
    if (file.buffer[0] === systemExclusive) {
      kind = 'syx';
      // Thousands of dumps take a while to decode: on a worker thread, so that nobody else waits.
      document = await syxImportOffThread({ bytes: new Uint8Array(file.buffer), name });
    } else {
      const text = asText(file.buffer).trim();
      if (text.startsWith('{')) {
        kind = 'preset';
        let json: unknown;
        try {
          json = JSON.parse(text);
        } catch (error) {
          throw new HttpError(
            400,
            'bad_json',
            `file: is not valid JSON (${(error as Error).message}).`,
            'file',
          );
        }
        document = parsePresetDocument(json);
      } else {
        kind = 'intervals';
        document = presetFromIntervalList(text, name);
      }
    }
    const value = valueOrThrow(document);
    // Whatever came in must stand as a preset of its own before it is handed back.
    const checked = valueOrThrow(parsePresetDocument(value));
    res.json({
      kind,
      document: (kind === 'preset' ? checked : value) as PresetDocument,
    } satisfies ImportedTuning);
  });
  return router;
}
