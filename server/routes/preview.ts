import { Router } from 'express';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { previewTable } from '../../shared/tuning/preview';
import { valueOrThrow } from '../http/validation';

/** What an unsaved design does, for anyone: no sign-in. */
export function previewRouter(): Router {
  return Router().post('/api/preview/table', (req, res) => {
    const preset = valueOrThrow(parsePresetDocument(req.body));
    res.json(previewTable(preset));
  });
}
