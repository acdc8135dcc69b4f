import { Router } from 'express';
import { parsePresetAndScale } from '../../shared/preset/preset-document';
import { type PreviewTable, previewTable } from '../../shared/tuning/preview';
import { AnswerCache } from '../http/answer-cache';
import { jsonBodies } from '../http/bodies';
import { valueOrThrow } from '../http/validation';

/** Enough for a few hundred 12-tone tables or a few dozen 72-tone ones. */
const tableCacheBytes = 8 * 1024 * 1024;

/**
 * What an unsaved design does, for anyone: no sign-in. It reads no session and changes nothing, so app.ts mounts it
 * before the session middleware (with the JSON body rules of every other route): a stranger's request costs no
 * session work and gets no cookie. Every document is checked in full, but the table depends only
 * on its scale and mapping, and most requests ask for one already drawn (the same presets opened by many people): the
 * answer is kept as the bytes sent, by the scale and mapping as checked, and drawn and serialised again only for a
 * scale and mapping not seen lately. Serialising was the largest cost of this route.
 */
export function previewRouter(): Router {
  const tables = new AnswerCache(tableCacheBytes);
  return Router().post('/api/preview/table', ...jsonBodies, (req, res) => {
    const { preset, scale } = valueOrThrow(parsePresetAndScale(req.body));
    const key = JSON.stringify([preset.scale, preset.mapping]);
    const answer = tables.answer(key, () => {
      const table: PreviewTable = previewTable(preset, scale);
      return Buffer.from(JSON.stringify(table));
    });
    // The bytes of res.json(table), with its Content-Type.
    res.setHeader('Content-Type', 'application/json; charset=utf-8');
    res.send(answer);
  });
}
